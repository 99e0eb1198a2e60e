import type { Role } from "@/db/enums";

declare module "next-auth" {
  interface User {
    id: string;
    role: Role;
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; email: string; name: string; role: Role };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: number;
    role?: Role;
    sv?: number;
  }
}
