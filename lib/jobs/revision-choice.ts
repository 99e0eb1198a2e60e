/**
 * Whether a revision may be chosen for a job's port, and if not, why — in a sentence the lead
 * can act on. Pure: the verb looks the revision up and passes what it found.
 */
import type { Port, RevisionState } from "@/db/enums";
import { PORT_LABEL, REVISION_STATE_LABEL } from "./words";

export type CandidateRevision = {
  label: string;
  state: RevisionState;
  port: Port;
  headTypeId: number;
  hasToolpath: boolean;
};

export type ChoiceContext = {
  port: Port;
  headTypeId: number;
  castingNumber: string;
  cutsPort: boolean;
  /** Label of the program's released revision for this head type and port, to name the alternative. */
  releasedAlternative?: string | null;
};

export function whyNotChoosable(rev: CandidateRevision | null, ctx: ChoiceContext): string | null {
  const portWord = PORT_LABEL[ctx.port].toLowerCase();
  if (!ctx.cutsPort) return `This job does not cut the ${portWord} port; tick it on the job first.`;
  if (!rev) return "That revision was not found.";
  if (rev.headTypeId !== ctx.headTypeId) return `${rev.label} belongs to another casting; this job is for ${ctx.castingNumber}.`;
  if (rev.port !== ctx.port) return `${rev.label} cuts the ${PORT_LABEL[rev.port].toLowerCase()} port, not the ${portWord} port.`;
  if (rev.state !== "released") {
    const alt = ctx.releasedAlternative && ctx.releasedAlternative !== rev.label ? ` The released one is ${ctx.releasedAlternative}.` : "";
    return `${rev.label} is ${REVISION_STATE_LABEL[rev.state].toLowerCase()}: only a released revision can be chosen for a job.${alt}`;
  }
  if (!rev.hasToolpath) return `${rev.label} has no stored toolpath file, so the machine could not fetch it.`;
  return null;
}
