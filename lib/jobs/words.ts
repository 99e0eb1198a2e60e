/**
 * The words the screens, e-mails and CSV exports use for the stored codes. Plain constants, so
 * browser code can import them; a state is always shown in words, never by colour alone.
 */
import type { JobState, Port, RevisionState } from "@/db/enums";

export const JOB_STATE_LABEL: Record<JobState, string> = {
  quoted: "Quoted",
  scheduled: "Scheduled",
  on_machine: "On the machine",
  in_inspection: "In inspection",
  shipped: "Shipped",
  cancelled: "Cancelled",
};

export const HEAD_STATES = ["received", "cutting", "cut", "scrapped", "shipped"] as const;
export type HeadState = (typeof HEAD_STATES)[number];

export const HEAD_STATE_LABEL: Record<HeadState, string> = {
  received: "Received",
  cutting: "Being cut",
  cut: "Cut",
  scrapped: "Scrapped",
  shipped: "Shipped",
};

export type HeadSource = "customer_core" | "shop_stock";
export const HEAD_SOURCE_LABEL: Record<HeadSource, string> = {
  customer_core: "Customer's core",
  shop_stock: "Shop stock",
};

export type CutOutcome = "good" | "rework" | "scrap";
export const CUT_OUTCOME_LABEL: Record<CutOutcome, string> = {
  good: "Good",
  rework: "Needs rework",
  scrap: "Scrapped",
};

export const PORT_LABEL: Record<Port, string> = { intake: "Intake", exhaust: "Exhaust" };

export const REVISION_STATE_LABEL: Record<RevisionState, string> = {
  draft: "Draft",
  proving: "Proving",
  released: "Released",
  superseded: "Superseded",
  withdrawn: "Withdrawn",
};

/** Tone of a badge for each state; the word is always printed beside it. */
export type Tone = "neutral" | "copper" | "ok" | "warn" | "bad";

export const JOB_STATE_TONE: Record<JobState, Tone> = {
  quoted: "neutral",
  scheduled: "copper",
  on_machine: "copper",
  in_inspection: "warn",
  shipped: "ok",
  cancelled: "neutral",
};

export const HEAD_STATE_TONE: Record<HeadState, Tone> = {
  received: "neutral",
  cutting: "copper",
  cut: "ok",
  scrapped: "bad",
  shipped: "ok",
};

export const CUT_OUTCOME_TONE: Record<CutOutcome, Tone> = { good: "ok", rework: "warn", scrap: "bad" };

export const REVISION_STATE_TONE: Record<RevisionState, Tone> = {
  draft: "neutral",
  proving: "warn",
  released: "ok",
  superseded: "bad",
  withdrawn: "bad",
};
