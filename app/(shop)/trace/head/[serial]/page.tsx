import Link from "next/link";
import { notFound } from "next/navigation";
import { HeadStateBadge, JobStateBadge, OutcomeBadge, ShortHash } from "@/components/jobs/badges";
import { FlowList } from "@/components/trace/FlowList";
import { LineageChain } from "@/components/trace/Lineage";
import { Badge } from "@/components/ui/Badge";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { HEAD_SOURCE_LABEL, PORT_LABEL } from "@/lib/jobs/words";
import { traceHead } from "@/lib/trace/lineage";
import { requirePageRole } from "../../../../_server/session";

export const metadata = { title: "Trace a head" };

export default async function TraceHeadPage({ params }: { params: Promise<{ serial: string }> }) {
  const { serial: raw } = await params;
  const serial = decodeURIComponent(raw);
  await requirePageRole(EVERYONE, `/trace/head/${raw}`);
  const l = traceHead(db(), serial);
  if (!l) notFound();
  return (
    <>
      <PageHeader
        title={`Trace: head ${l.head.serial}`}
        subtitle={`Casting ${l.head.castingNumber} · ${HEAD_SOURCE_LABEL[l.head.source]}`}
        actions={<HeadStateBadge state={l.head.state} />}
      />
      <Card title="Master → scan → revision → file, for each revision that cut it">
        {l.revisions.length === 0 ? (
          <p className="text-sm text-ink-faint">No revision has cut this head yet.</p>
        ) : (
          <div className="flex flex-col gap-3">
            {l.revisions.map((r) => (
              <LineageChain key={r.revision.id} lineage={r} />
            ))}
          </div>
        )}
      </Card>
      <div className="mt-4 grid gap-4 lg:grid-cols-3">
        <Card title="Flow tests of this head">
          <FlowList tests={l.flow.head} empty="No flow test on this head." />
        </Card>
        <Card title="Flow tests of the revisions">
          <FlowList tests={l.flow.revisions} empty="No flow test linked to these revisions." />
        </Card>
        <Card title="Flow tests of the master">
          <FlowList tests={l.flow.masters} empty="No flow test of the master." />
        </Card>
      </div>
      <div className="mt-4 grid gap-4 lg:grid-cols-2">
        <Card title="Cuts, with the checksum each was cut with">
          {l.cuts.length === 0 ? (
            <EmptyState title="Not cut yet." />
          ) : (
            <ul className="flex flex-col gap-2 text-sm">
              {l.cuts.map((c) => (
                <li key={c.id} className="flex flex-wrap items-center gap-2 border-b border-rule/60 pb-2" data-testid="trace-cut">
                  <span className="whitespace-nowrap">{formatDateTime(c.startedAt)}</span>
                  <span>{PORT_LABEL[c.port]}</span>
                  <span className="font-semibold">{c.revisionLabel}</span>
                  <ShortHash value={c.toolpathSha256} />
                  {c.checksumMatches === true && <Badge tone="ok">Matches the file on record</Badge>}
                  {c.checksumMatches === false && <Badge tone="bad">Differs from the file on record</Badge>}
                  <span>
                    {c.machineName}, {c.operatorName}
                  </span>
                  <OutcomeBadge outcome={c.outcome} />
                  {c.reason && <span className="text-ink-soft">{c.reason}</span>}
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card title="Customer and job">
          {l.job ? (
            <dl className="grid grid-cols-[7rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Customer</dt>
              <dd>
                <Link href={`/customers/${l.job.customerId}`} className="underline decoration-copper/50 underline-offset-2">
                  {l.customer?.name}
                </Link>
                {l.customer?.email ? ` · ${l.customer.email}` : ""}
              </dd>
              <dt className="text-ink-soft">Job</dt>
              <dd className="flex items-center gap-2">
                <Link href={`/jobs/${l.job.id}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                  {l.job.number}
                </Link>
                <JobStateBadge state={l.job.state} />
              </dd>
              <dt className="text-ink-soft">Incoming</dt>
              <dd>{l.head.incomingNotes || "—"}</dd>
            </dl>
          ) : (
            <p className="text-sm text-ink-soft">Shop stock, not on a job.</p>
          )}
        </Card>
      </div>
    </>
  );
}
