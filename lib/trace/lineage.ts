/**
 * One head's whole story on one page: master head → scan → revision → toolpath checksum → flow
 * tests → job → customer, for every revision that cut it.
 */
import type { Db } from "@/db/client";
import { cutsOfHead, type CutRow } from "@/db/queries/cuts";
import { getHeadBySerial, type HeadRow } from "@/db/queries/heads";
import { getJobRow, type JobRow } from "@/db/queries/jobs";
import { flowTestsFor, revisionLineage, type FlowTestTrace, type RevisionLineage } from "@/db/queries/trace";
import { getCustomer, type CustomerDetail } from "@/db/queries/customers";
import { flowPeak, type FlowPeak } from "./flow-summary";

export type TracedFlowTest = FlowTestTrace & { peak: FlowPeak };

export type HeadLineage = {
  head: HeadRow;
  job: JobRow | null;
  customer: CustomerDetail | null;
  cuts: Array<CutRow & { checksumMatches: boolean | null }>;
  revisions: RevisionLineage[];
  flow: { head: TracedFlowTest[]; revisions: TracedFlowTest[]; masters: TracedFlowTest[] };
};

const withPeak = (tests: FlowTestTrace[]): TracedFlowTest[] => tests.map((t) => ({ ...t, peak: flowPeak(t) }));

export function traceHead(db: Db, serial: string): HeadLineage | null {
  const head = getHeadBySerial(db, serial);
  if (!head) return null;
  const job = head.jobId ? getJobRow(db, head.jobId) : null;
  const customer = job ? getCustomer(db, job.customerId) : null;
  const cuts = cutsOfHead(db, head.id);
  const revisionIds = [...new Set(cuts.map((c) => c.revisionId))];
  const revisions = revisionIds.map((id) => revisionLineage(db, id)).filter((r): r is RevisionLineage => r !== null);
  const currentSha = new Map(revisions.map((r) => [r.revision.id, r.currentSha256]));
  const masterIds = [...new Set(revisions.map((r) => r.master?.id).filter((id): id is number => id != null))];
  return {
    head,
    job,
    customer,
    cuts: cuts.map((c) => {
      const now = currentSha.get(c.revisionId);
      return { ...c, checksumMatches: now == null ? null : now === c.toolpathSha256 };
    }),
    revisions,
    flow: {
      head: withPeak(flowTestsFor(db, { headId: head.id })),
      revisions: withPeak(flowTestsFor(db, { revisionIds })),
      masters: withPeak(flowTestsFor(db, { masterIds })),
    },
  };
}
