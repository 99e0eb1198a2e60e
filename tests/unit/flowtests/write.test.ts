import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { auditEvents, flowPoints, flowTests, headTypes, masterHeads, programs, revisions, users, type Role } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { createFlowTest, deleteFlowTest, updateFlowTest } from "@/lib/flowtests/write";
import type { FlowTestRecordInput } from "@/lib/flowtests/schema";
import { importFlowTestCsv } from "@/lib/flowtests/import";
import { freshDb } from "../../support/db";

let db: Db;
let people: Record<Role, Actor>;
let headTypeId: number;
let otherTypeId: number;

function person(role: Role): Actor {
  const row = db.insert(users).values({ email: `${role}@t.invalid`, name: `A ${role}`, role }).returning().get();
  return { id: row.id, email: row.email, name: row.name, role };
}

const headType = (casting: string) =>
  db
    .insert(headTypes)
    .values({ castingNumber: casting, engineFamily: "Invented V8", cylinders: 8, valvesPerCylinder: 2, boreMm: 101.6, strokeMm: 88.4, intakeValveMm: 51.31, exhaustValveMm: 40.64 })
    .returning()
    .get().id;

beforeEach(() => {
  db = freshDb();
  people = { porter: person("porter"), machinist: person("machinist"), lead: person("lead"), auditor: person("auditor"), admin: person("admin") };
  headTypeId = headType("HT-1");
  otherTypeId = headType("HT-2");
});

const record = (over: Partial<FlowTestRecordInput> = {}): FlowTestRecordInput => ({
  headTypeId,
  subject: "baseline",
  port: "intake",
  testedOn: "2025-03-04",
  depression: 28,
  valveDiameter: 51.31,
  points: [
    { lift: 2.54, flow: 60 },
    { lift: 5.08, flow: 110 },
  ],
  ...over,
});

const code = (fn: () => unknown) => {
  try {
    fn();
  } catch (err) {
    return err instanceof AppError ? { code: err.code, fields: err.fields } : { code: "other", fields: undefined };
  }
  return { code: "none", fields: undefined };
};
const auditOf = (action: string) => db.select().from(auditEvents).where(eq(auditEvents.action, action)).all();

describe("recording a flow test", () => {
  it("lets the porter, machinist, lead and admin record, not the auditor", () => {
    for (const role of ["porter", "machinist", "lead", "admin"] as const) {
      expect(createFlowTest(db, people[role], record()).id).toBeGreaterThan(0);
    }
    expect(code(() => createFlowTest(db, people.auditor, record())).code).toBe("forbidden");
    expect(code(() => createFlowTest(db, null, record())).code).toBe("unauthenticated");
    expect(db.select().from(flowTests).all()).toHaveLength(4);
  });

  it("stores the points and one audit event with the lift table", () => {
    const saved = createFlowTest(db, people.porter, record());
    expect(db.select().from(flowPoints).where(eq(flowPoints.flowTestId, saved.id)).all()).toHaveLength(2);
    const [event] = auditOf("flow_test.create");
    expect(event.entityId).toBe(String(saved.id));
    expect((event.after as { points: number[][] }).points).toEqual([
      [2.54, 60],
      [5.08, 110],
    ]);
    expect(saved.operatorId).toBe(people.porter.id);
  });

  it("refuses links that do not fit the casting or the port", () => {
    const master = db.insert(masterHeads).values({ label: "M-X", headTypeId: otherTypeId, handPortNotes: {}, measurements: {} }).returning().get().id;
    expect(code(() => createFlowTest(db, people.porter, record({ subject: "master", masterId: master }))).fields).toHaveProperty("masterId");
    const program = db.insert(programs).values({ headTypeId, port: "exhaust", name: "Ex" }).returning().get().id;
    const rev = db.insert(revisions).values({ programId: program, letter: "A" }).returning().get().id;
    const refused = code(() => createFlowTest(db, people.porter, record({ subject: "revision", revisionId: rev })));
    expect(refused.code).toBe("invalid");
    expect(refused.fields?.revisionId?.[0]).toMatch(/exhaust port/);
    expect(createFlowTest(db, people.porter, record({ subject: "revision", revisionId: rev, port: "exhaust", valveDiameter: 40.64 })).revisionId).toBe(rev);
    expect(code(() => createFlowTest(db, people.porter, record({ cylinder: 9 }))).fields).toHaveProperty("cylinder");
    expect(code(() => createFlowTest(db, people.porter, record({ operatorId: people.auditor.id }))).fields).toHaveProperty("operatorId");
    expect(db.select().from(flowTests).all()).toHaveLength(1);
  });
});

describe("changing and deleting", () => {
  it("lets only the lead and admin change a test, with before and after in the audit trail", () => {
    const saved = createFlowTest(db, people.porter, record());
    expect(code(() => updateFlowTest(db, people.porter, saved.id, record({ notes: "x" }))).code).toBe("forbidden");
    expect(code(() => updateFlowTest(db, people.machinist, saved.id, record({ notes: "x" }))).code).toBe("forbidden");
    const changed = updateFlowTest(db, people.lead, saved.id, record({ notes: "re-checked", points: [{ lift: 2.54, flow: 61 }] }));
    expect(changed.notes).toBe("re-checked");
    expect(changed.operatorId).toBe(people.porter.id); // the operator stays
    expect(db.select().from(flowPoints).where(eq(flowPoints.flowTestId, saved.id)).all()).toEqual([expect.objectContaining({ liftMm: 2.54, flowCfm: 61 })]);
    const [event] = auditOf("flow_test.update");
    expect((event.before as { notes: string; points: number[][] }).points).toHaveLength(2);
    expect((event.after as { notes: string }).notes).toBe("re-checked");
    expect(code(() => updateFlowTest(db, people.admin, 999, record())).code).toBe("not_found");
  });

  it("lets only the lead and admin delete, keeps the deleted test in the audit trail", () => {
    const saved = createFlowTest(db, people.porter, record());
    for (const role of ["porter", "machinist", "auditor"] as const) expect(code(() => deleteFlowTest(db, people[role], saved.id)).code).toBe("forbidden");
    deleteFlowTest(db, people.admin, saved.id);
    expect(db.select().from(flowTests).all()).toHaveLength(0);
    expect(db.select().from(flowPoints).all()).toHaveLength(0);
    const [event] = auditOf("flow_test.delete");
    expect((event.before as { valveDiameterMm: number }).valveDiameterMm).toBe(51.31);
  });
});

describe("CSV import verb", () => {
  const fields = { headTypeId: 0, subject: "baseline", port: "intake", testedOn: "2025-03-04", depression: 28, valveDiameter: 1.8, lengthUnit: "in" };

  it("stores nothing and names each bad line when a row is malformed", () => {
    const csv = "lift_in,flow_cfm\n0.100,68.0\n0.200,abc\n0.300,176\n";
    const r = code(() => importFlowTestCsv(db, people.porter, { csv, test: { ...fields, headTypeId } }));
    expect(r.code).toBe("invalid");
    expect(Object.keys(r.fields ?? {})).toEqual(["rows.3"]);
    expect(db.select().from(flowTests).all()).toHaveLength(0);
  });

  it("names the file's line when the math refuses a point", () => {
    // 2.0 in lift on a 1.8 in valve: a unit mix-up the flow schema catches.
    const csv = "lift_in,flow_cfm\n0.1,68\n\n2.0,176\n";
    const r = code(() => importFlowTestCsv(db, people.porter, { csv, test: { ...fields, headTypeId } }));
    expect(r.fields?.["rows.4"]?.[0]).toMatch(/larger than the valve/);
  });

  it("stores a valid file in mm and cfm", () => {
    const saved = importFlowTestCsv(db, people.machinist, { csv: "lift_in,flow_cfm\n0.1,68\n0.2,128.5\n", test: { ...fields, headTypeId } });
    expect(saved.points).toEqual([
      { liftMm: 2.54, flowCfm: 68 },
      { liftMm: 5.08, flowCfm: 128.5 },
    ]);
    expect(saved.valveDiameterMm).toBe(45.72);
    expect(saved.import.units).toEqual({ lift: "in", flow: "cfm" });
  });
});
