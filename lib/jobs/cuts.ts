/**
 * Recording a cut: one head, one port, with the job's chosen revision and the SHA-256 of its
 * toolpath frozen at that moment (a database trigger keeps both from ever changing). A cut can
 * only use the job's chosen revision, and only while that revision is released.
 */
import { eq } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { revisionSummary } from "@/db/queries/jobs";
import { cuts, flowTests, headTypes, heads, jobs, machines, type Port } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { headStateFromCuts } from "./head-state";
import { setJobState } from "./jobs";
import { cutSchema, cutUpdateSchema } from "./schema";
import { CUTTING_JOB_STATES } from "./states";
import { HEAD_STATE_LABEL, JOB_STATE_LABEL, PORT_LABEL, REVISION_STATE_LABEL } from "./words";

type JobRecord = typeof jobs.$inferSelect;

const portsToCut = (job: JobRecord): Port[] => [...(job.cutIntake ? (["intake"] as const) : []), ...(job.cutExhaust ? (["exhaust"] as const) : [])];

/** Re-derives the head's state from all its cuts; returns the new state when it changed. */
function refreshHeadState(tx: Tx, headId: number, job: JobRecord, now: number) {
  const head = tx.select().from(heads).where(eq(heads.id, headId)).get()!;
  const all = tx.select({ id: cuts.id, port: cuts.port, outcome: cuts.outcome, startedAt: cuts.startedAt }).from(cuts).where(eq(cuts.headId, headId)).all();
  const next = headStateFromCuts(portsToCut(job), all, head.state);
  if (next !== head.state) tx.update(heads).set({ state: next, updatedAt: now }).where(eq(heads.id, headId)).run();
  return { before: head.state, after: next };
}

function checkFlowTest(tx: Tx, flowTestId: number | null | undefined, headId: number) {
  if (flowTestId == null) return;
  const t = tx.select({ headId: flowTests.headId }).from(flowTests).where(eq(flowTests.id, flowTestId)).get();
  if (!t) throw new AppError("invalid", "That flow test was not found.", { flowTestId: ["Not found."] });
  if (t.headId !== headId) throw new AppError("invalid", "That flow test was not made on this head.", { flowTestId: ["Choose a flow test of this head."] });
}

export function recordCut(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINISTS);
  const values = parseInput(cutSchema, input);
  return db.transaction((tx) => {
    const head = tx.select().from(heads).where(eq(heads.id, values.headId)).get();
    if (!head) throw new AppError("invalid", "That head was not found.", { headId: ["Not found."] });
    if (head.jobId == null) throw new AppError("conflict", `Head ${head.serial} is not on a job; a cut is recorded against a job's revision.`);
    if (head.state === "scrapped" || head.state === "shipped") {
      throw new AppError("conflict", `Head ${head.serial} is ${HEAD_STATE_LABEL[head.state].toLowerCase()}; no more cuts can be recorded on it.`);
    }
    const job = tx.select().from(jobs).where(eq(jobs.id, head.jobId)).get()!;
    if (!CUTTING_JOB_STATES.includes(job.state)) {
      throw new AppError("conflict", `Job ${job.number} is ${JOB_STATE_LABEL[job.state].toLowerCase()}; cuts are recorded while it is scheduled or on the machine.`);
    }
    const port = values.port;
    const portWord = PORT_LABEL[port].toLowerCase();
    if (!portsToCut(job).includes(port)) throw new AppError("invalid", `Job ${job.number} does not cut the ${portWord} port.`, { port: ["Not cut on this job."] });
    const chosenId = port === "intake" ? job.intakeRevisionId : job.exhaustRevisionId;
    if (chosenId == null) throw new AppError("conflict", `No revision is chosen for the ${portWord} port of job ${job.number}; the lead picks one first.`);
    const rev = revisionSummary(tx, chosenId)!;
    if (values.revisionId != null && values.revisionId !== chosenId) {
      const other = revisionSummary(tx, values.revisionId);
      const msg = `Job ${job.number} cuts the ${portWord} port with ${rev.label}${other ? `, not ${other.label}` : ""}; a cut can only be recorded against the job's chosen revision.`;
      throw new AppError("conflict", msg, { revisionId: [msg] });
    }
    if (rev.state !== "released") {
      throw new AppError(
        "conflict",
        `${rev.label} is ${REVISION_STATE_LABEL[rev.state].toLowerCase()}; the lead must choose the released revision before more heads are cut.`,
      );
    }
    if (!rev.toolpath?.sha256) throw new AppError("conflict", `${rev.label} has no stored toolpath file with a checksum.`);
    const machineId = values.machineId ?? job.machineId;
    if (machineId == null) throw new AppError("invalid", "Choose the machine the head was cut on.", { machineId: ["Choose a machine."] });
    if (!tx.select({ id: machines.id }).from(machines).where(eq(machines.id, machineId)).get()) {
      throw new AppError("invalid", "That machine was not found.", { machineId: ["Not found."] });
    }
    const cylinders = tx.select({ n: headTypes.cylinders }).from(headTypes).where(eq(headTypes.id, head.headTypeId)).get()!.n;
    if (values.cylinder != null && values.cylinder > cylinders) {
      throw new AppError("invalid", `This casting has ${cylinders} cylinders.`, { cylinder: [`1 to ${cylinders}.`] });
    }
    checkFlowTest(tx, values.flowTestId, head.id);

    const cut = tx
      .insert(cuts)
      .values({
        headId: head.id,
        jobId: job.id,
        port,
        cylinder: values.cylinder ?? null,
        revisionId: rev.id,
        toolpathSha256: rev.toolpath.sha256,
        machineId,
        operatorId: who.id,
        startedAt: values.startedAt,
        endedAt: values.endedAt ?? null,
        outcome: values.outcome,
        reason: values.outcome === "good" ? (values.reason?.trim() || null) : values.reason!.trim(),
        notes: values.notes,
        flowTestId: values.flowTestId ?? null,
        createdAt: now,
      })
      .returning()
      .get();
    recordAudit(tx, { actor: who, action: "cut.create", entity: "cut", entityId: cut.id, after: { ...cut, revisionLabel: rev.label, headSerial: head.serial } }, now);
    const state = refreshHeadState(tx, head.id, job, now);
    if (state.after !== state.before) {
      recordAudit(tx, { actor: who, action: "head.state", entity: "head", entityId: head.id, before: { state: state.before }, after: { state: state.after, byCut: cut.id } }, now);
    }
    if (job.state === "scheduled") setJobState(tx, who, job, "on_machine", `first cut recorded (cut ${cut.id})`, now);
    return { cut, headState: state.after };
  });
}

/** Later facts about a cut: its end, a changed outcome after inspection, notes, the post-cut flow test. */
export function updateCut(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINISTS);
  const change = parseInput(cutUpdateSchema, input);
  return db.transaction((tx) => {
    const before = tx.select().from(cuts).where(eq(cuts.id, id)).get();
    if (!before) throw new AppError("not_found", "That cut was not found.");
    const job = tx.select().from(jobs).where(eq(jobs.id, before.jobId)).get()!;
    if (job.state === "shipped" || job.state === "cancelled") {
      throw new AppError("conflict", `Job ${job.number} is ${JOB_STATE_LABEL[job.state].toLowerCase()}; its cuts are closed.`);
    }
    const merged = { ...before, ...Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined)) };
    if (merged.outcome !== "good" && !merged.reason?.trim()) {
      throw new AppError("invalid", "Say why the cut is not good.", { reason: ["Say why the cut is not good (e.g. broke into a water jacket, core shift)."] });
    }
    if (merged.endedAt != null && merged.endedAt < merged.startedAt) throw new AppError("invalid", "The end is before the start.", { endedAt: ["The end is before the start."] });
    if (change.flowTestId !== undefined) checkFlowTest(tx, change.flowTestId, before.headId);
    const set = Object.fromEntries(Object.entries(change).filter(([k, v]) => v !== undefined && before[k as keyof typeof before] !== v));
    if (Object.keys(set).length === 0) return { cut: before, headState: null };
    const cut = tx.update(cuts).set(set).where(eq(cuts.id, id)).returning().get();
    recordAudit(tx, { actor: who, action: "cut.update", entity: "cut", entityId: id, before: Object.fromEntries(Object.keys(set).map((k) => [k, before[k as keyof typeof before]])), after: set }, now);
    const state = refreshHeadState(tx, before.headId, job, now);
    if (state.after !== state.before) {
      recordAudit(tx, { actor: who, action: "head.state", entity: "head", entityId: before.headId, before: { state: state.before }, after: { state: state.after, byCut: id } }, now);
    }
    return { cut, headState: state.after };
  });
}
