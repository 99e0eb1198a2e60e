/**
 * Jobs (work orders): the lead opens one for a customer and a casting, picks the released
 * revision per port and the machine, and moves it along until it ships.
 */
import { and, count, eq, ne } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { nextJobNumber, revisionChoices, revisionSummary } from "@/db/queries/jobs";
import { customers, headTypes, heads, jobs, machines, type JobState, type Port } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { LEADS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { sendShippedNotice, type Notice, type NoticeDeps } from "./notices";
import { whyNotChoosable } from "./revision-choice";
import { chooseRevisionSchema, jobCreateSchema, jobUpdateSchema, moveJobSchema } from "./schema";
import { isOpenJob, reasonsAgainstMove, type PortPlan } from "./states";
import { JOB_STATE_LABEL } from "./words";

type JobRecord = typeof jobs.$inferSelect;

function loadJob(tx: Tx | Db, id: number): JobRecord {
  const job = tx.select().from(jobs).where(eq(jobs.id, id)).get();
  if (!job) throw new AppError("not_found", "That job was not found.");
  return job;
}

function requireOpen(job: JobRecord) {
  if (!isOpenJob(job.state)) throw new AppError("conflict", `Job ${job.number} is ${JOB_STATE_LABEL[job.state].toLowerCase()} and can no longer be changed.`);
}

function checkRefs(tx: Tx, refs: { customerId?: number; headTypeId?: number; machineId?: number | null }) {
  const fields: Record<string, string[]> = {};
  if (refs.customerId != null && !tx.select({ id: customers.id }).from(customers).where(eq(customers.id, refs.customerId)).get()) {
    fields.customerId = ["That customer was not found."];
  }
  if (refs.headTypeId != null && !tx.select({ id: headTypes.id }).from(headTypes).where(eq(headTypes.id, refs.headTypeId)).get()) {
    fields.headTypeId = ["That head type was not found."];
  }
  if (refs.machineId != null) {
    const m = tx.select({ active: machines.active }).from(machines).where(eq(machines.id, refs.machineId)).get();
    if (!m) fields.machineId = ["That machine was not found."];
    else if (!m.active) fields.machineId = ["That machine is out of service."];
  }
  if (Object.keys(fields).length) throw new AppError("invalid", "Some fields need attention.", fields);
}

export function createJob(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, LEADS);
  const values = parseInput(jobCreateSchema, input);
  return db.transaction((tx) => {
    checkRefs(tx, values);
    const number = values.number ?? nextJobNumber(tx, now);
    if (tx.select({ id: jobs.id }).from(jobs).where(eq(jobs.number, number)).get()) {
      throw new AppError("conflict", `Job number ${number} is taken.`, { number: ["That number is taken."] });
    }
    const row = tx
      .insert(jobs)
      .values({ ...values, number, machineId: values.machineId ?? null, dueOn: values.dueOn ?? null, portsPerHead: values.portsPerHead ?? null, state: "quoted", createdAt: now, updatedAt: now })
      .returning()
      .get();
    recordAudit(tx, { actor: who, action: "job.create", entity: "job", entityId: row.id, after: row }, now);
    return row;
  });
}

export function updateJob(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, LEADS);
  const change = parseInput(jobUpdateSchema, input);
  return db.transaction((tx) => {
    const before = loadJob(tx, id);
    requireOpen(before);
    checkRefs(tx, change);
    const set: Partial<JobRecord> = {};
    for (const [k, v] of Object.entries(change)) {
      if (v !== undefined && before[k as keyof JobRecord] !== v) (set as Record<string, unknown>)[k] = v;
    }
    if (set.number && tx.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.number, set.number), ne(jobs.id, id))).get()) {
      throw new AppError("conflict", `Job number ${set.number} is taken.`, { number: ["That number is taken."] });
    }
    const headCount = tx.select({ n: count() }).from(heads).where(and(eq(heads.jobId, id), ne(heads.state, "scrapped"))).get()!.n;
    if (set.headTypeId !== undefined) {
      if (before.state !== "quoted" || headCount > 0) {
        throw new AppError("conflict", "The casting can only change while the job is being quoted and has no heads.", { headTypeId: ["Locked once heads arrive."] });
      }
      // The chosen revisions belong to the old casting.
      set.intakeRevisionId = null;
      set.exhaustRevisionId = null;
    }
    if (set.quantity !== undefined && set.quantity < headCount) {
      throw new AppError("invalid", `The job already has ${headCount} heads that are not scrapped.`, { quantity: [`At least ${headCount}.`] });
    }
    if (change.cutIntake === false && (change.cutExhaust ?? before.cutExhaust) === false) {
      throw new AppError("invalid", "Cut at least one of the ports.", { cutIntake: ["Cut at least one of the ports."] });
    }
    if (Object.keys(set).length === 0) return before;
    const after = tx
      .update(jobs)
      .set({ ...set, updatedAt: now })
      .where(eq(jobs.id, id))
      .returning()
      .get();
    recordAudit(
      tx,
      {
        actor: who,
        action: "job.update",
        entity: "job",
        entityId: id,
        before: Object.fromEntries(Object.keys(set).map((k) => [k, before[k as keyof JobRecord]])),
        after: set,
      },
      now,
    );
    return after;
  });
}

const revisionColumn = (port: Port) => (port === "intake" ? "intakeRevisionId" : "exhaustRevisionId");
const cutsPort = (job: JobRecord, port: Port) => (port === "intake" ? job.cutIntake : job.cutExhaust);

/** Picks (or clears) the revision a job cuts a port with. Only a released revision of the job's casting and port. */
export function chooseRevision(db: Db, actor: Actor | null, jobId: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, LEADS);
  const { port, revisionId } = parseInput(chooseRevisionSchema, input);
  return db.transaction((tx) => {
    const job = loadJob(tx, jobId);
    requireOpen(job);
    const column = revisionColumn(port);
    const previous = job[column];
    if (revisionId != null) {
      const rev = revisionSummary(tx, revisionId);
      const casting = tx.select({ c: headTypes.castingNumber }).from(headTypes).where(eq(headTypes.id, job.headTypeId)).get()!.c;
      const released = revisionChoices(tx, job.headTypeId, port).find((r) => r.state === "released");
      const reason = whyNotChoosable(
        rev && { label: rev.label, state: rev.state, port: rev.port, headTypeId: rev.headTypeId, hasToolpath: !!rev.toolpath?.sha256 },
        { port, headTypeId: job.headTypeId, castingNumber: casting, cutsPort: cutsPort(job, port), releasedAlternative: released?.label },
      );
      if (reason) throw new AppError("invalid", reason, { revisionId: [reason] });
    }
    if (previous === revisionId) return job;
    const after = tx
      .update(jobs)
      .set({ [column]: revisionId, updatedAt: now })
      .where(eq(jobs.id, jobId))
      .returning()
      .get();
    recordAudit(
      tx,
      { actor: who, action: "job.choose_revision", entity: "job", entityId: jobId, before: { port, revisionId: previous }, after: { port, revisionId } },
      now,
    );
    return after;
  });
}

/** The facts a move is judged on (states.ts decides). */
export function moveFacts(tx: Tx | Db, job: JobRecord) {
  const ports: PortPlan[] = (["intake", "exhaust"] as const).map((port) => {
    const revisionId = job[revisionColumn(port)];
    return { port, cut: cutsPort(job, port), revisionId, revisionState: revisionId ? (revisionSummary(tx, revisionId)?.state ?? null) : null };
  });
  const headStates = tx.select({ state: heads.state }).from(heads).where(eq(heads.jobId, job.id)).all();
  return { state: job.state, machineId: job.machineId, ports, heads: headStates };
}

export type MoveResult = { job: JobRecord; notice: Notice | null };

/** Moves a job to another state; shipping marks its finished heads shipped and e-mails the customer. */
export async function moveJob(db: Db, actor: Actor | null, jobId: number, input: unknown, deps: NoticeDeps = {}, now = Date.now()): Promise<MoveResult> {
  const who = requireRole(actor, LEADS);
  const { to, note } = parseInput(moveJobSchema, input);
  const job = db.transaction((tx) => {
    const before = loadJob(tx, jobId);
    const reasons = reasonsAgainstMove(moveFacts(tx, before), to);
    if (reasons.length) throw new AppError("conflict", reasons.join(" "), { to: reasons });
    const after = tx.update(jobs).set({ state: to, updatedAt: now }).where(eq(jobs.id, jobId)).returning().get();
    let shippedHeads: number[] = [];
    if (to === "shipped") {
      shippedHeads = tx
        .update(heads)
        .set({ state: "shipped", updatedAt: now })
        .where(and(eq(heads.jobId, jobId), eq(heads.state, "cut")))
        .returning({ id: heads.id })
        .all()
        .map((h) => h.id);
    }
    recordAudit(
      tx,
      {
        actor: who,
        action: "job.move",
        entity: "job",
        entityId: jobId,
        before: { state: before.state },
        after: { state: to, note: note || undefined, shippedHeads: shippedHeads.length ? shippedHeads : undefined },
      },
      now,
    );
    return after;
  });
  // A notice: the move stands whether or not the mail goes out; the result says which.
  const notice = to === "shipped" ? await sendShippedNotice(db, jobId, deps, now) : null;
  return { job, notice };
}

/** For moves the CLI and seed make on the system's behalf (e.g. a first cut puts a job on the machine). */
export function setJobState(tx: Tx, actor: { id: number | null; email: string }, job: JobRecord, to: JobState, why: string, now: number) {
  tx.update(jobs).set({ state: to, updatedAt: now }).where(eq(jobs.id, job.id)).run();
  recordAudit(tx, { actor, action: "job.move", entity: "job", entityId: job.id, before: { state: job.state }, after: { state: to, note: why } }, now);
}

