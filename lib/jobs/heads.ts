/**
 * Production heads: one casting by serial, on a job (or shop stock waiting for one), with the
 * incoming inspection noted before any metal is removed.
 */
import { and, count, eq, ne } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { headTypes, heads, jobs } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { MACHINISTS } from "../auth/roles";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { headSchema, headUpdateSchema } from "./schema";
import { isOpenJob } from "./states";
import { JOB_STATE_LABEL } from "./words";

function serialTaken(tx: Tx, serial: string, exceptId?: number): boolean {
  const row = tx.select({ id: heads.id }).from(heads).where(eq(heads.serial, serial)).get();
  return !!row && row.id !== exceptId;
}

export function createHead(db: Db, actor: Actor | null, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINISTS);
  const values = parseInput(headSchema, input);
  return db.transaction((tx) => {
    let headTypeId = values.headTypeId ?? null;
    if (values.jobId != null) {
      const job = tx.select().from(jobs).where(eq(jobs.id, values.jobId)).get();
      if (!job) throw new AppError("invalid", "That job was not found.", { jobId: ["That job was not found."] });
      if (!isOpenJob(job.state)) throw new AppError("conflict", `Job ${job.number} is ${JOB_STATE_LABEL[job.state].toLowerCase()}; it takes no more heads.`);
      if (headTypeId != null && headTypeId !== job.headTypeId) {
        throw new AppError("invalid", "The head type differs from the job's casting.", { headTypeId: ["Must match the job's casting."] });
      }
      headTypeId = job.headTypeId;
      const onJob = tx.select({ n: count() }).from(heads).where(and(eq(heads.jobId, job.id), ne(heads.state, "scrapped"))).get()!.n;
      if (onJob >= job.quantity) {
        throw new AppError("conflict", `Job ${job.number} already has its ${job.quantity} ${job.quantity === 1 ? "head" : "heads"}; raise the quantity first.`);
      }
    }
    const type = tx.select().from(headTypes).where(eq(headTypes.id, headTypeId!)).get();
    if (!type) throw new AppError("invalid", "That head type was not found.", { headTypeId: ["That head type was not found."] });
    if (serialTaken(tx, values.serial)) throw new AppError("conflict", `A head with serial ${values.serial} is already recorded.`, { serial: ["Already recorded."] });
    const row = tx
      .insert(heads)
      .values({
        jobId: values.jobId ?? null,
        headTypeId: type.id,
        serial: values.serial,
        castingNumber: values.castingNumber?.trim() || type.castingNumber,
        source: values.source,
        incomingNotes: values.incomingNotes,
        state: "received",
        createdAt: now,
        updatedAt: now,
      })
      .returning()
      .get();
    recordAudit(tx, { actor: who, action: "head.create", entity: "head", entityId: row.id, after: row }, now);
    return row;
  });
}

export function updateHead(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()) {
  const who = requireRole(actor, MACHINISTS);
  const change = parseInput(headUpdateSchema, input);
  return db.transaction((tx) => {
    const before = tx.select().from(heads).where(eq(heads.id, id)).get();
    if (!before) throw new AppError("not_found", "That head was not found.");
    if (before.state === "shipped") throw new AppError("conflict", `Head ${before.serial} has shipped; its record is closed.`);
    if (change.serial && serialTaken(tx, change.serial, id)) {
      throw new AppError("conflict", `A head with serial ${change.serial} is already recorded.`, { serial: ["Already recorded."] });
    }
    const set = Object.fromEntries(Object.entries(change).filter(([k, v]) => v !== undefined && before[k as keyof typeof before] !== v));
    if (Object.keys(set).length === 0) return before;
    const after = tx
      .update(heads)
      .set({ ...set, updatedAt: now })
      .where(eq(heads.id, id))
      .returning()
      .get();
    recordAudit(
      tx,
      { actor: who, action: "head.update", entity: "head", entityId: id, before: Object.fromEntries(Object.keys(set).map((k) => [k, before[k as keyof typeof before]])), after: set },
      now,
    );
    return after;
  });
}
