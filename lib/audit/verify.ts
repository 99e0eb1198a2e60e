/** Walks the whole audit chain in id order and names the first event that does not match. */
import type Database from "better-sqlite3";
import { eventHash } from "./canonical";

export type ChainReport =
  | { ok: true; events: number; lastHash: string }
  | { ok: false; events: number; brokenAt: number; reason: string };

type Row = {
  id: number;
  at: number;
  actor_id: number | null;
  actor_email: string;
  action: string;
  entity: string;
  entity_id: string | null;
  before: string | null;
  after: string | null;
  prev_hash: string;
  hash: string;
};

export function verifyAuditChain(sqlite: Database.Database): ChainReport {
  // Raw rows through an iterator: constant memory however long the trail is.
  const rows = sqlite.prepare("SELECT * FROM audit_events ORDER BY id").iterate() as IterableIterator<Row>;
  let prev = "";
  let count = 0;
  for (const row of rows) {
    count++;
    if (row.prev_hash !== prev) {
      return { ok: false, events: count, brokenAt: row.id, reason: "its link to the previous event does not match" };
    }
    const expected = eventHash(prev, {
      at: row.at,
      actorId: row.actor_id,
      actorEmail: row.actor_email,
      action: row.action,
      entity: row.entity,
      entityId: row.entity_id,
      before: row.before == null ? null : JSON.parse(row.before),
      after: row.after == null ? null : JSON.parse(row.after),
    });
    if (expected !== row.hash) {
      return { ok: false, events: count, brokenAt: row.id, reason: "its content was changed after it was written" };
    }
    prev = row.hash;
  }
  return { ok: true, events: count, lastHash: prev };
}
