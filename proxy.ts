/**
 * Redirects visitors without a session to the sign-in page. This is convenience only: every
 * page, action and route handler checks the role again on the server.
 */
import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";

const PUBLIC = [/^\/sign-in/, /^\/forgot-password/, /^\/reset-password\//, /^\/invite\//, /^\/api\//, /^\/_next\//, /^\/favicon\.ico$/, /^\/fonts\//];

export async function proxy(req: NextRequest) {
  const { pathname, search } = req.nextUrl;
  if (PUBLIC.some((p) => p.test(pathname))) return NextResponse.next();
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const url = req.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = `?callbackUrl=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

export const config = { matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"] };
