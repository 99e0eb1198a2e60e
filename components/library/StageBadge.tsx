import type { MasterStage, RevisionState } from "@/db/enums";
import { MASTER_STAGE_LABEL } from "@/lib/library/stages";
import { REVISION_STATE_LABEL } from "@/lib/programs/states";
import { Badge, type Tone } from "../ui/Badge";

const STAGE_TONE: Record<MasterStage, Tone> = { hand_porting: "neutral", ready_to_digitize: "copper", digitized: "ok", retired: "neutral" };
const STATE_TONE: Record<RevisionState, Tone> = { draft: "neutral", proving: "warn", released: "ok", superseded: "neutral", withdrawn: "bad" };

export function StageBadge({ stage }: { stage: MasterStage }) {
  return <Badge tone={STAGE_TONE[stage]}>{MASTER_STAGE_LABEL[stage]}</Badge>;
}

export function RevisionBadge({ state }: { state: RevisionState }) {
  return <Badge tone={STATE_TONE[state]}>{REVISION_STATE_LABEL[state]}</Badge>;
}

const ANALYSIS_WORDS = { queued: ["Queued", "neutral"], running: ["Analysing", "copper"], done: ["Analysed", "ok"], failed: ["Analysis failed", "bad"] } as const;

export function AnalysisBadge({ state }: { state: keyof typeof ANALYSIS_WORDS | null | undefined }) {
  if (!state) return <Badge>No file</Badge>;
  const [words, tone] = ANALYSIS_WORDS[state];
  return <Badge tone={tone}>{words}</Badge>;
}
