/**
 * The demo's customers, jobs, heads and cuts: an invented scenario on casting HL-4471-A, cut with
 * the library's released revisions ("Street intake" B and "Street exhaust" A) when the programs
 * step has created them — one job shipped, one on the machine with a head scrapped after breaking
 * into a water jacket, one scheduled, one in inspection — and a quote on another casting.
 * Everything goes through the same verbs as the screens, so the audit trail tells the story too.
 * No machine token is seeded: a token is shown once, to the admin who issues it.
 */
import { and, eq } from "drizzle-orm";
import type { Actor } from "@/lib/auth/guard";
import { recordCut } from "@/lib/jobs/cuts";
import { createCustomer } from "@/lib/jobs/customers";
import { createHead } from "@/lib/jobs/heads";
import { chooseRevision, createJob, moveJob } from "@/lib/jobs/jobs";
import type { Mailer } from "@/lib/mail";
import type { Db } from "../client";
import { headTypes, machines, programs, revisions, users } from "../schema";

export const JOBS_DEMO_CASTING = "HL-4471-A";
const DAY = 86_400_000;

/** The seed tells no one: its shipping is history, not news. */
const quietMailer: Mailer = {
  config: { host: "seed", port: 0, secure: false, from: "seed", connectTimeoutMs: 0 },
  send: async () => ({ messageId: "seed", accepted: [] }),
  check: async () => ({ ok: true }),
  close: () => undefined,
};

function actor(db: Db, id: number | undefined): Actor | null {
  if (!id) return null;
  return db.select({ id: users.id, email: users.email, name: users.name, role: users.role }).from(users).where(eq(users.id, id)).get() ?? null;
}

function releasedRevision(db: Db, headTypeId: number, programName: string, letter: string): number | null {
  return (
    db
      .select({ id: revisions.id })
      .from(revisions)
      .innerJoin(programs, eq(programs.id, revisions.programId))
      .where(and(eq(programs.headTypeId, headTypeId), eq(programs.name, programName), eq(revisions.letter, letter), eq(revisions.state, "released")))
      .get()?.id ?? null
  );
}

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);

export async function seedJobs(db: Db, ctx: { people: Partial<Record<"lead" | "machinist", number>> }, now = Date.now()): Promise<void> {
  const lead = actor(db, ctx.people.lead);
  const machinist = actor(db, ctx.people.machinist);
  const casting = db.select().from(headTypes).where(eq(headTypes.castingNumber, JOBS_DEMO_CASTING)).get();
  const other = db.select().from(headTypes).where(eq(headTypes.castingNumber, "HL-2205-K")).get();
  const machine = db.select().from(machines).where(eq(machines.active, true)).get();
  if (!lead || !machinist || !casting) return;

  const harrow = createCustomer(db, lead, {
    name: "Harrow & Vale Speed",
    contactName: "Odile Marsh",
    email: "odile@harrowvale.invalid",
    phone: "+00 555 0142",
    address: "Unit 4, Tannery Yard\nWestcombe",
    notes: "Circle-track team; wants flow sheets with every shipment.",
  });
  const pellucid = createCustomer(db, lead, {
    name: "Pellucid Motor Works",
    contactName: "Bram Ettinger",
    email: "bram@pellucid-motor.invalid",
    phone: "+00 555 0178",
    address: "18 Furnace Lane, Old Quay",
  });
  const tallow = createCustomer(db, lead, {
    name: "Tallow Creek Garage",
    contactName: "Suvi Annerholt",
    email: "suvi@tallowcreek.invalid",
    notes: "Sends cores in batches; check seats closely, previous owner recut them.",
  });
  const quill = createCustomer(db, lead, { name: "Quillstone Engines", contactName: "Rafe Oduya", email: "rafe@quillstone.invalid", phone: "+00 555 0110" });

  const intake = releasedRevision(db, casting.id, "Street intake", "B");
  const exhaust = releasedRevision(db, casting.id, "Street exhaust", "A");
  const withRevisions = intake != null && exhaust != null && machine != null;

  // A quote on another casting, whatever the library holds.
  createJob(db, lead, {
    number: "J-2026-014",
    customerId: quill.id,
    headTypeId: (other ?? casting).id,
    quantity: 4,
    dueOn: day(now + 30 * DAY),
    setupMinutes: 90,
    notes: "Quote for a street build; customer asks for a price per head.",
  });
  if (!withRevisions) {
    createJob(db, lead, { number: "J-2026-011", customerId: harrow.id, headTypeId: casting.id, quantity: 2, dueOn: day(now + 14 * DAY), notes: "Waiting for released programs." });
    return;
  }

  const deps = { mailer: quietMailer };
  const openCuttingJob = async (number: string, customerId: number, quantity: number, dueInDays: number, notes: string) => {
    const job = createJob(db, lead, { number, customerId, headTypeId: casting.id, quantity, machineId: machine!.id, dueOn: day(now + dueInDays * DAY), setupMinutes: 60, notes });
    chooseRevision(db, lead, job.id, { port: "intake", revisionId: intake });
    chooseRevision(db, lead, job.id, { port: "exhaust", revisionId: exhaust });
    await moveJob(db, lead, job.id, { to: "scheduled" }, deps);
    return job;
  };
  const cutBoth = (headId: number, at: number) => {
    recordCut(db, machinist, { headId, port: "intake", startedAt: at, endedAt: at + 52 * 60_000, outcome: "good", notes: "" });
    recordCut(db, machinist, { headId, port: "exhaust", startedAt: at + 60 * 60_000, endedAt: at + 101 * 60_000, outcome: "good", notes: "" });
  };

  // Shipped last week.
  const shipped = await openCuttingJob("J-2026-007", harrow.id, 2, -5, "Two heads for the spring season.");
  for (const [i, serial] of ["HV-4471-0107", "HV-4471-0108"].entries()) {
    const head = createHead(db, machinist, { jobId: shipped.id, serial, source: "customer_core", incomingNotes: i === 0 ? "Clean; seats good." : "Old valve-job marks on the exhaust seats; no cracks found." });
    cutBoth(head.id, now - (12 - i) * DAY);
  }
  await moveJob(db, lead, shipped.id, { to: "in_inspection" }, deps);
  await moveJob(db, lead, shipped.id, { to: "shipped" }, deps);

  // On the machine, one head lost to a water jacket.
  const onMachine = await openCuttingJob("J-2026-009", pellucid.id, 3, 6, "Batch of three; first-article check done on the first head.");
  const good = createHead(db, machinist, { jobId: onMachine.id, serial: "PM-4471-0231", source: "customer_core", incomingNotes: "Dye check clean." });
  cutBoth(good.id, now - 2 * DAY);
  const lost = createHead(db, machinist, { jobId: onMachine.id, serial: "PM-4471-0232", source: "customer_core", incomingNotes: "Some casting flash in the water passages." });
  recordCut(db, machinist, {
    headId: lost.id,
    port: "intake",
    cylinder: 6,
    startedAt: now - DAY,
    endedAt: now - DAY + 31 * 60_000,
    outcome: "scrap",
    reason: "broke into the water jacket under the short side, cylinder 6",
    notes: "Core shift on this casting: wall under the short side measured 1.1 mm before the cut. Stopped the run; lead told.",
  });
  createHead(db, machinist, { jobId: onMachine.id, serial: "PM-4471-0233", source: "shop_stock", incomingNotes: "Replacement from stock for 0232; wall under the short side checked by ultrasound." });

  // In inspection.
  const inspection = await openCuttingJob("J-2026-010", tallow.id, 1, 3, "Single head; customer collects.");
  const inspected = createHead(db, machinist, { jobId: inspection.id, serial: "TC-4471-0044", source: "customer_core", incomingNotes: "Seats previously recut, deep; noted to the customer." });
  cutBoth(inspected.id, now - 3 * DAY);
  await moveJob(db, lead, inspection.id, { to: "in_inspection" }, deps);

  // Scheduled for next week, heads arriving.
  const scheduled = await openCuttingJob("J-2026-012", harrow.id, 4, 10, "Second batch for the same team.");
  createHead(db, machinist, { jobId: scheduled.id, serial: "HV-4471-0131", source: "customer_core", incomingNotes: "Received; not yet inspected." });
}
