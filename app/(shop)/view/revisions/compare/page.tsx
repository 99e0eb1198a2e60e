import Link from "next/link";
import { RevisionBadge } from "@/components/library/StageBadge";
import { buttonClass } from "@/components/ui/Button";
import { EmptyState, PageHeader } from "@/components/ui/Card";
import { ViewerCaution } from "@/components/viewer/ViewerCaution";
import { db } from "@/db/client";
import { getRevision } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../../../_server/session";
import { RevisionCharts } from "./RevisionCharts";

export const metadata = { title: "Revisions compared" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function CompareRevisionsPage({ searchParams }: { searchParams: Search }) {
  const sp = await searchParams;
  await requirePageRole(EVERYONE, "/view/revisions/compare");
  const ids = [Number(sp.a), Number(sp.b)];
  const [a, b] = ids.map((id) => (Number.isInteger(id) && id > 0 ? getRevision(db(), id) : undefined));
  return (
    <>
      <PageHeader
        title={a && b ? `${a.program.name} ${a.revision.letter} against ${b.program.name === a.program.name ? "" : `${b.program.name} `}${b.revision.letter}` : "Revisions compared"}
        subtitle="Charts of two revisions side by side: B against A."
        actions={
          <Link href="/view" className={buttonClass("quiet")}>
            All 3D views
          </Link>
        }
      />
      {a && b ? (
        <div className="flex flex-col gap-4">
          <div className="flex flex-wrap gap-4 text-sm">
            {[a, b].map((r, i) => (
              <span key={i} className="flex items-center gap-2">
                <strong>{i === 0 ? "A" : "B"}:</strong> {r.program.name} revision {r.revision.letter} <RevisionBadge state={r.revision.state} />
                <Link href={`/view/revisions/${r.revision.id}`} className="text-copper-deep underline">
                  toolpath in 3D
                </Link>
              </span>
            ))}
          </div>
          <RevisionCharts a={a.revision.id} b={b.revision.id} />
          <ViewerCaution />
        </div>
      ) : (
        <EmptyState title="Pick two revisions to compare.">
          Choose them on the <Link href="/view" className="text-copper-deep underline">3D views</Link> page.
        </EmptyState>
      )}
    </>
  );
}
