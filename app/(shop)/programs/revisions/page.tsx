import { RevisionsTable } from "@/components/programs/ProgramTables";
import { PageHeader } from "@/components/ui/Card";
import { EVERYONE } from "@/lib/auth/roles";
import { REVISION_STATES } from "@/db/enums";
import { REVISION_STATE_LABEL } from "@/lib/programs/states";
import Link from "next/link";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Revisions" };

export default async function RevisionsPage({ searchParams }: { searchParams: Promise<{ state?: string }> }) {
  await requirePageRole(EVERYONE, "/programs/revisions");
  const { state } = await searchParams;
  const current = REVISION_STATES.find((s) => s === state);
  return (
    <>
      <PageHeader title="Revisions" subtitle="Every revision of every program." />
      <nav className="mb-3 flex flex-wrap gap-2 text-sm" aria-label="Filter by state">
        <Link href="/programs/revisions" className={!current ? "font-bold text-copper-deep underline" : "text-ink-soft hover:underline"}>All</Link>
        {REVISION_STATES.map((s) => (
          <Link key={s} href={`/programs/revisions?state=${s}`} className={current === s ? "font-bold text-copper-deep underline" : "text-ink-soft hover:underline"}>
            {REVISION_STATE_LABEL[s]}
          </Link>
        ))}
      </nav>
      <RevisionsTable state={current} />
    </>
  );
}
