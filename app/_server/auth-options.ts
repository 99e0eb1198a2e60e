import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { db } from "@/db/client";
import { verifyCredentials } from "@/lib/auth/credentials";
import { isAppError } from "@/lib/errors";

function clientAddress(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = typeof forwarded === "string" ? forwarded.split(",")[0]?.trim() : undefined;
  return first || "unknown";
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { type: "email" }, password: { type: "password" } },
      async authorize(credentials, req) {
        try {
          const user = await verifyCredentials(db(), {
            email: String(credentials?.email ?? ""),
            password: String(credentials?.password ?? ""),
            ip: clientAddress(req?.headers as Record<string, unknown> | undefined),
          });
          return { id: String(user.id), email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
        } catch (err) {
          // The message becomes the `error` the sign-in form shows.
          if (isAppError(err)) throw new Error(err.message);
          throw err;
        }
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = user.role;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      if (token.uid != null && token.role) {
        session.user = { id: String(token.uid), email: token.email ?? "", name: token.name ?? "", role: token.role };
      }
      return session;
    },
  },
};
