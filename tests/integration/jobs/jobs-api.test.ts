/**
 * Customers, jobs, heads and cuts through their route handlers: the roles, the revision rules
 * (only a released revision can be chosen; a cut only with the job's chosen revision, its
 * checksum frozen), the moves, the flag when a revision in use ends, and the e-mails.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { GET as listCustomersRoute, POST as createCustomerRoute } from "@/app/api/customers/route";
import { PATCH as patchCustomerRoute } from "@/app/api/customers/[id]/route";
import { GET as listJobsRoute, POST as createJobRoute } from "@/app/api/jobs/route";
import { GET as getJobRoute, PATCH as patchJobRoute } from "@/app/api/jobs/[id]/route";
import { PUT as chooseRoute } from "@/app/api/jobs/[id]/revision/route";
import { POST as moveRoute } from "@/app/api/jobs/[id]/state/route";
import { GET as scheduleRoute } from "@/app/api/jobs/schedule/route";
import { POST as createHeadRoute } from "@/app/api/heads/route";
import { GET as listCutsRoute, POST as createCutRoute } from "@/app/api/cuts/route";
import { PATCH as patchCutRoute } from "@/app/api/cuts/[id]/route";
import type { Db } from "@/db/client";
import { auditEvents, cuts, flowPoints, flowTests, heads, jobs } from "@/db/schema";
import { notifyJobsOfRevisionChange } from "@/lib/jobs/notices";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { startMailCatcher, type MailCatcher } from "../support/fakes";
import { makeHeadType, makeProgram, makeRevision, makeShopSetup, moveRevision } from "./factory";

let db: Db;
let mail: MailCatcher;
let lead: TestUser, admin: TestUser, machinist: TestUser, porter: TestUser, auditor: TestUser;
let shop: ReturnType<typeof makeShopSetup>;

beforeAll(async () => {
  mail = await startMailCatcher();
  process.env.SMTP_HOST = mail.host;
  process.env.SMTP_PORT = String(mail.port);
  db = freshAppDb();
  lead = makeUser(db, "lead");
  admin = makeUser(db, "admin");
  machinist = makeUser(db, "machinist");
  porter = makeUser(db, "porter");
  auditor = makeUser(db, "auditor");
  shop = makeShopSetup(db, { intake: { cycleTimeS: 540 }, exhaust: { cycleTimeS: 420 } });
});
afterAll(async () => {
  await mail.stop();
});
beforeEach(() => mail.clear());

const none = params({});
const post = async (route: typeof createCustomerRoute, url: string, as: TestUser, body: unknown) => json(await route(await request(url, { as, json: body }), none));

async function newCustomer(name = "Ferrous Lane Racing") {
  const res = await post(createCustomerRoute, "/api/customers", lead, { name, contactName: "Odile Marsh", email: "odile@ferrous-lane.invalid" });
  expect(res.status).toBe(201);
  return res.body as { id: number; name: string };
}

async function newJob(extra: Record<string, unknown> = {}) {
  const customer = await newCustomer(`Customer ${Math.random().toString(36).slice(2, 7)}`);
  const res = await post(createJobRoute, "/api/jobs", lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 2, machineId: shop.machine.id, dueOn: "2026-12-18", setupMinutes: 45, ...extra });
  expect(res.status).toBe(201);
  return res.body as { id: number; number: string; customerId: number };
}

const choose = async (jobId: number, port: string, revisionId: number | null, as: TestUser = lead) =>
  json(await chooseRoute(await request(`/api/jobs/${jobId}/revision`, { method: "PUT", as, json: { port, revisionId } }), params({ id: String(jobId) })));
const move = async (jobId: number, to: string, as: TestUser = lead) =>
  json(await moveRoute(await request(`/api/jobs/${jobId}/state`, { as, json: { to } }), params({ id: String(jobId) })));
const detail = async (jobId: number) => json(await getJobRoute(await request(`/api/jobs/${jobId}`, { as: porter }), params({ id: String(jobId) })));

async function scheduledJob() {
  const job = await newJob();
  expect((await choose(job.id, "intake", shop.intake.revision.id)).status).toBe(200);
  expect((await choose(job.id, "exhaust", shop.exhaust.revision.id)).status).toBe(200);
  expect((await move(job.id, "scheduled")).status).toBe(200);
  return job;
}

async function addHead(jobId: number, serial: string) {
  const res = await post(createHeadRoute, "/api/heads", machinist, { jobId, serial, source: "customer_core", incomingNotes: "no cracks at the seats" });
  expect(res.status).toBe(201);
  return res.body as { id: number; serial: string; castingNumber: string };
}

const cut = async (body: Record<string, unknown>, as: TestUser = machinist) => post(createCutRoute, "/api/cuts", as, { startedAt: Date.now() - 3_600_000, endedAt: Date.now(), ...body });

describe("customers", () => {
  it("lets the lead create and edit a customer, with an audit event for each, and refuses the porter", async () => {
    const created = await newCustomer("Quillstone Engines");
    const patched = await json(await patchCustomerRoute(await request(`/api/customers/${created.id}`, { method: "PATCH", as: lead, json: { phone: "+00 555 0142" } }), params({ id: String(created.id) })));
    expect(patched.status).toBe(200);
    expect(patched.body.phone).toBe("+00 555 0142");
    const events = db.select().from(auditEvents).where(and(eq(auditEvents.entity, "customer"), eq(auditEvents.entityId, String(created.id)))).all();
    expect(events.map((e) => e.action)).toEqual(["customer.create", "customer.update"]);
    expect(events[1]!.before).toEqual({ phone: "" });

    const refused = await post(createCustomerRoute, "/api/customers", porter, { name: "Nope Ltd" });
    expect(refused.status).toBe(403);
    const bad = await post(createCustomerRoute, "/api/customers", lead, { name: "X", email: "not-an-address" });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["name", "email"]));

    const list = await json(await listCustomersRoute(await request("/api/customers?q=quill", { as: auditor }), none));
    expect(list.body.rows.map((r: { name: string }) => r.name)).toEqual(["Quillstone Engines"]);
  });
});

describe("choosing a revision", () => {
  it("accepts the released revision of the job's casting and port", async () => {
    const job = await newJob();
    const res = await choose(job.id, "intake", shop.intake.revision.id);
    expect(res.status).toBe(200);
    expect(res.body.intakeRevisionId).toBe(shop.intake.revision.id);
    const audit = db.select().from(auditEvents).where(and(eq(auditEvents.action, "job.choose_revision"), eq(auditEvents.entityId, String(job.id)))).get();
    expect(audit?.after).toEqual({ port: "intake", revisionId: shop.intake.revision.id });
  });

  it("refuses a revision that is not released, naming its state and the released one", async () => {
    const job = await newJob();
    for (const state of ["draft", "proving", "superseded", "withdrawn"] as const) {
      const other = makeRevision(db, shop.intakeProgram.id, { state });
      const res = await choose(job.id, "intake", other.revision.id);
      expect(res.status).toBe(422);
      expect(res.body.error.message).toContain(`is ${state}`);
      expect(res.body.error.message).toContain("only a released revision can be chosen");
      expect(res.body.error.message).toContain(`${shop.intakeProgram.name} A`);
      expect(res.body.error.fields.revisionId).toHaveLength(1);
    }
    expect(db.select().from(jobs).where(eq(jobs.id, job.id)).get()!.intakeRevisionId).toBeNull();
  });

  it("refuses a revision of the other port or of another casting", async () => {
    const job = await newJob();
    const wrongPort = await choose(job.id, "intake", shop.exhaust.revision.id);
    expect(wrongPort.status).toBe(422);
    expect(wrongPort.body.error.message).toMatch(/cuts the exhaust port, not the intake port/);
    const otherType = makeHeadType(db);
    const foreign = makeRevision(db, makeProgram(db, otherType.id, "intake").id);
    const wrongCasting = await choose(job.id, "intake", foreign.revision.id);
    expect(wrongCasting.status).toBe(422);
    expect(wrongCasting.body.error.message).toContain("belongs to another casting");
  });

  it("is for the lead and the administrator only", async () => {
    const job = await newJob();
    for (const who of [machinist, porter, auditor]) expect((await choose(job.id, "intake", shop.intake.revision.id, who)).status).toBe(403);
    expect((await choose(job.id, "intake", shop.intake.revision.id, admin)).status).toBe(200);
  });
});

describe("moving a job", () => {
  it("will not schedule a job without a machine and released revisions, and says what is missing", async () => {
    const job = await newJob({ machineId: null });
    const res = await move(job.id, "scheduled");
    expect(res.status).toBe(409);
    expect(res.body.error.fields.to).toEqual(
      expect.arrayContaining(["Choose the machine that cuts this job.", "Choose the released revision for the intake port.", "Choose the released revision for the exhaust port."]),
    );
    expect((await move(job.id, "shipped")).status).toBe(409);
  });

  it("shows the planned machine time: cycle × ports per head × heads + setup", async () => {
    const job = await scheduledJob();
    const { body } = await detail(job.id);
    // Test V8 casting: 8 cylinders on two heads → 4 ports of each kind per head (derived).
    expect(body.portsPerHead).toBe(4);
    expect(body.portsPerHeadDerived).toBe(true);
    const expected = 540 * 4 * 2 + 420 * 4 * 2 + 45 * 60;
    expect(body.plan).toMatchObject({ known: true, totalS: expected, setupS: 45 * 60 });
    const schedule = await json(await scheduleRoute(await request("/api/jobs/schedule", { as: porter }), none));
    const machine = schedule.body.machines.find((m: { machineId: number }) => m.machineId === shop.machine.id);
    const week = machine.weeks.find((w: { week: string }) => w.week === "2026-W51");
    expect(week.jobs.map((j: { number: string }) => j.number)).toContain(job.number);
    expect(week.committedS).toBeGreaterThanOrEqual(expected);
  });

  it("says 'not yet analysed' rather than a wrong figure when a revision has no analysis", async () => {
    const program = makeProgram(db, shop.headType.id, "intake");
    const unanalysed = makeRevision(db, program.id, { cycleTimeS: null });
    const job = await newJob({ cutExhaust: false });
    expect((await choose(job.id, "intake", unanalysed.revision.id)).status).toBe(200);
    const { body } = await detail(job.id);
    expect(body.plan).toEqual({ known: false, reason: "not_analysed", ports: ["intake"] });
  });
});

describe("heads and cuts", () => {
  it("records a good cut with the job's revision, freezes the toolpath checksum and puts the job on the machine", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-1`);
    expect(head.castingNumber).toBe(shop.headType.castingNumber);
    const res = await cut({ headId: head.id, port: "intake", outcome: "good" });
    expect(res.status).toBe(201);
    expect(res.body.cut.revisionId).toBe(shop.intake.revision.id);
    expect(res.body.cut.toolpathSha256).toBe(shop.intake.file!.sha256);
    expect(res.body.cut.operatorId).toBe(machinist.id);
    expect(res.body.headState).toBe("cutting");
    expect(db.select().from(jobs).where(eq(jobs.id, job.id)).get()!.state).toBe("on_machine");

    const second = await cut({ headId: head.id, port: "exhaust", outcome: "good" });
    expect(second.body.headState).toBe("cut");

    // The database refuses to change a recorded checksum, whatever the code does.
    expect(() => db.update(cuts).set({ toolpathSha256: "0".repeat(64) }).where(eq(cuts.id, res.body.cut.id)).run()).toThrow(/frozen/);
  });

  it("refuses a cut against any revision but the job's chosen one", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-2`);
    const other = makeRevision(db, shop.intakeProgram.id, { state: "released" });
    const res = await cut({ headId: head.id, port: "intake", outcome: "good", revisionId: other.revision.id });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain("a cut can only be recorded against the job's chosen revision");
    expect(db.select().from(cuts).where(eq(cuts.headId, head.id)).all()).toHaveLength(0);
  });

  it("needs a reason for scrap, marks the head scrapped and takes no more cuts on it", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-3`);
    const noReason = await cut({ headId: head.id, port: "intake", outcome: "scrap" });
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields.reason[0]).toMatch(/Say why/);
    const scrapped = await cut({ headId: head.id, port: "intake", outcome: "scrap", cylinder: 6, reason: "broke into the water jacket under the short side" });
    expect(scrapped.status).toBe(201);
    expect(scrapped.body.headState).toBe("scrapped");
    const again = await cut({ headId: head.id, port: "exhaust", outcome: "good" });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/scrapped/);
  });

  it("is recorded by shop-floor roles only", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-4`);
    expect((await cut({ headId: head.id, port: "intake", outcome: "good" }, porter)).status).toBe(403);
    expect((await cut({ headId: head.id, port: "intake", outcome: "good" }, auditor)).status).toBe(403);
    const list = await json(await listCutsRoute(await request(`/api/cuts?jobId=${job.id}`, { as: auditor }), none));
    expect(list.body.total).toBe(0);
  });

  it("keeps heads within the job's quantity and serials unique", async () => {
    const job = await newJob({ quantity: 1 });
    await addHead(job.id, `SN-${job.id}-Q1`);
    const over = await post(createHeadRoute, "/api/heads", machinist, { jobId: job.id, serial: `SN-${job.id}-Q2`, source: "shop_stock" });
    expect(over.status).toBe(409);
    expect(over.body.error.message).toMatch(/already has its 1 head/);
    const other = await newJob();
    const dup = await post(createHeadRoute, "/api/heads", machinist, { jobId: other.id, serial: `SN-${job.id}-Q1`, source: "shop_stock" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields.serial).toBeDefined();
  });

  it("lets a cut's outcome change after inspection, with the reason and an audit event", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-5`);
    const good = await cut({ headId: head.id, port: "intake", outcome: "good" });
    const id = good.body.cut.id as number;
    const patch = async (body: unknown) => patchCutRoute(await request(`/api/cuts/${id}`, { method: "PATCH", as: machinist, json: body }), params({ id: String(id) }));
    const noReason = await json(await patch({ outcome: "rework" }));
    expect(noReason.status).toBe(422);
    const rework = await json(await patch({ outcome: "rework", reason: "core shift: wall thin at the pushrod pinch" }));
    expect(rework.status).toBe(200);
    expect(rework.body.cut.outcome).toBe("rework");
    const ev = db.select().from(auditEvents).where(and(eq(auditEvents.action, "cut.update"), eq(auditEvents.entityId, String(id)))).get();
    expect(ev?.before).toEqual({ outcome: "good", reason: null });
  });
});

describe("when a revision in use ends", () => {
  it("flags the open jobs that use it (page and list) and e-mails the leads", async () => {
    const program = makeProgram(db, shop.headType.id, "intake", "Street intake (flag test)");
    const rev = makeRevision(db, program.id, { letter: "B" });
    const job = await newJob({ cutExhaust: false });
    expect((await choose(job.id, "intake", rev.revision.id)).status).toBe(200);
    expect((await detail(job.id)).body.ports[0].flagged).toBe(false);

    moveRevision(db, rev.revision.id, "withdrawn", "flow loss found at high lift");
    const page = (await detail(job.id)).body;
    expect(page.ports[0].flagged).toBe(true);
    const flaggedList = await json(await listJobsRoute(await request("/api/jobs?flagged=1", { as: auditor }), none));
    expect(flaggedList.body.rows.map((r: { number: string }) => r.number)).toContain(job.number);
    expect(flaggedList.body.rows.every((r: { flagged: boolean }) => r.flagged)).toBe(true);

    const notice = await notifyJobsOfRevisionChange(db, rev.revision.id);
    expect(notice.jobs).toContain(job.number);
    expect(notice.sent).toBe(true);
    const caught = await mail.waitFor((m) => m.envelopeTo.includes(lead.email));
    expect(caught.subject).toContain("Street intake (flag test) B was withdrawn");
    expect(caught.text).toContain(job.number);
    expect(caught.text).toContain("flow loss found at high lift");
    expect(caught.text).toContain(`/jobs/${job.id}`);
    // Not the porter: only leads (or admins when there is no lead).
    expect(mail.mails.some((m) => m.envelopeTo.includes(porter.email))).toBe(false);
    // And cutting with it is refused from now on.
    expect((await move(job.id, "scheduled")).status).toBe(409);
  });

  it("tells nobody while the revision is still released", async () => {
    const notice = await notifyJobsOfRevisionChange(db, shop.intake.revision.id);
    expect(notice.sent).toBe(false);
    expect(mail.mails).toHaveLength(0);
  });
});

describe("shipping", () => {
  it("ships the finished heads and e-mails the customer the heads, ports, revisions and flow results", async () => {
    const job = await scheduledJob();
    const head = await addHead(job.id, `SN-${job.id}-S1`);
    await cut({ headId: head.id, port: "intake", outcome: "good" });
    await cut({ headId: head.id, port: "exhaust", outcome: "good" });
    // A post-cut flow test on the head, at 28 inH2O so its corrected peak is the measured peak (dry standard air aside).
    const ft = db
      .insert(flowTests)
      .values({ subject: "head", headTypeId: shop.headType.id, headId: head.id, port: "intake", depressionInH2O: 28, valveDiameterMm: 51.3, testedOn: "2026-12-10" })
      .returning()
      .get();
    db.insert(flowPoints).values([{ flowTestId: ft.id, liftMm: 5, flowCfm: 150 }, { flowTestId: ft.id, liftMm: 12.7, flowCfm: 298 }]).run();

    expect((await move(job.id, "in_inspection")).status).toBe(200);
    const shipped = await move(job.id, "shipped");
    expect(shipped.status).toBe(200);
    expect(shipped.body.notice.sent).toBe(true);
    expect(db.select().from(heads).where(eq(heads.id, head.id)).get()!.state).toBe("shipped");

    const caught = await mail.waitFor((m) => (m.subject ?? "").includes(`Job ${job.number} has shipped`));
    expect(caught.envelopeTo).toEqual(["odile@ferrous-lane.invalid"]);
    expect(caught.text).toContain(`Head SN-${job.id}-S1`);
    expect(caught.text).toContain(`Intake ports cut with ${shop.intakeProgram.name} A`);
    expect(caught.text).toContain(`Exhaust ports cut with ${shop.exhaustProgram.name} A`);
    expect(caught.text).toMatch(/Intake flow \d+\.\d cfm at 28 inH2O \(lift 12\.70 mm\)/);
    // Closed: no more edits.
    const edit = await json(await patchJobRoute(await request(`/api/jobs/${job.id}`, { method: "PATCH", as: lead, json: { notes: "late" } }), params({ id: String(job.id) })));
    expect(edit.status).toBe(409);
  });
});
