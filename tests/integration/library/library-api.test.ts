/**
 * The library's API: who may create and edit each record (allowed and refused), the shared
 * schema's field messages, the audit trail, and server-side sort, filter and paging over a
 * 10,000-row table.
 */
import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listHeadTypes, POST as postHeadType } from "@/app/api/head-types/route";
import { PUT as putHeadType } from "@/app/api/head-types/[id]/route";
import { GET as listMastersRoute, POST as postMaster } from "@/app/api/masters/route";
import { GET as getMasterRoute, PUT as putMaster } from "@/app/api/masters/[id]/route";
import { POST as postPlate } from "@/app/api/plates/route";
import { POST as postMachine } from "@/app/api/machines/route";
import { PUT as putMachine } from "@/app/api/machines/[id]/route";
import { POST as postScan } from "@/app/api/scans/route";
import { POST as postProgram } from "@/app/api/programs/route";
import type { Db } from "@/db/client";
import { auditEvents, masterHeads } from "@/db/schema";
import { ROLES, type Role } from "@/db/enums";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { machineInput } from "../programs/world";

let db: Db;
const people = {} as Record<Role, TestUser>;

beforeAll(() => {
  db = freshAppDb();
  for (const r of ROLES) people[r] = makeUser(db, r);
});

const headType = (n: string) => ({ castingNumber: n, engineFamily: "Test six", cylinders: 6, valvesPerCylinder: 2, boreMm: 95, strokeMm: 88, intakeValveMm: 48, exhaustValveMm: 40 });
const post = async (handler: typeof postHeadType, url: string, as: TestUser, body: unknown) => json(await handler(await request(url, { as, json: body }), params({})));

describe("who may create what", () => {
  it.each([
    ["head type", postHeadType, "/api/head-types", ["lead", "admin"], (i: number) => headType(`RT-${i}`)],
    ["machine", postMachine, "/api/machines", ["admin"], (i: number) => machineInput(`Role cell ${i}`)],
  ] as const)("%s: only the roles allowed", async (_what, handler, url, allowed, body) => {
    let i = 0;
    for (const role of ROLES) {
      const res = await post(handler, url, people[role], body(i++));
      expect(res.status, role).toBe((allowed as readonly string[]).includes(role) ? 201 : 403);
    }
  });

  it("masters: porters, leads and admins; not machinists or auditors", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-M"))).body;
    let i = 0;
    for (const role of ROLES) {
      const res = await post(postMaster, "/api/masters", people[role], { label: `M-R${i++}`, headTypeId: ht.id });
      expect(res.status, role).toBe(["porter", "lead", "admin"].includes(role) ? 201 : 403);
    }
  });

  it("programs: machinists, leads and admins; scans refused to porters", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-P"))).body;
    let i = 0;
    for (const role of ROLES) {
      const res = await post(postProgram, "/api/programs", people[role], { headTypeId: ht.id, port: "exhaust", name: `P${i++}` });
      expect(res.status, role).toBe(["machinist", "lead", "admin"].includes(role) ? 201 : 403);
    }
    expect((await post(postScan, "/api/scans", people.porter, {})).status).toBe(403);
  });
});

describe("validation from the shared schema", () => {
  it("answers 422 with per-field messages", async () => {
    const res = await post(postHeadType, "/api/head-types", people.lead, { ...headType("RT-V"), boreMm: 5, intakeSeatIdMm: 60 });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.boreMm[0]).toMatch(/between 20 and 250 mm/);
    expect(res.body.error.fields.intakeSeatIdMm[0]).toMatch(/smaller than the valve/);
  });

  it("refuses a plate whose envelope is upside down, and a second plate with the same code", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-PL"))).body;
    const plate = { code: "FP-R1", headTypeId: ht.id, workOffsets: [{ code: "G54", x: 0, y: 0, z: 0 }], envelope: { min: { x: 10, y: -1, z: -1 }, max: { x: -10, y: 1, z: 1 } } };
    const bad = await post(postPlate, "/api/plates", people.lead, plate);
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields["envelope.max.x"]).toBeDefined();
    const ok = await post(postPlate, "/api/plates", people.lead, { ...plate, envelope: { min: { x: -10, y: -1, z: -1 }, max: { x: 10, y: 1, z: 1 } } });
    expect(ok.status).toBe(201);
    expect(ok.body.workOffsets).toEqual({ G54: { x: 0, y: 0, z: 0 } });
    const dup = await post(postPlate, "/api/plates", people.lead, { ...plate, envelope: { min: { x: -10, y: -1, z: -1 }, max: { x: 10, y: 1, z: 1 } } });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields.code).toBeDefined();
  });

  it("requires a rapid rate for every rotary axis the machine has", async () => {
    const m = machineInput("Rotary check");
    const res = await post(postMachine, "/api/machines", people.admin, { ...m, axes: "XYZABC" });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["limits.rapidPerMin.C"]).toBeDefined();
  });
});

describe("edits", () => {
  it("records before and after in the audit trail; an auditor cannot edit", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-E"))).body;
    const edit = { ...headType("RT-E"), notes: "thin wall under the short side" };
    const refused = await json(await putHeadType(await request(`/api/head-types/${ht.id}`, { as: people.auditor, method: "PUT", json: edit }), params({ id: String(ht.id) })));
    expect(refused.status).toBe(403);
    const ok = await json(await putHeadType(await request(`/api/head-types/${ht.id}`, { as: people.lead, method: "PUT", json: edit }), params({ id: String(ht.id) })));
    expect(ok.status).toBe(200);
    expect(ok.body.notes).toBe("thin wall under the short side");
    const ev = db.select().from(auditEvents).where(eq(auditEvents.action, "head_type.update")).all().at(-1)!;
    expect((ev.before as { notes: string }).notes).toBe("");
    expect((ev.after as { notes: string }).notes).toBe("thin wall under the short side");
  });

  it("keeps a master's measurements per port and shows them on its detail", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-MM"))).body;
    const m = (await post(postMaster, "/api/masters", people.porter, { label: "M-MEAS", headTypeId: ht.id })).body;
    const body = { label: "M-MEAS", headTypeId: ht.id, handPortNotes: { intake: "opened the bowl, laid back the short side" }, measurements: { intake: { throatMm: 42.5, portVolumeCc: 182 }, exhaust: {} } };
    const res = await json(await putMaster(await request(`/api/masters/${m.id}`, { as: people.porter, method: "PUT", json: body }), params({ id: String(m.id) })));
    expect(res.status).toBe(200);
    const detail = await json(await getMasterRoute(await request(`/api/masters/${m.id}`, { as: people.auditor }), params({ id: String(m.id) })));
    expect(detail.body.master.measurements).toEqual({ intake: { throatMm: 42.5, portVolumeCc: 182 }, exhaust: {} });
    expect(detail.body.master.porterId).toBe(people.porter.id);
  });

  it("lets only admins change a machine", async () => {
    const m = (await post(postMachine, "/api/machines", people.admin, machineInput("Edit cell"))).body;
    const body = { ...machineInput("Edit cell"), toolChangeS: 4.5 };
    expect((await json(await putMachine(await request(`/api/machines/${m.id}`, { as: people.lead, method: "PUT", json: body }), params({ id: String(m.id) })))).status).toBe(403);
    expect((await json(await putMachine(await request(`/api/machines/${m.id}`, { as: people.admin, method: "PUT", json: body }), params({ id: String(m.id) })))).body.toolChangeS).toBe(4.5);
  });
});

describe("tables with 10,000 rows", () => {
  it("sorts, filters and pages on the server", async () => {
    const ht = (await post(postHeadType, "/api/head-types", people.lead, headType("RT-BULK"))).body;
    const before = db.select({ n: count() }).from(masterHeads).get()!.n;
    db.transaction((tx) => {
      for (let i = 0; i < 10_000; i++) {
        tx.insert(masterHeads).values({ label: `BULK-${String(i).padStart(5, "0")}`, headTypeId: ht.id, handPortNotes: {}, measurements: {}, stage: i % 3 === 0 ? "digitized" : "hand_porting" }).run();
      }
    });
    const page = async (qs: string) => (await json(await listMastersRoute(await request(`/api/masters?${qs}`, { as: people.auditor }), params({})))).body;
    const first = await page("pageSize=50&sort=label&dir=desc&q=BULK");
    expect(first.total).toBe(10_000);
    expect(first.pageCount).toBe(200);
    expect(first.rows).toHaveLength(50);
    expect(first.rows[0].label).toBe("BULK-09999");
    const last = await page("pageSize=50&sort=label&dir=desc&q=BULK&page=200");
    expect(last.rows.at(-1).label).toBe("BULK-00000");
    const digitized = await page("pageSize=10&q=BULK&stage=digitized");
    expect(digitized.total).toBe(3334);
    const all = await page("pageSize=5");
    expect(all.total).toBe(before + 10_000);
    // An unknown sort key falls back instead of reaching SQL.
    expect((await page("sort=label;drop&pageSize=5")).rows).toHaveLength(5);
    const ht2 = await json(await listHeadTypes(await request("/api/head-types?q=RT-BULK", { as: people.porter }), params({})));
    expect(ht2.body.total).toBe(1);
  });
});
