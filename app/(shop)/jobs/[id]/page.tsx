import Link from "next/link";
import { notFound } from "next/navigation";
import { HeadStateBadge, JobStateBadge, OutcomeBadge, RevisionFlag, ShortHash } from "@/components/jobs/badges";
import { CutForm } from "@/components/jobs/CutForm";
import { CuttingCaution } from "@/components/jobs/CuttingCaution";
import { HeadForm } from "@/components/jobs/HeadForm";
import { JobForm } from "@/components/jobs/JobForm";
import { JobMoves } from "@/components/jobs/JobMoves";
import { JobPorts } from "@/components/jobs/JobPorts";
import { currentTime } from "@/components/jobs/options";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate, formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { flowTestsOfHeads } from "@/db/queries/heads";
import { jobFormOptions } from "@/db/queries/jobs";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, LEADS, MACHINISTS } from "@/lib/auth/roles";
import { jobDetail } from "@/lib/jobs/detail";
import { PLAN_UNKNOWN_TEXT, formatHours } from "@/lib/jobs/planning";
import { CUTTING_JOB_STATES, isOpenJob } from "@/lib/jobs/states";
import { HEAD_SOURCE_LABEL, PORT_LABEL, REVISION_STATE_LABEL } from "@/lib/jobs/words";
import { duration } from "@/lib/toolpath/summary";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Job" };

export default async function JobPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/jobs/${id}`);
  const detail = Number.isInteger(Number(id)) ? jobDetail(db(), Number(id)) : null;
  if (!detail) notFound();
  const { job, plan, ports, moves, heads, cuts } = detail;
  const isLead = hasRole(actor, LEADS);
  const isFloor = hasRole(actor, MACHINISTS);
  const open = isOpenJob(job.state);
  const options = jobFormOptions(db());
  const cylinders = options.headTypes.find((h) => h.id === job.headTypeId)?.cylinders ?? 16;
  const flagged = ports.filter((p) => p.flagged);
  const cutPorts = ports.filter((p) => p.cut && p.revision && p.revision.state === "released");
  const anyCut = heads.some((h) => h.cuts > 0);

  return (
    <>
      <PageHeader
        title={`Job ${job.number}`}
        subtitle={`${job.customerName} · casting ${job.castingNumber} · ${job.quantity} ${job.quantity === 1 ? "head" : "heads"}${job.dueOn ? ` · due ${formatDate(job.dueOn)}` : ""}`}
        actions={
          <div className="flex flex-wrap items-center gap-2" data-testid="job-state">
            <JobStateBadge state={job.state} />
            {job.flagged && <RevisionFlag />}
          </div>
        }
      />

      {flagged.length > 0 && (
        <div role="alert" className="mb-4 rounded-md border border-bad/40 bg-bad-wash px-4 py-3 text-sm text-bad" data-testid="revision-changed-banner">
          {flagged.map((p) => (
            <p key={p.port}>
              <strong>
                The {PORT_LABEL[p.port].toLowerCase()} revision {p.revision!.label} was {REVISION_STATE_LABEL[p.revision!.state].toLowerCase()}
              </strong>
              {p.revision!.endReason ? ` (${p.revision!.endReason})` : ""}. Choose the released revision before more heads are cut; heads already cut keep the revision they
              were cut with.
            </p>
          ))}
        </div>
      )}

      <div className="mb-4">
        <CuttingCaution firstArticle={!anyCut} />
      </div>

      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <Card title="Program revisions">
            <JobPorts
              jobId={job.id}
              canChoose={isLead && open}
              ports={ports.map((p) => ({
                port: p.port,
                cut: p.cut,
                flagged: p.flagged,
                choices: p.choices.map((c) => ({ id: c.id, label: c.label, state: c.state })),
                revision: p.revision
                  ? { id: p.revision.id, label: p.revision.label, state: p.revision.state, sha256: p.revision.toolpath?.sha256 ?? null, cycleTimeS: p.revision.cycleTimeS, endReason: p.revision.endReason }
                  : null,
              }))}
            />
          </Card>

          <Card title="Planned machine time">
            {plan.known ? (
              <div className="text-sm" data-testid="planned-time">
                <table className="w-full max-w-xl">
                  <tbody>
                    {ports
                      .filter((p) => p.cut && p.revision)
                      .map((p) => (
                        <tr key={p.port} className="border-b border-rule/60">
                          <td className="py-1 pr-3 text-ink-soft">{PORT_LABEL[p.port]}</td>
                          <td className="py-1 pr-3 font-mono">
                            {duration(p.revision!.cycleTimeS ?? 0)} × {detail.portsPerHead} ports × {job.quantity} heads
                          </td>
                          <td className="py-1 text-right font-mono">{formatHours(plan.perPortS[p.port] ?? 0)}</td>
                        </tr>
                      ))}
                    <tr className="border-b border-rule/60">
                      <td className="py-1 pr-3 text-ink-soft">Setup</td>
                      <td />
                      <td className="py-1 text-right font-mono">{formatHours(plan.setupS)}</td>
                    </tr>
                    <tr>
                      <td className="py-1 pr-3 font-semibold">Total</td>
                      <td />
                      <td className="py-1 text-right font-mono text-lg font-bold" data-testid="planned-total">
                        {formatHours(plan.totalS)}
                      </td>
                    </tr>
                  </tbody>
                </table>
                <p className="mt-2 text-xs text-ink-faint">
                  {detail.portsPerHeadDerived ? `${detail.portsPerHead} ports of each kind per head, derived from the casting. ` : ""}
                  Cycle times are the toolpath analysis&apos;s estimates; the machine&apos;s own time decides.
                </p>
              </div>
            ) : (
              <p className="text-sm text-warn" data-testid="planned-time">
                Planned time: {PLAN_UNKNOWN_TEXT[plan.reason]}
                {plan.ports.length ? ` (${plan.ports.map((p) => PORT_LABEL[p].toLowerCase()).join(", ")})` : ""}.
              </p>
            )}
          </Card>

          <Card title={`Heads and cuts (${heads.length} of ${job.quantity})`}>
            {heads.length === 0 ? (
              <EmptyState title="No heads received yet.">The machinist receives each head here with its incoming inspection.</EmptyState>
            ) : (
              <div className="flex flex-col gap-4">
                {heads.map((h) => {
                  const log = cuts.filter((c) => c.headId === h.id);
                  return (
                    <section key={h.id} className="rounded-md border border-rule" data-testid={`head-${h.serial}`}>
                      <header className="flex flex-wrap items-center gap-3 border-b border-rule bg-paper-deep px-3 py-2">
                        <Link href={`/trace/head/${encodeURIComponent(h.serial)}`} className="font-mono font-semibold underline decoration-copper/50 underline-offset-2">
                          {h.serial}
                        </Link>
                        <HeadStateBadge state={h.state} />
                        <span className="text-sm text-ink-soft">{HEAD_SOURCE_LABEL[h.source]}</span>
                        {h.incomingNotes && <span className="text-sm text-ink-soft">· {h.incomingNotes}</span>}
                      </header>
                      {log.length === 0 ? (
                        <p className="px-3 py-2 text-sm text-ink-faint">Not cut yet.</p>
                      ) : (
                        <div className="overflow-x-auto">
                          <table className="w-full text-sm">
                            <thead className="text-left text-ink-soft">
                              <tr>
                                <th className="px-3 py-1 font-semibold">Cut</th>
                                <th className="px-3 py-1 font-semibold">Revision and file</th>
                                <th className="px-3 py-1 font-semibold">Who and where</th>
                                <th className="px-3 py-1 font-semibold">Outcome</th>
                              </tr>
                            </thead>
                            <tbody>
                              {log.map((c) => (
                                <tr key={c.id} className="border-t border-rule/60 align-top">
                                  <td className="px-3 py-1">
                                    <span className="whitespace-nowrap">{formatDateTime(c.startedAt)}</span>
                                    <span className="block text-xs text-ink-soft">
                                      {PORT_LABEL[c.port]}
                                      {c.cylinder ? `, cylinder ${c.cylinder}` : ""}
                                    </span>
                                  </td>
                                  <td className="px-3 py-1">
                                    {c.revisionLabel}
                                    <span className="block">
                                      <ShortHash value={c.toolpathSha256} />
                                    </span>
                                  </td>
                                  <td className="px-3 py-1">
                                    {c.operatorName}
                                    <span className="block text-xs text-ink-soft">{c.machineName}</span>
                                  </td>
                                  <td className="px-3 py-1">
                                    <OutcomeBadge outcome={c.outcome} />
                                    {c.reason && <p className="mt-1 max-w-xs text-xs text-ink-soft">{c.reason}</p>}
                                  </td>
                                </tr>
                              ))}
                            </tbody>
                          </table>
                        </div>
                      )}
                    </section>
                  );
                })}
              </div>
            )}
          </Card>

          {isFloor && CUTTING_JOB_STATES.includes(job.state) && (
            <Card title="Record a cut">
              <CutForm
                jobId={job.id}
                heads={heads.map((h) => ({ id: h.id, serial: h.serial, state: h.state }))}
                ports={cutPorts.map((p) => ({ port: p.port, revisionId: p.revision!.id, revisionLabel: p.revision!.label }))}
                machines={options.machines}
                machineId={job.machineId}
                cylinders={cylinders}
                now={currentTime()}
                firstArticle={!anyCut}
                flowTests={flowTestsOfHeads(
                  db(),
                  heads.map((h) => h.id),
                )}
              />
            </Card>
          )}
        </div>

        <div className="flex flex-col gap-4">
          <Card title="Move the job">
            {isLead ? <JobMoves jobId={job.id} state={job.state} moves={moves} /> : <p className="text-sm text-ink-soft">The lead moves the job along.</p>}
          </Card>
          <Card title="Details">
            <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Customer</dt>
              <dd>
                <Link href={`/customers/${job.customerId}`} className="underline decoration-copper/50 underline-offset-2">
                  {job.customerName}
                </Link>
              </dd>
              <dt className="text-ink-soft">Casting</dt>
              <dd className="font-mono">{job.castingNumber}</dd>
              <dt className="text-ink-soft">Machine</dt>
              <dd>{job.machineName ?? <span className="text-warn">not chosen</span>}</dd>
              <dt className="text-ink-soft">Ports per head</dt>
              <dd>
                {detail.portsPerHead}
                {detail.portsPerHeadDerived ? " (derived)" : ""}
              </dd>
              <dt className="text-ink-soft">Setup</dt>
              <dd>{job.setupMinutes} min</dd>
              <dt className="text-ink-soft">Due</dt>
              <dd>{formatDate(job.dueOn)}</dd>
              <dt className="text-ink-soft">Notes</dt>
              <dd className="whitespace-pre-line">{job.notes || "—"}</dd>
            </dl>
            {isLead && open && (
              <details className="mt-3">
                <summary className="cursor-pointer text-sm font-semibold text-copper">Edit the job</summary>
                <div className="mt-3">
                  <JobForm
                    options={options}
                    job={{
                      id: job.id,
                      headTypeLocked: job.state !== "quoted" || heads.length > 0,
                      number: job.number,
                      customerId: job.customerId,
                      headTypeId: job.headTypeId,
                      quantity: job.quantity,
                      cutIntake: job.cutIntake,
                      cutExhaust: job.cutExhaust,
                      machineId: job.machineId,
                      dueOn: job.dueOn,
                      setupMinutes: job.setupMinutes,
                      portsPerHead: job.portsPerHead,
                      notes: job.notes,
                    }}
                  />
                </div>
              </details>
            )}
          </Card>
          {isFloor && open && heads.filter((h) => h.state !== "scrapped").length < job.quantity && (
            <Card title="Receive a head">
              <HeadForm jobId={job.id} castingNumber={job.castingNumber} />
            </Card>
          )}
        </div>
      </div>
    </>
  );
}
