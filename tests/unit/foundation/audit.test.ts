import { describe, expect, it } from "vitest";
import { recordAudit } from "@/lib/audit/record";
import { verifyAuditChain } from "@/lib/audit/verify";
import { freshDb } from "../../support/db";

const actor = { id: 1, email: "lead@x.invalid" };

function threeEvents() {
  const db = freshDb();
  recordAudit(db, { actor, action: "head_type.create", entity: "head_type", entityId: 1, after: { castingNumber: "A-1" } }, 1000);
  recordAudit(db, { actor, action: "head_type.update", entity: "head_type", entityId: 1, before: { boreMm: 100 }, after: { boreMm: 101.6 } }, 2000);
  recordAudit(db, { actor, action: "user.update", entity: "user", entityId: 7, after: { passwordHash: "secret", role: "lead" } }, 3000);
  return db;
}

describe("audit chain", () => {
  it("links each event to the previous one and verifies", () => {
    const db = threeEvents();
    const rows = db.$client.prepare("SELECT prev_hash, hash FROM audit_events ORDER BY id").all() as Array<{ prev_hash: string; hash: string }>;
    expect(rows[0].prev_hash).toBe("");
    expect(rows[1].prev_hash).toBe(rows[0].hash);
    expect(rows[2].prev_hash).toBe(rows[1].hash);
    expect(verifyAuditChain(db.$client)).toEqual({ ok: true, events: 3, lastHash: rows[2].hash });
  });

  it("never copies secrets into the trail", () => {
    const db = threeEvents();
    const after = db.$client.prepare("SELECT after FROM audit_events WHERE id = 3").pluck().get() as string;
    expect(JSON.parse(after)).toEqual({ passwordHash: "[redacted]", role: "lead" });
  });

  it("is append-only in the database itself", () => {
    const db = threeEvents();
    expect(() => db.$client.prepare("UPDATE audit_events SET actor_email = 'x' WHERE id = 2").run()).toThrow(/append-only/);
    expect(() => db.$client.prepare("DELETE FROM audit_events WHERE id = 2").run()).toThrow(/append-only/);
  });

  it("names the first altered event when the file is edited behind the app's back", () => {
    const db = threeEvents();
    // Someone with the file and a SQLite shell removes the guard and edits history.
    db.$client.exec("DROP TRIGGER audit_events_no_update");
    db.$client.prepare(`UPDATE audit_events SET "after" = '{"boreMm":99}' WHERE id = 2`).run();
    expect(verifyAuditChain(db.$client)).toMatchObject({ ok: false, brokenAt: 2 });
  });

  it("detects a deleted event by the broken link after it", () => {
    const db = threeEvents();
    db.$client.exec("DROP TRIGGER audit_events_no_delete");
    db.$client.prepare("DELETE FROM audit_events WHERE id = 2").run();
    expect(verifyAuditChain(db.$client)).toMatchObject({ ok: false, brokenAt: 3 });
  });
});

describe("released revisions in the database", () => {
  it("refuse edits and deletion, but allow the move to superseded", () => {
    const db = freshDb();
    const sql = db.$client;
    sql.exec(`
      INSERT INTO head_types (casting_number, engine_family, cylinders, valves_per_cylinder, bore_mm, stroke_mm, intake_valve_mm, exhaust_valve_mm)
        VALUES ('T-1', 'Test four', 4, 2, 86, 86, 34, 29);
      INSERT INTO programs (head_type_id, port, name) VALUES (1, 'intake', 'Street');
      INSERT INTO stored_files (kind, storage_key, original_name, size_bytes, sha256, state) VALUES ('toolpath', 'k/1', 'a.nc', 10, 'aa', 'stored');
      INSERT INTO revisions (program_id, letter, state) VALUES (1, 'A', 'draft');
      INSERT INTO revision_files (revision_id, file_id, role) VALUES (1, 1, 'toolpath');
      UPDATE revisions SET state = 'released', released_at = 1 WHERE id = 1;
    `);
    expect(() => sql.exec("UPDATE revisions SET change_note = 'edited' WHERE id = 1")).toThrow(/immutable/);
    expect(() => sql.exec("UPDATE revisions SET state = 'draft' WHERE id = 1")).toThrow(/immutable/);
    expect(() => sql.exec("DELETE FROM revisions WHERE id = 1")).toThrow(/cannot be deleted/);
    expect(() => sql.exec("UPDATE stored_files SET sha256 = 'bb' WHERE id = 1")).toThrow(/immutable/);
    expect(() => sql.exec("DELETE FROM revision_files WHERE id = 1")).toThrow(/immutable/);
    sql.exec("UPDATE revisions SET state = 'superseded', end_reason = 'B released' WHERE id = 1");
    expect(sql.prepare("SELECT state FROM revisions WHERE id = 1").pluck().get()).toBe("superseded");
    expect(() => sql.exec("UPDATE revisions SET state = 'released' WHERE id = 1")).toThrow(/immutable/);
  });
});
