/**
 * How a job moves: quoting → scheduled → on the machine → in inspection → shipped, with steps
 * back where the shop really goes back (a paused job, a head returned for rework) and
 * cancellation from any open state. Pure: the verb gathers the facts, this decides.
 */
import type { JobState, Port, RevisionState } from "@/db/enums";
import { JOB_STATE_LABEL, PORT_LABEL, REVISION_STATE_LABEL, type HeadState } from "./words";

export const JOB_MOVES: Record<JobState, readonly JobState[]> = {
  quoted: ["scheduled", "cancelled"],
  scheduled: ["on_machine", "quoted", "cancelled"],
  on_machine: ["in_inspection", "scheduled", "cancelled"],
  in_inspection: ["shipped", "on_machine", "cancelled"],
  shipped: [],
  cancelled: [],
};

/** Jobs still in flight: their chosen revisions matter, and a change to one raises a flag. */
export const OPEN_JOB_STATES: readonly JobState[] = ["quoted", "scheduled", "on_machine", "in_inspection"];

/** States in which heads may be cut (a cut in a scheduled job moves it onto the machine). */
export const CUTTING_JOB_STATES: readonly JobState[] = ["scheduled", "on_machine"];

export function isOpenJob(state: JobState): boolean {
  return OPEN_JOB_STATES.includes(state);
}

export type PortPlan = { port: Port; cut: boolean; revisionId: number | null; revisionState: RevisionState | null };

export type MoveFacts = {
  state: JobState;
  machineId: number | null;
  ports: PortPlan[];
  heads: Array<{ state: HeadState }>;
};

/**
 * Why a job cannot move to `to` (empty when it can). The reasons are sentences for the person
 * who pressed the button.
 */
export function reasonsAgainstMove(facts: MoveFacts, to: JobState): string[] {
  if (facts.state === to) return [`The job is already ${JOB_STATE_LABEL[to].toLowerCase()}.`];
  if (!JOB_MOVES[facts.state].includes(to)) {
    return [`A job that is ${JOB_STATE_LABEL[facts.state].toLowerCase()} cannot move to ${JOB_STATE_LABEL[to].toLowerCase()}.`];
  }
  const reasons: string[] = [];
  if (to === "scheduled" || to === "on_machine") {
    if (facts.machineId == null) reasons.push("Choose the machine that cuts this job.");
    const cutPorts = facts.ports.filter((p) => p.cut);
    if (cutPorts.length === 0) reasons.push("Choose at least one port to cut.");
    for (const p of cutPorts) {
      if (p.revisionId == null) reasons.push(`Choose the released revision for the ${PORT_LABEL[p.port].toLowerCase()} port.`);
      else if (p.revisionState !== "released") {
        reasons.push(
          `The chosen ${PORT_LABEL[p.port].toLowerCase()} revision is ${REVISION_STATE_LABEL[p.revisionState ?? "draft"].toLowerCase()}; choose a released one.`,
        );
      }
    }
  }
  if (to === "in_inspection" && !facts.heads.some((h) => h.state === "cut" || h.state === "scrapped")) {
    reasons.push("No head of this job has been cut yet.");
  }
  if (to === "shipped") {
    if (!facts.heads.some((h) => h.state === "cut")) reasons.push("There is no finished head to ship.");
    const unfinished = facts.heads.filter((h) => h.state === "cutting").length;
    if (unfinished > 0) reasons.push(`${unfinished} ${unfinished === 1 ? "head is" : "heads are"} still being cut; finish or scrap them first.`);
  }
  return reasons;
}
