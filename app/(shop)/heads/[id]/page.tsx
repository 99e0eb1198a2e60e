import Link from "next/link";
import { notFound } from "next/navigation";
import { HeadStateBadge, OutcomeBadge, ShortHash } from "@/components/jobs/badges";
import { HeadEditForm } from "@/components/jobs/HeadEditForm";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { cutsOfHead } from "@/db/queries/cuts";
import { getHead } from "@/db/queries/heads";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { HEAD_SOURCE_LABEL, PORT_LABEL } from "@/lib/jobs/words";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Head" };

export default async function HeadPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/heads/${id}`);
  const head = Number.isInteger(Number(id)) ? getHead(db(), Number(id)) : null;
  if (!head) notFound();
  const cuts = cutsOfHead(db(), head.id);
  return (
    <>
      <PageHeader
        title={`Head ${head.serial}`}
        subtitle={`Casting ${head.castingNumber} · ${HEAD_SOURCE_LABEL[head.source]}${head.customerName ? ` · ${head.customerName}` : ""}`}
        actions={
          <div className="flex items-center gap-3">
            <HeadStateBadge state={head.state} />
            <Link href={`/trace/head/${encodeURIComponent(head.serial)}`} className="text-sm font-semibold text-copper underline">
              Full lineage
            </Link>
          </div>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <Card title="Cuts">
          {cuts.length === 0 ? (
            <EmptyState title="Not cut yet." />
          ) : (
            <ul className="flex flex-col gap-2 text-sm">
              {cuts.map((c) => (
                <li key={c.id} className="flex flex-wrap items-center gap-3 border-b border-rule/60 pb-2">
                  <span className="whitespace-nowrap">{formatDateTime(c.startedAt)}</span>
                  <span>{PORT_LABEL[c.port]}</span>
                  <span className="font-semibold">{c.revisionLabel}</span>
                  <ShortHash value={c.toolpathSha256} />
                  <span>{c.machineName}</span>
                  <span>{c.operatorName}</span>
                  <OutcomeBadge outcome={c.outcome} />
                  {c.reason && <span className="text-ink-soft">{c.reason}</span>}
                </li>
              ))}
            </ul>
          )}
        </Card>
        <div className="flex flex-col gap-4">
          <Card title="Record">
            <dl className="grid grid-cols-[7rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Job</dt>
              <dd>
                {head.jobId ? (
                  <Link href={`/jobs/${head.jobId}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                    {head.jobNumber}
                  </Link>
                ) : (
                  "shop stock, no job"
                )}
              </dd>
              <dt className="text-ink-soft">Incoming</dt>
              <dd className="whitespace-pre-line">{head.incomingNotes || "—"}</dd>
            </dl>
          </Card>
          {hasRole(actor, MACHINISTS) && head.state !== "shipped" && (
            <Card title="Edit">
              <HeadEditForm head={head} />
            </Card>
          )}
        </div>
      </div>
    </>
  );
}
