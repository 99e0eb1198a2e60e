/**
 * Everything the job page shows, assembled once for the page and the API alike: the job, its
 * plan, each port's chosen revision and flag, the moves open to it (and why others are not),
 * its heads and their cuts.
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { cutsOfJob, type CutRow } from "@/db/queries/cuts";
import { headsOfJob, type HeadRow } from "@/db/queries/heads";
import { getJobRow, openJobs, revisionChoices, revisionSummary, type JobRow, type RevisionChoice, type RevisionSummary } from "@/db/queries/jobs";
import { headTypes, type JobState, type Port } from "@/db/schema";
import { defaultPortsPerHead, plannedMachineTime, type Plan } from "./planning";
import { buildSchedule, type ScheduleMachine } from "./schedule";
import { JOB_MOVES, isOpenJob, reasonsAgainstMove } from "./states";

export type PortDetail = {
  port: Port;
  cut: boolean;
  revision: RevisionSummary | null;
  /** The chosen revision was superseded or withdrawn while the job is open. */
  flagged: boolean;
  choices: RevisionChoice[];
};

export type MoveOption = { to: JobState; allowed: boolean; reasons: string[] };

export type JobDetail = {
  job: JobRow;
  portsPerHead: number;
  portsPerHeadDerived: boolean;
  plan: Plan;
  ports: PortDetail[];
  moves: MoveOption[];
  heads: HeadRow[];
  cuts: CutRow[];
};

function effectivePortsPerHead(db: Db, job: { headTypeId: number; portsPerHead: number | null }) {
  if (job.portsPerHead != null) return { value: job.portsPerHead, derived: false };
  const type = db.select({ cylinders: headTypes.cylinders, engineFamily: headTypes.engineFamily }).from(headTypes).where(eq(headTypes.id, job.headTypeId)).get()!;
  return { value: defaultPortsPerHead(type), derived: true };
}

const portsOf = (job: JobRow) =>
  [
    { port: "intake" as const, cut: job.cutIntake, revisionId: job.intakeRevisionId },
    { port: "exhaust" as const, cut: job.cutExhaust, revisionId: job.exhaustRevisionId },
  ] as const;

export function planOf(db: Db, job: JobRow): { plan: Plan; portsPerHead: number; derived: boolean } {
  const pph = effectivePortsPerHead(db, job);
  const ports = portsOf(job)
    .filter((p) => p.cut)
    .map((p) => {
      const rev = p.revisionId ? revisionSummary(db, p.revisionId) : null;
      return { port: p.port, revisionChosen: rev != null, cycleTimeS: rev?.cycleTimeS ?? null };
    });
  return { plan: plannedMachineTime({ ports, portsPerHead: pph.value, heads: job.quantity, setupMinutes: job.setupMinutes }), portsPerHead: pph.value, derived: pph.derived };
}

export function jobDetail(db: Db, id: number): JobDetail | null {
  const job = getJobRow(db, id);
  if (!job) return null;
  const { plan, portsPerHead, derived } = planOf(db, job);
  const ports: PortDetail[] = portsOf(job).map((p) => {
    const revision = p.revisionId ? revisionSummary(db, p.revisionId) : null;
    return {
      port: p.port,
      cut: p.cut,
      revision,
      flagged: isOpenJob(job.state) && p.cut && !!revision && (revision.state === "superseded" || revision.state === "withdrawn"),
      choices: revisionChoices(db, job.headTypeId, p.port),
    };
  });
  const heads = headsOfJob(db, id);
  const facts = {
    state: job.state,
    machineId: job.machineId,
    ports: ports.map((p) => ({ port: p.port, cut: p.cut, revisionId: p.revision?.id ?? null, revisionState: p.revision?.state ?? null })),
    heads: heads.map((h) => ({ state: h.state })),
  };
  const moves = JOB_MOVES[job.state].map((to) => {
    const reasons = reasonsAgainstMove(facts, to);
    return { to, allowed: reasons.length === 0, reasons };
  });
  return { job, portsPerHead, portsPerHeadDerived: derived, plan, ports, moves, heads, cuts: cutsOfJob(db, id) };
}

/** The schedule view's data: planned time per machine per week for every open job. */
export function shopSchedule(db: Db): ScheduleMachine[] {
  return buildSchedule(
    openJobs(db).map((job) => ({
      id: job.id,
      number: job.number,
      state: job.state,
      machineId: job.machineId,
      machineName: job.machineName,
      dueOn: job.dueOn,
      plan: planOf(db, job).plan,
    })),
  );
}

