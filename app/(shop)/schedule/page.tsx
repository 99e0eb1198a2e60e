import Link from "next/link";
import { JobStateBadge } from "@/components/jobs/badges";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { shopSchedule } from "@/lib/jobs/detail";
import { PLAN_UNKNOWN_TEXT, formatHours } from "@/lib/jobs/planning";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Schedule" };

/** A nominal single-shift week, only to scale the bars; the shop's real capacity is its own. */
const WEEK_S = 40 * 3600;

export default async function SchedulePage() {
  await requirePageRole(EVERYONE, "/schedule");
  const machines = shopSchedule(db());
  return (
    <>
      <PageHeader
        title="Schedule"
        subtitle="Planned machine time of open jobs, summed per machine and per week the job is due. Jobs still being quoted are shown apart as tentative."
      />
      {machines.length === 0 ? (
        <EmptyState title="No open jobs.">Jobs appear here once a lead opens them.</EmptyState>
      ) : (
        <div className="flex flex-col gap-6">
          {machines.map((m) => (
            <Card key={m.machineId ?? "none"} title={m.machineName}>
              <div className="overflow-x-auto">
                <table className="w-full text-sm" data-testid={`schedule-${m.machineId ?? "none"}`}>
                  <thead className="text-left text-ink-soft">
                    <tr>
                      <th className="py-1 pr-3 font-semibold">Week due</th>
                      <th className="py-1 pr-3 text-right font-semibold">Committed</th>
                      <th className="py-1 pr-3 font-semibold">of a 40-hour week</th>
                      <th className="py-1 pr-3 text-right font-semibold">Tentative</th>
                      <th className="py-1 font-semibold">Jobs</th>
                    </tr>
                  </thead>
                  <tbody>
                    {m.weeks.map((w) => {
                      const share = Math.min(1, w.committedS / WEEK_S);
                      const over = w.committedS > WEEK_S;
                      return (
                        <tr key={w.week} className="border-t border-rule/60 align-top">
                          <td className="py-2 pr-3 whitespace-nowrap">{w.monday ? `${w.week} (from ${formatDate(w.monday)})` : "No due date"}</td>
                          <td className="py-2 pr-3 text-right font-mono">{formatHours(w.committedS)}</td>
                          <td className="w-48 py-2 pr-3">
                            <div className="h-3 w-full rounded bg-paper-deep" aria-hidden>
                              <div className={`h-3 rounded ${over ? "bg-bad" : "bg-copper"}`} style={{ width: `${share * 100}%` }} />
                            </div>
                            <span className="text-xs text-ink-soft">
                              {Math.round((w.committedS / WEEK_S) * 100)} %{over ? " — over a single shift" : ""}
                            </span>
                          </td>
                          <td className="py-2 pr-3 text-right font-mono text-ink-soft">{w.tentativeS ? formatHours(w.tentativeS) : "—"}</td>
                          <td className="py-2">
                            <ul className="flex flex-col gap-1">
                              {w.jobs.map((j) => (
                                <li key={j.id} className="flex flex-wrap items-center gap-2">
                                  <Link href={`/jobs/${j.id}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                                    {j.number}
                                  </Link>
                                  <JobStateBadge state={j.state} />
                                  <span className="font-mono text-ink-soft">{j.plan.known ? formatHours(j.plan.totalS) : PLAN_UNKNOWN_TEXT[j.plan.reason]}</span>
                                </li>
                              ))}
                            </ul>
                          </td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              </div>
            </Card>
          ))}
          <p className="text-xs text-ink-faint">
            Planned time = each chosen revision&apos;s estimated cycle time × ports per head × heads + setup. Estimates from the toolpath analysis; the machine&apos;s real
            time decides.
          </p>
        </div>
      )}
    </>
  );
}
