/** A revision's cut tally for the trace page's header: how many heads, which outcomes. */
import type { Db } from "@/db/client";
import { recallRows } from "@/db/queries/trace";

export type RecallSummary = { cuts: number; heads: number; jobs: number; customers: number; byOutcome: Record<"good" | "rework" | "scrap", number> };

export function recallSummary(db: Db, revisionId: number): RecallSummary {
  const heads = new Set<number>();
  const jobs = new Set<number>();
  const customers = new Set<number>();
  const byOutcome = { good: 0, rework: 0, scrap: 0 };
  let cuts = 0;
  for (const row of recallRows(db, revisionId)) {
    cuts++;
    heads.add(row.headId);
    jobs.add(row.jobId);
    customers.add(row.customerId);
    byOutcome[row.outcome]++;
  }
  return { cuts, heads: heads.size, jobs: jobs.size, customers: customers.size, byOutcome };
}
