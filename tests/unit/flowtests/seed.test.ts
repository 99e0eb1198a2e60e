import { describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { getFlowTests, listFlowTests } from "@/db/queries/flow-tests";
import { auditEvents, masterHeads, programs, revisions, users } from "@/db/schema";
import { seedFlow } from "@/db/seed/flow";
import { seedLibrary } from "@/db/seed/library";
import { computeStored } from "@/lib/flowtests/normalize";
import { tableQuerySchema } from "@/lib/paging";
import { freshDb } from "../../support/db";

function shop(): { db: Db; people: { porter: number; machinist: number }; headTypeId: number } {
  const db = freshDb();
  const porter = db.insert(users).values({ email: "p@t.invalid", name: "P", role: "porter" }).returning().get().id;
  const machinist = db.insert(users).values({ email: "m@t.invalid", name: "M", role: "machinist" }).returning().get().id;
  const library = seedLibrary(db);
  return { db, people: { porter, machinist }, headTypeId: library.headTypeIds[0] };
}

const all = (db: Db) => listFlowTests(db, tableQuerySchema.parse({ pageSize: 100, sort: "id" })).rows;

describe("flow demo data", () => {
  it("records stock baselines of both ports when no master or revision exists yet", () => {
    const { db, people } = shop();
    seedFlow(db, { people });
    const rows = all(db);
    expect(rows.map((r) => [r.subject, r.port, r.castingNumber])).toEqual([
      ["baseline", "intake", "HL-4471-A"],
      ["baseline", "exhaust", "HL-4471-A"],
    ]);
    expect(rows.map((r) => r.valveDiameterMm)).toEqual([51.31, 40.64]);
    // Each recorded through the verb, so each has its audit event.
    expect(db.select().from(auditEvents).all().filter((e) => e.action === "flow_test.create")).toHaveLength(2);
  });

  it("links tests to master M-4471-01 and the Street revisions when they exist, and they compute", () => {
    const { db, people, headTypeId } = shop();
    const master = db.insert(masterHeads).values({ label: "M-4471-01", headTypeId, handPortNotes: {}, measurements: {} }).returning().get().id;
    const intake = db.insert(programs).values({ headTypeId, port: "intake", name: "Street intake" }).returning().get().id;
    const exhaust = db.insert(programs).values({ headTypeId, port: "exhaust", name: "Street exhaust" }).returning().get().id;
    const revA = db.insert(revisions).values({ programId: intake, letter: "A" }).returning().get().id;
    const revB = db.insert(revisions).values({ programId: intake, letter: "B", parentId: revA }).returning().get().id;
    const exA = db.insert(revisions).values({ programId: exhaust, letter: "A" }).returning().get().id;
    seedFlow(db, { people });

    const rows = all(db);
    expect(rows).toHaveLength(7);
    expect(rows.filter((r) => r.masterId === master).map((r) => r.port)).toEqual(["intake", "exhaust"]);
    expect(rows.filter((r) => r.revisionId === revB).map((r) => r.subjectLabel)).toEqual(["Street intake · rev B"]);
    expect(rows.filter((r) => r.revisionId === exA)).toHaveLength(1);

    const tests = getFlowTests(db, rows.map((r) => r.id));
    const peaks = new Map<number, number>();
    for (const t of tests) {
      const c = computeStored(t, t.points);
      expect(c.ok, `test ${t.id}`).toBe(true);
      if (c.ok) peaks.set(t.id, c.result.summary.peakFlowCfmAt28);
    }
    // The ported master out-flows the stock baseline of the same port (invented curves, by design).
    const stockIntake = rows.find((r) => r.subject === "baseline" && r.port === "intake")!.id;
    const masterIntake = rows.find((r) => r.masterId === master && r.port === "intake")!.id;
    expect(peaks.get(masterIntake)!).toBeGreaterThan(peaks.get(stockIntake)! * 1.15);
    // The 25 inH₂O exhaust test is stored at its own depression.
    expect(rows.find((r) => r.masterId === master && r.port === "exhaust")!.depressionInH2O).toBe(25);
  });
});
