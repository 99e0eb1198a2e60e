/**
 * The flow-test API end to end: route handlers on a fresh SQLite file with signed-in sessions of
 * every role — who may record, change, delete and read; the CSV import; list filters; the PDF.
 */
import fs from "node:fs";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as list, POST as create } from "@/app/api/flow-tests/route";
import { DELETE as remove, GET as read, PUT as replace } from "@/app/api/flow-tests/[id]/route";
import { GET as pdf } from "@/app/api/flow-tests/[id]/pdf/route";
import { POST as importCsv } from "@/app/api/flow-tests/import/route";
import { GET as subjects } from "@/app/api/flow-tests/subjects/route";
import { GET as series } from "@/app/api/flow-tests/series/route";
import type { Db } from "@/db/client";
import { auditEvents, flowTests, headTypes, masterHeads, programs, revisions, type Role } from "@/db/schema";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";

let db: Db;
let people: Record<Role, TestUser>;
let headTypeId: number;
let masterId: number;
let revisionId: number;

const ROLES: Role[] = ["porter", "machinist", "lead", "auditor", "admin"];

beforeAll(() => {
  db = freshAppDb();
  people = Object.fromEntries(ROLES.map((r) => [r, makeUser(db, r)])) as Record<Role, TestUser>;
  headTypeId = db
    .insert(headTypes)
    .values({ castingNumber: "HT-77", engineFamily: "Invented V8", cylinders: 8, valvesPerCylinder: 2, boreMm: 101.6, strokeMm: 88.4, intakeValveMm: 51.31, exhaustValveMm: 40.64 })
    .returning()
    .get().id;
  masterId = db.insert(masterHeads).values({ label: "M-77-01", headTypeId, handPortNotes: {}, measurements: {} }).returning().get().id;
  const program = db.insert(programs).values({ headTypeId, port: "intake", name: "Trial intake" }).returning().get().id;
  revisionId = db.insert(revisions).values({ programId: program, letter: "A" }).returning().get().id;
});

const record = (over: Record<string, unknown> = {}) => ({
  headTypeId,
  subject: "baseline",
  port: "intake",
  testedOn: "2025-03-04",
  depression: 28,
  valveDiameter: 51.31,
  points: [
    { lift: 2.54, flow: 60 },
    { lift: 5.08, flow: 112 },
    { lift: 7.62, flow: 150 },
  ],
  ...over,
});

const tests = () => db.select({ n: count() }).from(flowTests).get()!.n;

async function createAs(user: TestUser | null, body: unknown) {
  return json(await create(await request("/api/flow-tests", { as: user, json: body }), params({})));
}

describe("who may record, change, delete and read", () => {
  it("lets porter, machinist, lead and admin record; refuses the auditor (403) and strangers (401)", async () => {
    for (const role of ["porter", "machinist", "lead", "admin"] as const) {
      const { status, body } = await createAs(people[role], record());
      expect(status, role).toBe(201);
      expect(body.operatorId).toBe(people[role].id);
    }
    const before = tests();
    const auditor = await createAs(people.auditor, record());
    expect(auditor.status).toBe(403);
    expect(auditor.body.error.code).toBe("forbidden");
    expect((await createAs(null, record())).status).toBe(401);
    expect(tests()).toBe(before);
  });

  it("lets everyone read the list and a test with its computed columns", async () => {
    const { body: made } = await createAs(people.porter, record({ notes: "for reading" }));
    for (const role of ROLES) {
      const res = await json(await list(await request("/api/flow-tests?sort=id&dir=desc", { as: people[role] }), params({})));
      expect(res.status, role).toBe(200);
      expect(res.body.rows[0].id).toBe(made.id);
      const one = await json(await read(await request(`/api/flow-tests/${made.id}`, { as: people[role] }), params({ id: String(made.id) })));
      expect(one.status).toBe(200);
      expect(one.body.computed.ok).toBe(true);
      expect(one.body.computed.result.points).toHaveLength(3);
    }
    expect((await read(await request(`/api/flow-tests/${made.id}`), params({ id: String(made.id) }))).status).toBe(401);
  });

  it("lets only lead and admin change a test, leaving an audit event with before and after", async () => {
    const { body: made } = await createAs(people.porter, record());
    const put = async (user: TestUser, body: unknown) => json(await replace(await request(`/api/flow-tests/${made.id}`, { as: user, method: "PUT", json: body }), params({ id: String(made.id) })));
    for (const role of ["porter", "machinist", "auditor"] as const) expect((await put(people[role], record({ notes: "no" }))).status, role).toBe(403);
    const ok = await put(people.lead, record({ notes: "bench re-zeroed", depression: 25 }));
    expect(ok.status).toBe(200);
    expect(ok.body.depressionInH2O).toBe(25);
    const events = db.select().from(auditEvents).where(eq(auditEvents.entityId, String(made.id))).all();
    const update = events.find((e) => e.action === "flow_test.update")!;
    expect(update.actorEmail).toBe(people.lead.email);
    expect((update.before as { depressionInH2O: number }).depressionInH2O).toBe(28);
    expect((update.after as { notes: string }).notes).toBe("bench re-zeroed");
    // Field messages from the shared schema come back under their field names.
    const bad = await put(people.admin, record({ valveDiameter: -1 }));
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty("valveDiameter");
  });

  it("lets only lead and admin delete, audited", async () => {
    const { body: made } = await createAs(people.machinist, record());
    const del = async (user: TestUser) => (await remove(await request(`/api/flow-tests/${made.id}`, { as: user, method: "DELETE" }), params({ id: String(made.id) }))).status;
    for (const role of ["porter", "machinist", "auditor"] as const) expect(await del(people[role]), role).toBe(403);
    expect(await del(people.admin)).toBe(200);
    expect(await del(people.admin)).toBe(404);
    expect(db.select().from(auditEvents).where(eq(auditEvents.action, "flow_test.delete")).all().map((e) => e.entityId)).toContain(String(made.id));
  });
});

describe("links and filters", () => {
  it("requires the subject's link and filters the list by master, revision and head type", async () => {
    const missing = await createAs(people.porter, record({ subject: "master" }));
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields.masterId[0]).toMatch(/master head/);
    const m = await createAs(people.porter, record({ subject: "master", masterId }));
    const r = await createAs(people.machinist, record({ subject: "revision", revisionId }));
    expect([m.status, r.status]).toEqual([201, 201]);

    const byMaster = await json(await list(await request(`/api/flow-tests?masterId=${masterId}`, { as: people.auditor }), params({})));
    expect(byMaster.body.rows.map((x: { id: number }) => x.id)).toEqual([m.body.id]);
    expect(byMaster.body.rows[0].subjectLabel).toBe("M-77-01");
    const byRevision = await json(await list(await request(`/api/flow-tests?revisionId=${revisionId}`, { as: people.auditor }), params({})));
    expect(byRevision.body.rows.map((x: { id: number }) => x.id)).toEqual([r.body.id]);
    expect(byRevision.body.rows[0].subjectLabel).toBe("Trial intake · rev A");
    // The corrected peak is computed for each row (no ambient: standard air, so it equals the top flow at 28″).
    expect(byRevision.body.rows[0].peakFlowCfmAt28).toBeCloseTo(150, 9);
    const byType = await json(await list(await request(`/api/flow-tests?headTypeId=${headTypeId}&pageSize=5`, { as: people.porter }), params({})));
    expect(byType.body.total).toBe(tests());
    expect(byType.body.rows).toHaveLength(5);
    const bad = await list(await request(`/api/flow-tests?revisionId=abc`, { as: people.porter }), params({}));
    expect(bad.status).toBe(422);
  });

  it("offers the form its choices, and empty lists for a casting with nothing yet", async () => {
    const all = await json(await subjects(await request(`/api/flow-tests/subjects?headTypeId=${headTypeId}`, { as: people.porter }), params({})));
    expect(all.body.masters.map((m: { label: string }) => m.label)).toEqual(["M-77-01"]);
    expect(all.body.revisions).toEqual([{ id: revisionId, label: "Trial intake · rev A", port: "intake", state: "draft" }]);
    expect(all.body.operators.map((o: { role: string }) => o.role)).not.toContain("auditor");
    const other = db.insert(headTypes).values({ castingNumber: "HT-78", engineFamily: "Invented I4", cylinders: 4, valvesPerCylinder: 4, boreMm: 86, strokeMm: 86, intakeValveMm: 34.5, exhaustValveMm: 29 }).returning().get().id;
    const empty = await json(await subjects(await request(`/api/flow-tests/subjects?headTypeId=${other}`, { as: people.porter }), params({})));
    expect(empty.body).toMatchObject({ masters: [], revisions: [], heads: [] });
  });

  it("gives chart series for several tests in the order asked", async () => {
    const a = await createAs(people.porter, record());
    const b = await createAs(people.porter, record({ points: [{ lift: 3, flow: 70 }] }));
    const res = await json(await series(await request(`/api/flow-tests/series?ids=${b.body.id},${a.body.id}`, { as: people.auditor }), params({})));
    expect(res.body.map((s: { id: number }) => s.id)).toEqual([b.body.id, a.body.id]);
    expect(res.body[0].points[0]).toMatchObject({ liftMm: 3, flowCfmAt28: 70 });
    expect((await series(await request(`/api/flow-tests/series?ids=x`, { as: people.auditor }), params({}))).status).toBe(422);
  });
});

describe("CSV import", () => {
  const fixture = (name: string) => fs.readFileSync(path.join(process.cwd(), "tests/fixtures/flow", name), "utf8");
  const fields = () => ({ headTypeId, subject: "baseline", port: "intake", testedOn: "2025-03-05", depression: 28, valveDiameter: 2.02, lengthUnit: "in" });
  const post = async (user: TestUser, body: unknown) => json(await importCsv(await request("/api/flow-tests/import", { as: user, json: body }), params({})));

  it("refuses a malformed file with one error per bad line and saves nothing", async () => {
    const before = tests();
    const res = await post(people.porter, { csv: fixture("malformed.csv"), test: fields() });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nothing was saved/);
    // malformed.csv: line 3 "abc", line 4 negative lift, line 5 missing flow, line 6 a repeated lift.
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["rows.3", "rows.4", "rows.5", "rows.6"]);
    expect(res.body.error.fields["rows.3"][0]).toMatch(/not a number/);
    expect(tests()).toBe(before);
  });

  it("imports a file with unit headers and stores it in mm and cfm", async () => {
    const res = await post(people.machinist, { csv: fixture("intake-inch-cfm.csv"), test: fields() });
    expect(res.status).toBe(201);
    expect(res.body.import).toMatchObject({ units: { lift: "in", flow: "cfm" }, ignoredColumns: ["note"], rows: 6 });
    expect(res.body.points[0]).toEqual({ liftMm: 2.54, flowCfm: 68 });
    expect(res.body.valveDiameterMm).toBe(51.308);
  });

  it("takes a column mapping when the headers are not recognised", async () => {
    const unmapped = await post(people.porter, { csv: fixture("unknown-headers.csv"), test: fields() });
    expect(unmapped.status).toBe(422);
    expect(Object.keys(unmapped.body.error.fields)).toEqual(["rows.1"]);
    const mapped = await post(people.porter, {
      csv: fixture("unknown-headers.csv"),
      mapping: { lift: { column: "L", unit: "in" }, flow: { column: "Q", unit: "cfm" } },
      test: fields(),
    });
    expect(mapped.status).toBe(201);
    expect(mapped.body.points.map((p: { liftMm: number }) => p.liftMm)).toEqual([2.54, 5.08]);
  });

  it("is closed to the auditor", async () => {
    expect((await post(people.auditor, { csv: fixture("intake-inch-cfm.csv"), test: fields() })).status).toBe(403);
  });
});

describe("flow sheet PDF", () => {
  it("streams a PDF to any role, the auditor included", async () => {
    const { body: made } = await createAs(people.porter, record({ ambient: { temperature: 21, pressure: 100.8, relativeHumidityPercent: 40 } }));
    const res = await pdf(await request(`/api/flow-tests/${made.id}/pdf`, { as: people.auditor }), params({ id: String(made.id) }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe(`inline; filename="flow-test-${made.id}.pdf"`);
    const bytes = Buffer.from(await res.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    expect(bytes.length).toBeGreaterThan(2000);
    expect((await pdf(await request(`/api/flow-tests/99999/pdf`, { as: people.lead }), params({ id: "99999" }))).status).toBe(404);
    expect((await pdf(await request(`/api/flow-tests/${made.id}/pdf`), params({ id: String(made.id) }))).status).toBe(401);
  });
});
