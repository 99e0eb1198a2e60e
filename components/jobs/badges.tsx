import type { JobState, RevisionState } from "@/db/enums";
import {
  CUT_OUTCOME_LABEL,
  CUT_OUTCOME_TONE,
  HEAD_STATE_LABEL,
  HEAD_STATE_TONE,
  JOB_STATE_LABEL,
  JOB_STATE_TONE,
  REVISION_STATE_LABEL,
  REVISION_STATE_TONE,
  type CutOutcome,
  type HeadState,
} from "@/lib/jobs/words";
import { Badge } from "../ui/Badge";

export const JobStateBadge = ({ state }: { state: JobState }) => <Badge tone={JOB_STATE_TONE[state]}>{JOB_STATE_LABEL[state]}</Badge>;
export const HeadStateBadge = ({ state }: { state: HeadState }) => <Badge tone={HEAD_STATE_TONE[state]}>{HEAD_STATE_LABEL[state]}</Badge>;
export const OutcomeBadge = ({ outcome }: { outcome: CutOutcome }) => <Badge tone={CUT_OUTCOME_TONE[outcome]}>{CUT_OUTCOME_LABEL[outcome]}</Badge>;
export const RevisionStateBadge = ({ state }: { state: RevisionState }) => <Badge tone={REVISION_STATE_TONE[state]}>{REVISION_STATE_LABEL[state]}</Badge>;

/** The flag on an open job whose chosen revision was superseded or withdrawn. */
export function RevisionFlag({ title = "Revision changed" }: { title?: string }) {
  return (
    <span data-testid="revision-flag">
      <Badge tone="bad">⚑ {title}</Badge>
    </span>
  );
}

/** The first 12 hex digits, full value on hover and for copying. */
export function ShortHash({ value }: { value: string | null | undefined }) {
  if (!value) return <span className="text-ink-faint">—</span>;
  return (
    <code className="font-mono text-xs" title={value}>
      {value.slice(0, 12)}…
    </code>
  );
}
