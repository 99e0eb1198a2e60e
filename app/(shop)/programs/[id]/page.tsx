import Link from "next/link";
import { notFound } from "next/navigation";
import { Details } from "@/components/library/Details";
import { RevisionBadge } from "@/components/library/StageBadge";
import { RevisionsTable } from "@/components/programs/ProgramTables";
import { buttonClass } from "@/components/ui/Button";
import { Card, PageHeader } from "@/components/ui/Card";
import { inputClass } from "@/components/ui/Field";
import { db } from "@/db/client";
import { getProgram } from "@/db/queries/programs";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { PROGRAM_EDITORS } from "@/lib/programs/programs";
import { REVISION_EDITORS } from "@/lib/programs/revisions";
import { requirePageRole } from "../../../_server/session";

export default async function ProgramPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/programs/${id}`);
  const data = getProgram(db(), Number(id));
  if (!data) notFound();
  const { program, headType, revisions } = data;
  const released = revisions.find((r) => r.state === "released");
  const letters = new Map(revisions.map((r) => [r.id, r.letter]));
  return (
    <>
      <PageHeader
        title={program.name}
        subtitle={`${program.port === "intake" ? "Intake" : "Exhaust"} program for casting ${headType.castingNumber}`}
        actions={
          <>
            {hasRole(actor, PROGRAM_EDITORS) && <Link href={`/programs/${program.id}/edit`} className={buttonClass("secondary")}>Edit</Link>}
            {hasRole(actor, REVISION_EDITORS) && <Link href={`/programs/${program.id}/revisions/new`} className={buttonClass("primary")}>New revision</Link>}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <Card title="Program">
          <Details
            columns={4}
            items={[
              ["Casting", <Link key="c" href={`/head-types/${headType.id}`} className="font-mono text-copper-deep hover:underline">{headType.castingNumber}</Link>],
              ["Port", program.port === "intake" ? "Intake" : "Exhaust"],
              ["Released revision", released ? <Link key="r" href={`/programs/${program.id}/revisions/${released.id}`} className="font-mono font-bold text-copper-deep hover:underline">{released.letter}</Link> : "none"],
              ["Revisions", revisions.length],
            ]}
          />
          {program.notes && <p className="mt-3 whitespace-pre-wrap text-sm">{program.notes}</p>}
        </Card>
        <Card title="Revision history">
          <ol className="flex flex-wrap items-center gap-2 text-sm" aria-label="Lineage">
            {revisions.map((r) => (
              <li key={r.id} className="flex items-center gap-2 rounded border border-rule bg-paper px-2 py-1">
                <Link href={`/programs/${program.id}/revisions/${r.id}`} className="font-mono font-bold text-copper-deep hover:underline">{r.letter}</Link>
                <RevisionBadge state={r.state} />
                {r.parentId && <span className="text-xs text-ink-faint">from {letters.get(r.parentId) ?? "?"}</span>}
              </li>
            ))}
          </ol>
        </Card>
        {revisions.length >= 2 && (
          <Card title="Compare two revisions">
            <form action={`/programs/${program.id}/compare`} className="flex flex-wrap items-end gap-3 text-sm">
              <label className="flex flex-col gap-1 font-semibold">
                From (A)
                <select name="a" className={inputClass()} defaultValue={revisions.at(-2)!.id}>
                  {revisions.map((r) => <option key={r.id} value={r.id}>{r.letter}</option>)}
                </select>
              </label>
              <label className="flex flex-col gap-1 font-semibold">
                To (B)
                <select name="b" className={inputClass()} defaultValue={revisions.at(-1)!.id}>
                  {revisions.map((r) => <option key={r.id} value={r.id}>{r.letter}</option>)}
                </select>
              </label>
              <button type="submit" className={buttonClass("secondary")}>Compare</button>
            </form>
          </Card>
        )}
        <RevisionsTable programId={program.id} />
      </div>
    </>
  );
}
