import { count, gte, sql } from "drizzle-orm";
import type { Db } from "../client";
import { cuts, flowTests, headTypes, jobs, machines, masterHeads, revisions, users } from "../schema";

function tally<K extends string>(rows: Array<{ key: K; n: number }>): Partial<Record<K, number>> {
  return Object.fromEntries(rows.map((r) => [r.key, r.n])) as Partial<Record<K, number>>;
}

/** The counts on the home page, straight from the tables. */
export function shopOverview(db: Db, now = Date.now()) {
  const weekAgo = now - 7 * 24 * 3600 * 1000;
  const one = <T extends { n: number }>(row: T | undefined) => row?.n ?? 0;
  return {
    headTypes: one(db.select({ n: count() }).from(headTypes).get()),
    machines: one(db.select({ n: count() }).from(machines).get()),
    users: one(db.select({ n: count() }).from(users).get()),
    mastersByStage: tally(db.select({ key: masterHeads.stage, n: count() }).from(masterHeads).groupBy(masterHeads.stage).all()),
    revisionsByState: tally(db.select({ key: revisions.state, n: count() }).from(revisions).groupBy(revisions.state).all()),
    jobsByState: tally(db.select({ key: jobs.state, n: count() }).from(jobs).groupBy(jobs.state).all()),
    cutsThisWeek: one(db.select({ n: count() }).from(cuts).where(gte(cuts.startedAt, weekAgo)).get()),
    scrapThisWeek: one(
      db
        .select({ n: count() })
        .from(cuts)
        .where(sql`${cuts.startedAt} >= ${weekAgo} AND ${cuts.outcome} = 'scrap'`)
        .get(),
    ),
    flowTests: one(db.select({ n: count() }).from(flowTests).get()),
  };
}
