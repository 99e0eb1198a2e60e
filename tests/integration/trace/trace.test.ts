/**
 * Trace and recall for the auditor: from a revision to every head it cut (with a CSV recall
 * list), from a head serial back to the master, and from a customer to the revisions that cut
 * their heads.
 */
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as traceRevisionRoute } from "@/app/api/trace/revisions/[id]/route";
import { GET as recallRoute } from "@/app/api/trace/revisions/[id]/recall/route";
import { GET as traceHeadRoute } from "@/app/api/trace/heads/[serial]/route";
import { GET as traceCustomerRoute } from "@/app/api/trace/customers/[id]/route";
import { GET as traceListRoute } from "@/app/api/trace/revisions/route";
import type { Db } from "@/db/client";
import { fixturePlates, flowPoints, flowTests, masterHeads, revisions, scans } from "@/db/schema";
import { eq } from "drizzle-orm";
import { recordCut } from "@/lib/jobs/cuts";
import { createCustomer } from "@/lib/jobs/customers";
import { createHead } from "@/lib/jobs/heads";
import { chooseRevision, createJob, moveJob } from "@/lib/jobs/jobs";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { makeRevision, makeShopSetup } from "../jobs/factory";

let db: Db;
let lead: TestUser, machinist: TestUser, auditor: TestUser;
let shop: ReturnType<typeof makeShopSetup>;
let customerA: { id: number }, customerB: { id: number };
const t0 = Date.UTC(2026, 11, 2, 8, 0, 0);

beforeAll(async () => {
  db = freshAppDb();
  lead = makeUser(db, "lead");
  machinist = makeUser(db, "machinist", { name: "Ansel Brightwater" });
  auditor = makeUser(db, "auditor");
  shop = makeShopSetup(db);
  // The intake revision descends from a master through a scan.
  const plate = db.insert(fixturePlates).values({ code: "FP-TRACE", headTypeId: shop.headType.id, workOffsets: {}, portAxisAngles: {}, envelope: { min: { x: -1, y: -1, z: -1 }, max: { x: 1, y: 1, z: 1 } } }).returning().get();
  const master = db.insert(masterHeads).values({ label: "M-TRACE-01", headTypeId: shop.headType.id, stage: "digitized", handPortNotes: {}, measurements: {} }).returning().get();
  const scan = db.insert(scans).values({ masterId: master.id, plateId: plate.id, machineId: shop.machine.id, port: "intake", stylusDiameterMm: 2, pointSpacingMm: 0.25, scannedOn: "2026-10-01" }).returning().get();
  // Linking the scan means building a fresh revision (a released one is immutable).
  const linked = makeRevision(db, shop.intakeProgram.id, { letter: "B", state: "draft" });
  db.update(revisions).set({ sourceScanId: scan.id }).where(eq(revisions.id, linked.revision.id)).run();
  db.update(revisions).set({ state: "released", releasedAt: t0 }).where(eq(revisions.id, linked.revision.id)).run();
  shop.intake = { ...linked, revision: db.select().from(revisions).where(eq(revisions.id, linked.revision.id)).get()! };
  const mft = db.insert(flowTests).values({ subject: "master", headTypeId: shop.headType.id, masterId: master.id, port: "intake", depressionInH2O: 28, valveDiameterMm: 51.3, testedOn: "2026-09-20" }).returning().get();
  db.insert(flowPoints).values([{ flowTestId: mft.id, liftMm: 6, flowCfm: 180 }, { flowTestId: mft.id, liftMm: 12, flowCfm: 290 }]).run();

  customerA = createCustomer(db, lead, { name: "Harrow & Vale Speed", contactName: "=HYPERLINK(\"x\")", email: "shop@harrowvale.invalid", phone: "+00 555 0100" });
  customerB = createCustomer(db, lead, { name: "Pellucid Motor Works", email: "bench@pellucid.invalid" });
  for (const [customer, serial, outcome] of [
    [customerA, "HV-0001", "good"],
    [customerB, "PM-0002", "scrap"],
  ] as const) {
    const job = createJob(db, lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 1, machineId: shop.machine.id, cutExhaust: false });
    chooseRevision(db, lead, job.id, { port: "intake", revisionId: shop.intake.revision.id });
    await moveJob(db, lead, job.id, { to: "scheduled" });
    const head = createHead(db, machinist, { jobId: job.id, serial, source: "customer_core" });
    recordCut(db, machinist, {
      headId: head.id,
      port: "intake",
      startedAt: t0,
      endedAt: t0 + 50 * 60_000,
      outcome,
      cylinder: outcome === "scrap" ? 6 : null,
      reason: outcome === "scrap" ? "broke into the water jacket under the short side, cylinder 6" : null,
    });
  }
});
afterAll(() => undefined);

const rid = () => String(shop.intake.revision.id);

describe("trace by revision", () => {
  it("lists the revision's jobs and tallies its cuts", async () => {
    const res = await json(await traceRevisionRoute(await request(`/api/trace/revisions/${rid()}`, { as: auditor }), params({ id: rid() })));
    expect(res.status).toBe(200);
    expect(res.body.summary).toEqual({ cuts: 2, heads: 2, jobs: 2, customers: 2, byOutcome: { good: 1, rework: 0, scrap: 1 } });
    expect(res.body.jobs).toHaveLength(2);
    expect(res.body.lineage.master.label).toBe("M-TRACE-01");
    expect(res.body.lineage.scan.plateCode).toBe("FP-TRACE");
    const list = await json(await traceListRoute(await request("/api/trace/revisions", { as: auditor }), params({})));
    expect(list.body.revisions.find((r: { id: number }) => r.id === shop.intake.revision.id).cuts).toBe(2);
  });

  it("exports a recall list naming both heads, their customers and the checksum each was cut with", async () => {
    const res = await recallRoute(await request(`/api/trace/revisions/${rid()}/recall`, { as: auditor }), params({ id: rid() }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="recall-.*\.csv"/);
    const text = await res.text();
    // papaparse (a general-purpose CSV library) as the reference reader of our RFC 4180 output.
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const bySerial = Object.fromEntries(parsed.data.map((r) => [r.head_serial, r]));
    expect(Object.keys(bySerial).sort()).toEqual(["HV-0001", "PM-0002"]);
    expect(bySerial["HV-0001"]).toMatchObject({ customer: "Harrow & Vale Speed", email: "shop@harrowvale.invalid", outcome: "Good", operator: "Ansel Brightwater", matches_revision_file: "yes" });
    expect(bySerial["PM-0002"]).toMatchObject({ outcome: "Scrapped", cylinder: "6", reason: "broke into the water jacket under the short side, cylinder 6" });
    expect(bySerial["HV-0001"]!.toolpath_sha256_at_cut).toBe(shop.intake.file!.sha256);
    expect(bySerial["HV-0001"]!.cut_started_utc).toBe("2026-12-02T08:00:00Z");
    // A contact typed as a formula is neutralised for spreadsheets.
    expect(bySerial["HV-0001"]!.contact).toBe("'=HYPERLINK(\"x\")");
  });

  it("is readable by the auditor but needs a session", async () => {
    const anon = await recallRoute(await request(`/api/trace/revisions/${rid()}/recall`), params({ id: rid() }));
    expect(anon.status).toBe(401);
    const missing = await traceRevisionRoute(await request("/api/trace/revisions/99999", { as: auditor }), params({ id: "99999" }));
    expect(missing.status).toBe(404);
  });
});

describe("trace by head serial", () => {
  it("walks master → scan → revision → file hash → flow tests → job → customer", async () => {
    const res = await json(await traceHeadRoute(await request("/api/trace/heads/HV-0001", { as: auditor }), params({ serial: "HV-0001" })));
    expect(res.status).toBe(200);
    const l = res.body;
    expect(l.customer.name).toBe("Harrow & Vale Speed");
    expect(l.job.number).toMatch(/^J-/);
    expect(l.cuts).toHaveLength(1);
    expect(l.cuts[0]).toMatchObject({ toolpathSha256: shop.intake.file!.sha256, checksumMatches: true, outcome: "good" });
    expect(l.revisions[0].master.label).toBe("M-TRACE-01");
    expect(l.revisions[0].scan.scannedOn).toBe("2026-10-01");
    expect(l.flow.masters).toHaveLength(1);
    expect(l.flow.masters[0].peak.atLiftMm).toBe(12);
    const none = await traceHeadRoute(await request("/api/trace/heads/NOPE", { as: auditor }), params({ serial: "NOPE" }));
    expect(none.status).toBe(404);
  });
});

describe("trace by customer", () => {
  it("lists the customer's heads and the revisions that cut them", async () => {
    const res = await json(await traceCustomerRoute(await request(`/api/trace/customers/${customerB.id}`, { as: auditor }), params({ id: String(customerB.id) })));
    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(1);
    expect(res.body.rows[0]).toMatchObject({ headSerial: "PM-0002", revisionLabel: `${shop.intakeProgram.name} B`, outcomes: "scrap", cuts: 1 });
  });
});
