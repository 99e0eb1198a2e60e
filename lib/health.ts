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

function fail(err: unknown): Check {
  return { ok: false, message: err instanceof Error ? err.message : String(err) };
}
