/** Readiness: the database, the object storage and the mail relay, each with a reason when down. */
import type { Db } from "@/db/client";

export type Check = { ok: boolean; message?: string };
export type Health = { ok: boolean; checks: { database: Check; storage: Check; mail: Check } };

export function checkDatabase(db: Db): Check {
  try {
    db.$client.prepare("SELECT 1").get();
    return { ok: true };
  } catch (err) {
    return { ok: false, message: `database: ${err instanceof Error ? err.message : String(err)}` };
  }
}

export async function checkAll(db: Db, storage: () => Promise<Check>, mail: () => Promise<Check>): Promise<Health> {
  const [s, m] = await Promise.all([storage().catch(fail), mail().catch(fail)]);
  const database = checkDatabase(db);
  return { ok: database.ok && s.ok && m.ok, checks: { database, storage: s, mail: m } };
}

/**
 * The same verdicts without their messages, for callers who are not signed in: a message can
 * name a host, a port or a bucket, which is nothing to show the open network.
 */
export function withoutDetails(health: Health): Health {
  const bare = (c: Check): Check => ({ ok: c.ok });
  const { database, storage, mail } = health.checks;
  return { ok: health.ok, checks: { database: bare(database), storage: bare(storage), mail: bare(mail) } };
}

/** One line for the server log naming what is down and why. */
export function describeProblems(health: Health): string {
  return Object.entries(health.checks)
    .filter(([, c]) => !c.ok)
    .map(([name, c]) => `${name}: ${c.message ?? "down"}`)
    .join("; ");
}

function fail(err: unknown): Check {
  return { ok: false, message: err instanceof Error ? err.message : String(err) };
}
