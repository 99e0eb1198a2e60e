import { describe, expect, it } from "vitest";
import { auditEventsMatching, auditVocabulary, listAuditEvents } from "@/db/queries/audit";
import { recordAudit } from "@/lib/audit/record";
import { auditFilterSchema, auditListQuerySchema } from "@/lib/trace/audit-export";
import { freshDb } from "../../support/db";

function seeded() {
  const db = freshDb();
  const who = { id: 1, email: "lead@shop.invalid" };
  const machine = { id: null, email: "machine-token:3 (Cell 2)" };
  const at = (d: string, h = 12) => Date.parse(`${d}T${String(h).padStart(2, "0")}:00:00Z`);
  recordAudit(db, { actor: who, action: "job.create", entity: "job", entityId: 1 }, at("2026-11-30", 0));
  recordAudit(db, { actor: who, action: "job.move", entity: "job", entityId: 1 }, at("2026-11-30", 23));
  recordAudit(db, { actor: who, action: "jobXmove", entity: "job", entityId: 2 }, at("2026-12-01"));
  recordAudit(db, { actor: machine, action: "program.fetch", entity: "job", entityId: 1 }, at("2026-12-01"));
  recordAudit(db, { actor: who, action: "customer.create", entity: "customer", entityId: 9 }, at("2026-12-02"));
  return db;
}

const q = (extra: Record<string, string>) => auditListQuerySchema.parse({ pageSize: "50", ...extra });

describe("audit log filters", () => {
  it("take an action family literally (a dot is not a wildcard, nor is _)", () => {
    const db = seeded();
    expect(listAuditEvents(db, q({ action: "job." })).rows.map((r) => r.action)).toEqual(["job.create", "job.move"]);
    expect(listAuditEvents(db, q({ action: "job.move" })).total).toBe(1);
    expect(listAuditEvents(db, q({ action: "job_" })).total).toBe(0);
  });

  it("treat dates as whole UTC days, `to` included", () => {
    const db = seeded();
    expect(listAuditEvents(db, q({ from: "2026-11-30", to: "2026-11-30" })).total).toBe(2);
    expect(listAuditEvents(db, q({ from: "2026-12-01", to: "2026-12-01" })).total).toBe(2);
    expect(listAuditEvents(db, q({ to: "2026-12-01" })).total).toBe(4);
  });

  it("find machines by their token label and people by e-mail", () => {
    const db = seeded();
    expect(listAuditEvents(db, q({ actor: "machine-token" })).rows.map((r) => r.action)).toEqual(["program.fetch"]);
    expect(listAuditEvents(db, q({ actor: "lead@", entity: "customer" })).total).toBe(1);
  });

  it("export every match in id order, across batches", () => {
    const db = seeded();
    const ids = [...auditEventsMatching(db, { entity: "job" }, 2)].map((r) => r.id);
    expect(ids).toEqual([1, 2, 3, 4]);
    expect(auditVocabulary(db).entities).toEqual(["customer", "job"]);
  });

  it("refuse a range that ends before it starts, and malformed dates", () => {
    expect(auditFilterSchema.safeParse({ from: "2026-12-02", to: "2026-12-01" }).success).toBe(false);
    expect(auditFilterSchema.safeParse({ from: "yesterday" }).success).toBe(false);
  });
});
