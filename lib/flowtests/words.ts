/** The words screens, the PDF and the API use for a flow test's fixed values (states in words). */
import type { FlowSubject } from "./schema";

export const SUBJECT_WORDS: Record<FlowSubject, string> = {
  baseline: "Stock baseline",
  master: "Master head",
  revision: "Program revision (first cut)",
  head: "Production head",
};

/** Shorter, for badges and table cells. */
export const SUBJECT_SHORT: Record<FlowSubject, string> = {
  baseline: "Baseline",
  master: "Master",
  revision: "Revision",
  head: "Head",
};

export const PORT_WORDS = { intake: "Intake", exhaust: "Exhaust" } as const;

/** "cyl 3, port 2", or "" when neither was recorded. */
export function portPlace(cylinder: number | null | undefined, portNumber: number | null | undefined): string {
  return [cylinder != null ? `cyl ${cylinder}` : "", portNumber != null ? `port ${portNumber}` : ""].filter(Boolean).join(", ");
}

/** How the bench was set up, in words. */
export function benchSetup(entryRadius: boolean, exhaustPipe: boolean): string {
  return [entryRadius ? "with entry radius" : "no entry radius", exhaustPipe ? "with exhaust pipe" : "no exhaust pipe"].join(", ");
}

/** Fixed decimals, "—" for missing values (same look on screen and paper). */
export function fixed(value: number | null | undefined, digits: number): string {
  return value == null || !Number.isFinite(value) ? "—" : value.toFixed(digits);
}
