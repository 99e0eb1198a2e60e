import Link from "next/link";
import { notFound } from "next/navigation";
import { HeadStateBadge } from "@/components/jobs/badges";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { getCustomer } from "@/db/queries/customers";
import { customerTrace } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";
import { CUT_OUTCOME_LABEL, PORT_LABEL, type CutOutcome, type HeadState } from "@/lib/jobs/words";
import { requirePageRole } from "../../../../_server/session";

export const metadata = { title: "Trace a customer" };

export default async function TraceCustomerPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(EVERYONE, `/trace/customer/${id}`);
  const customer = Number.isInteger(Number(id)) ? getCustomer(db(), Number(id)) : null;
  if (!customer) notFound();
  const rows = customerTrace(db(), customer.id);
  return (
    <>
      <PageHeader title={`Trace: ${customer.name}`} subtitle="Each head the shop had from or for this customer, and each revision that cut it." />
      <Card>
        {rows.length === 0 ? (
          <EmptyState title="No heads for this customer yet." />
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <thead className="text-left text-ink-soft">
                <tr>
                  <th className="py-1 pr-3 font-semibold">Head</th>
                  <th className="py-1 pr-3 font-semibold">State</th>
                  <th className="py-1 pr-3 font-semibold">Job</th>
                  <th className="py-1 pr-3 font-semibold">Port</th>
                  <th className="py-1 pr-3 font-semibold">Revision</th>
                  <th className="py-1 pr-3 text-right font-semibold">Cuts</th>
                  <th className="py-1 pr-3 font-semibold">Outcomes</th>
                  <th className="py-1 font-semibold">Last cut</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={`${r.headId}-${r.revisionId}-${r.port}`} className="border-t border-rule/60">
                    <td className="py-1 pr-3">
                      <Link href={`/trace/head/${encodeURIComponent(r.headSerial)}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                        {r.headSerial}
                      </Link>
                    </td>
                    <td className="py-1 pr-3">
                      <HeadStateBadge state={r.headState as HeadState} />
                    </td>
                    <td className="py-1 pr-3">
                      <Link href={`/jobs/${r.jobId}`} className="font-mono underline decoration-copper/50 underline-offset-2">
                        {r.jobNumber}
                      </Link>
                    </td>
                    <td className="py-1 pr-3">{r.port ? PORT_LABEL[r.port as "intake" | "exhaust"] : "—"}</td>
                    <td className="py-1 pr-3">
                      {r.revisionId ? (
                        <Link href={`/trace/revision/${r.revisionId}`} className="underline decoration-copper/50 underline-offset-2">
                          {r.revisionLabel}
                        </Link>
                      ) : (
                        <span className="text-ink-faint">not cut</span>
                      )}
                    </td>
                    <td className="py-1 pr-3 text-right font-mono">{r.cuts}</td>
                    <td className="py-1 pr-3">
                      {r.outcomes
                        ? r.outcomes
                            .split(",")
                            .map((o) => CUT_OUTCOME_LABEL[o as CutOutcome] ?? o)
                            .join(", ")
                        : "—"}
                    </td>
                    <td className="py-1">{formatDateTime(r.lastCutAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
    </>
  );
}
