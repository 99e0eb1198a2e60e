import Link from "next/link";
import { notFound } from "next/navigation";
import { JobStateBadge, RevisionStateBadge, ShortHash } from "@/components/jobs/badges";
import { CutsTable } from "@/components/jobs/CutsTable";
import { LineageChain } from "@/components/trace/Lineage";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { jobsOfRevision, revisionLineage, revisionTraceHeader } from "@/db/queries/trace";
import type { JobState } from "@/db/enums";
import { EVERYONE } from "@/lib/auth/roles";
import { PORT_LABEL } from "@/lib/jobs/words";
import { recallSummary } from "@/lib/trace/revision";
import { requirePageRole } from "../../../../_server/session";

export const metadata = { title: "Trace a revision" };

export default async function TraceRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(EVERYONE, `/trace/revision/${id}`);
  const rid = Number(id);
  const revision = Number.isInteger(rid) ? revisionTraceHeader(db(), rid) : null;
  if (!revision) notFound();
  const lineage = revisionLineage(db(), rid)!;
  const jobs = jobsOfRevision(db(), rid);
  const summary = recallSummary(db(), rid);
  return (
    <>
      <PageHeader
        title={`Trace: ${revision.label}`}
        subtitle={`Casting ${revision.castingNumber} · ${PORT_LABEL[revision.port]} · released ${formatDateTime(revision.releasedAt)}${revision.releasedByName ? ` by ${revision.releasedByName}` : ""}`}
        actions={
          <a href={`/api/trace/revisions/${rid}/recall`} download className={buttonClass("primary")} data-testid="recall-csv">
            Download the recall list (CSV)
          </a>
        }
      />
      <div className="mb-4 flex flex-wrap items-center gap-3 text-sm">
        <RevisionStateBadge state={revision.state} />
        {revision.endReason && revision.state !== "released" && <span className="text-bad">{revision.endReason}</span>}
        <span className="text-ink-soft">Toolpath SHA-256</span> <ShortHash value={revision.toolpath?.sha256} />
        {revision.parentLabel && <span className="text-ink-soft">Parent: {revision.parentLabel}</span>}
      </div>
      <div className="mb-6 grid gap-4 sm:grid-cols-2 xl:grid-cols-5" data-testid="recall-summary">
        {[
          ["Cuts", summary.cuts],
          ["Heads", summary.heads],
          ["Jobs", summary.jobs],
          ["Customers", summary.customers],
          ["Scrapped", summary.byOutcome.scrap],
        ].map(([label, n]) => (
          <Card key={label as string} title={label as string}>
            <p className="font-mono text-3xl font-bold" data-testid={`recall-${String(label).toLowerCase()}`}>
              {n}
            </p>
          </Card>
        ))}
      </div>
      <Card title="Where it came from" className="mb-6">
        <LineageChain lineage={lineage} />
      </Card>
      <Card title="Jobs that chose it or cut with it" className="mb-6">
        {jobs.length === 0 ? (
          <EmptyState title="No job has used this revision." />
        ) : (
          <table className="w-full text-sm">
            <thead className="text-left text-ink-soft">
              <tr>
                <th className="py-1 pr-3 font-semibold">Job</th>
                <th className="py-1 pr-3 font-semibold">State</th>
                <th className="py-1 pr-3 font-semibold">Customer</th>
                <th className="py-1 pr-3 font-semibold">Chosen for</th>
                <th className="py-1 pr-3 text-right font-semibold">Heads</th>
                <th className="py-1 text-right font-semibold">Cuts with it</th>
              </tr>
            </thead>
            <tbody>
              {jobs.map((j) => (
                <tr key={j.id} className="border-t border-rule/60">
                  <td className="py-1 pr-3">
                    <Link href={`/jobs/${j.id}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                      {j.number}
                    </Link>
                  </td>
                  <td className="py-1 pr-3">
                    <JobStateBadge state={j.state as JobState} />
                  </td>
                  <td className="py-1 pr-3">{j.customerName}</td>
                  <td className="py-1 pr-3">{j.ports || "no longer chosen"}</td>
                  <td className="py-1 pr-3 text-right font-mono">{j.heads}</td>
                  <td className="py-1 text-right font-mono">{j.cutsWithRevision}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
      <section aria-labelledby="revision-cuts">
        <h2 id="revision-cuts" className="mb-2 text-sm font-bold uppercase tracking-wider text-ink-soft">
          Every head cut with it
        </h2>
        <CutsTable revisionId={rid} />
      </section>
    </>
  );
}
