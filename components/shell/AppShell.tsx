import Link from "next/link";
import type { Actor } from "@/lib/auth/guard";
import { ROLE_LABEL } from "@/lib/auth/roles";
import { CollapsibleNav } from "./CollapsibleNav";
import { navFor } from "./nav";
import { NavLinks } from "./NavLinks";
import { SignOutButton } from "./SignOutButton";

export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-bold tracking-tight ${className}`}>
      {/* A compass rose cut to four points: the chart-maker's mark, in our copper. */}
      <svg aria-hidden viewBox="0 0 24 24" className="h-6 w-6">
        <circle cx="12" cy="12" r="10.5" fill="none" stroke="currentColor" strokeOpacity=".35" />
        <path d="M12 1.5 14 10 22.5 12 14 14 12 22.5 10 14 1.5 12 10 10Z" fill="#b0592d" />
        <circle cx="12" cy="12" r="1.6" fill="currentColor" />
      </svg>
      Portolan
    </span>
  );
}

export function AppShell({ actor, children }: { actor: Actor; children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col lg:flex-row">
      <aside className="no-print bg-graphite text-paper lg:sticky lg:top-0 lg:h-screen lg:w-60 lg:shrink-0 lg:overflow-y-auto">
        <div className="flex items-center justify-between gap-2 px-4 py-4">
          <Link href="/" className="text-lg text-white">
            <Wordmark />
          </Link>
        </div>
        <CollapsibleNav>
          <NavLinks groups={navFor(actor.role)} />
        </CollapsibleNav>
        <div className="border-t border-paper/15 px-4 py-3 text-sm">
          <p className="font-semibold text-white" data-testid="signed-in-name">
            {actor.name}
          </p>
          <p className="text-paper/60" data-testid="signed-in-role">
            {ROLE_LABEL[actor.role]}
          </p>
          <div className="mt-2">
            <SignOutButton />
          </div>
        </div>
      </aside>
      <main className="min-w-0 flex-1 px-4 py-6 sm:px-8">{children}</main>
    </div>
  );
}
