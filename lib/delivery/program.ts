/**
 * What a machine's cell computer gets when it asks for a job's program: the toolpath of the
 * job's chosen revision for that port, only while the revision is released, only for the
 * machine the job is planned on. Every request is an audit event, refused ones included.
 */
import type { Readable } from "node:stream";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { getJobRowByNumber, revisionSummary, type RevisionSummary, type ToolpathFile } from "@/db/queries/jobs";
import { machineTokens } from "@/db/schema";
import { recordAudit } from "../audit/record";
import { AppError } from "../errors";
import type { Storage } from "../storage";
import { CUTTING_JOB_STATES } from "../jobs/states";
import { JOB_STATE_LABEL, PORT_LABEL, REVISION_STATE_LABEL } from "../jobs/words";
import { parseInput } from "../validation";
import { programFetchSchema } from "./schema";
import type { MachineCaller } from "./tokens";

export type ProgramPlan = {
  jobId: number;
  jobNumber: string;
  port: "intake" | "exhaust";
  revision: RevisionSummary;
  file: ToolpathFile & { sha256: string };
};

/** The checks, in the order a person would want to hear about them. Read-only. */
export function planProgramFetch(db: Db, caller: MachineCaller, rawQuery: unknown): ProgramPlan {
  const { job: number, port } = parseInput(programFetchSchema, rawQuery);
  const job = getJobRowByNumber(db, number);
  if (!job) throw new AppError("not_found", `There is no job ${number.toUpperCase()}.`);
  if (job.machineId !== caller.machineId) {
    throw new AppError("forbidden", `Job ${job.number} is planned on ${job.machineName ?? "no machine yet"}, not on ${caller.machineName}; this token cannot fetch it.`);
  }
  if (!CUTTING_JOB_STATES.includes(job.state)) {
    throw new AppError("conflict", `Job ${job.number} is ${JOB_STATE_LABEL[job.state].toLowerCase()}; programs are handed out while it is scheduled or on the machine.`);
  }
  const cuts = port === "intake" ? job.cutIntake : job.cutExhaust;
  const revisionId = port === "intake" ? job.intakeRevisionId : job.exhaustRevisionId;
  if (!cuts) throw new AppError("not_found", `Job ${job.number} does not cut the ${PORT_LABEL[port].toLowerCase()} port.`);
  if (revisionId == null) throw new AppError("conflict", `Job ${job.number} has no revision chosen for the ${PORT_LABEL[port].toLowerCase()} port.`);
  const revision = revisionSummary(db, revisionId)!;
  if (revision.state !== "released") {
    throw new AppError("conflict", `${revision.label} is ${REVISION_STATE_LABEL[revision.state].toLowerCase()} and may not be cut any more; ask the lead for the released revision.`);
  }
  const file = revision.toolpath;
  if (!file || !file.sha256 || file.state !== "stored") throw new AppError("conflict", `${revision.label} has no stored toolpath file with a checksum.`);
  return { jobId: job.id, jobNumber: job.number, port, revision, file: { ...file, sha256: file.sha256 } };
}

function noteUse(db: Db, caller: MachineCaller, now: number, event: { action: string; entityId: number | string | null; after: unknown }) {
  db.transaction((tx) => {
    tx.update(machineTokens).set({ lastUsedAt: now }).where(eq(machineTokens.id, caller.tokenId)).run();
    recordAudit(tx, { actor: caller.actor, action: event.action, entity: "job", entityId: event.entityId, after: event.after }, now);
  });
}

export type ProgramDelivery = {
  plan: ProgramPlan;
  body: Readable;
  headers: Record<string, string>;
};

/** Header values must be plain ASCII; names typed by people may not be. */
function asciiHeader(value: string): string {
  return value.replace(/[^\x20-\x7e]/g, "?");
}

/** Download name: job, port and revision, never the uploader's name alone. */
export function deliveryFileName(plan: ProgramPlan): string {
  const ext = /\.([A-Za-z0-9]{1,5})$/.exec(plan.file.originalName)?.[1] ?? "nc";
  return `${plan.jobNumber}-${plan.port}-${plan.revision.programName.replace(/[^A-Za-z0-9]+/g, "-")}-${plan.revision.letter}.${ext}`.replace(/-+/g, "-");
}

/**
 * Checks the request, opens the stored file as a stream verified against its recorded SHA-256
 * (a replaced object fails the stream at its end rather than passing as genuine), and records
 * the fetch. The caller pipes `body` to the machine.
 */
export async function deliverProgram(db: Db, storage: Storage, caller: MachineCaller, rawQuery: unknown, now = Date.now()): Promise<ProgramDelivery> {
  let plan: ProgramPlan;
  try {
    plan = planProgramFetch(db, caller, rawQuery);
  } catch (err) {
    if (err instanceof AppError && err.code !== "invalid") {
      const q = rawQuery as { job?: unknown; port?: unknown };
      noteUse(db, caller, now, { action: "program.fetch_refused", entityId: null, after: { job: String(q?.job ?? ""), port: String(q?.port ?? ""), machineId: caller.machineId, tokenId: caller.tokenId, reason: err.message } });
    }
    throw err;
  }
  const got = await storage.getVerifiedStream(plan.file.storageKey, plan.file.sha256);
  noteUse(db, caller, now, {
    action: "program.fetch",
    entityId: plan.jobId,
    after: {
      job: plan.jobNumber,
      port: plan.port,
      revisionId: plan.revision.id,
      revision: plan.revision.label,
      fileId: plan.file.fileId,
      sha256: plan.file.sha256,
      machineId: caller.machineId,
      tokenId: caller.tokenId,
    },
  });
  const size = got.sizeBytes || plan.file.sizeBytes;
  return {
    plan,
    body: got.body,
    headers: {
      "Content-Type": plan.file.contentType && plan.file.contentType !== "application/octet-stream" ? plan.file.contentType : "text/plain; charset=utf-8",
      "Content-Length": String(size),
      "Content-Disposition": `attachment; filename="${deliveryFileName(plan)}"`,
      "Cache-Control": "no-store",
      "X-Content-SHA256": plan.file.sha256,
      "X-Portolan-Job": asciiHeader(plan.jobNumber),
      "X-Portolan-Port": plan.port,
      "X-Portolan-Revision": asciiHeader(plan.revision.label),
    },
  };
}
