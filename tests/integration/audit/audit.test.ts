/**
 * The audit log: every change writes a hash-chained event; the database refuses UPDATE and
 * DELETE on the table; `portolan audit verify` names the first broken event once a row is
 * altered in the database file; the auditor filters and exports the log.
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import Database from "better-sqlite3";
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as auditRoute } from "@/app/api/audit/route";
import { GET as exportRoute } from "@/app/api/audit/export/route";
import { GET as chainRoute } from "@/app/api/audit/chain/route";
import type { Db } from "@/db/client";
import { auditEvents } from "@/db/schema";
import { run as auditCli } from "@/lib/cli/audit";
import { createCustomer, updateCustomer } from "@/lib/jobs/customers";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";

let db: Db;
let file: string;
let lead: TestUser, auditor: TestUser, porter: TestUser;
const day1 = Date.UTC(2026, 10, 30, 12);
const day2 = Date.UTC(2026, 11, 1, 9);

beforeAll(() => {
  db = freshAppDb();
  file = db.$client.name;
  lead = makeUser(db, "lead", { email: "lead.audit@test.invalid" });
  auditor = makeUser(db, "auditor");
  porter = makeUser(db, "porter");
  const a = createCustomer(db, lead, { name: "Ostler Engineering" }, day1);
  updateCustomer(db, lead, a.id, { phone: "+00 555 0199" }, day2);
  createCustomer(db, lead, { name: "Marrow Road Racing" }, day2);
});

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  return { io: { out: (t: string) => out.push(t), err: (t: string) => err.push(t) }, out, err };
}

describe("filtering and exporting the log", () => {
  const list = async (query: string, as: TestUser = auditor) => json(await auditRoute(await request(`/api/audit?${query}`, { as }), params({})));

  it("filters by record, person, action (or action family) and date range", async () => {
    expect((await list("entity=customer")).body.total).toBe(3);
    expect((await list("action=customer.update")).body.rows.map((r: { action: string }) => r.action)).toEqual(["customer.update"]);
    expect((await list("action=customer.")).body.total).toBe(3);
    expect((await list("actor=lead.audit")).body.total).toBe(3);
    expect((await list("actor=nobody-here")).body.total).toBe(0);
    // `to` is inclusive: the whole of 30 November.
    expect((await list("from=2026-11-30&to=2026-11-30")).body.total).toBe(1);
    expect((await list("from=2026-12-01")).body.total).toBe(2);
    const backwards = await list("from=2026-12-02&to=2026-12-01");
    expect(backwards.status).toBe(422);
    expect((await list("entity=customer", porter)).status).toBe(403);
  });

  it("exports the matching events as CSV with their hashes", async () => {
    const res = await exportRoute(await request("/api/audit/export?entity=customer", { as: auditor }), params({}));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/audit-log-.*\.csv/);
    // papaparse (general-purpose CSV library) as the reference reader.
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.map((r) => r.action)).toEqual(["customer.create", "customer.update", "customer.create"]);
    const rows = db.select().from(auditEvents).all();
    for (const r of parsed.data) {
      const stored = rows.find((e) => String(e.id) === r.id)!;
      expect(r.hash).toBe(stored.hash);
      expect(r.prev_hash).toBe(stored.prevHash);
      expect(JSON.parse(r.after!)).toEqual(stored.after);
    }
  });
});

describe("the chain", () => {
  it("refuses UPDATE and DELETE on the audit table (database triggers)", () => {
    expect(() => db.$client.prepare("UPDATE audit_events SET actor_email = 'x' WHERE id = 1").run()).toThrow(/append-only/);
    expect(() => db.$client.prepare("DELETE FROM audit_events WHERE id = 1").run()).toThrow(/append-only/);
  });

  it("verifies intact, then names the first event altered in the database file", async () => {
    const ok = capture();
    expect(await auditCli(["verify", "--db", file, "--json"], ok.io)).toBe(0);
    const report = JSON.parse(ok.out.join(""));
    expect(report).toMatchObject({ ok: true, events: 3 });
    const chain = await json(await chainRoute(await request("/api/audit/chain", { as: auditor }), params({})));
    expect(chain.body).toMatchObject({ ok: true, events: 3 });

    // Someone with the file in hand removes the guard and rewrites history.
    const raw = new Database(file);
    raw.exec("DROP TRIGGER audit_events_no_update");
    const target = raw.prepare("SELECT id FROM audit_events WHERE action = 'customer.update'").get() as { id: number };
    raw.prepare("UPDATE audit_events SET after = ? WHERE id = ?").run(JSON.stringify({ phone: "+00 555 0000" }), target.id);
    raw.close();

    const broken = capture();
    expect(await auditCli(["verify", "--db", file, "--json"], broken.io)).toBe(1);
    const bad = JSON.parse(broken.out.join(""));
    expect(bad).toMatchObject({ ok: false, brokenAt: target.id });
    expect(bad.reason).toMatch(/content was changed/);
    const text = capture();
    expect(await auditCli(["verify", "--db", file], text.io)).toBe(1);
    expect(text.out.join("")).toContain(`BROKEN at event #${target.id}`);
  });

  it("also runs as `npm run -s portolan -- audit verify` against DATABASE_PATH", () => {
    const res = spawnSync(process.execPath, ["--import", "tsx", path.join(process.cwd(), "lib/cli/main.ts"), "audit", "verify", "--json"], {
      env: { ...process.env, DATABASE_PATH: file },
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(res.status).toBe(1);
    expect(JSON.parse(res.stdout)).toMatchObject({ ok: false });
  });

  it("exits 1 when there is no database and 2 on a usage error", async () => {
    expect(await auditCli(["verify", "--db", path.join(path.dirname(file), "missing.db")], capture().io)).toBe(1);
    expect(await auditCli(["check"], capture().io)).toBe(2);
  });
});
