"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: "/sign-in" })} className="rounded-md border border-paper/30 px-3 py-1.5 text-sm text-paper hover:bg-graphite-deep">
      Sign out
    </button>
  );
}
