/**
 * A revision's life: draft → proving → released → superseded or withdrawn. Who may make each
 * move, as data, so the screens offer only allowed moves and the verbs enforce the same table.
 * Release (proving → released) needs a password signature and is its own verb; superseding
 * happens only as a side effect of releasing the next revision.
 */
import type { RevisionState, Role } from "@/db/enums";
import { LEADS, MACHINISTS } from "../auth/roles";

export type RevisionMove = {
  from: RevisionState;
  to: RevisionState;
  roles: readonly Role[];
  label: string;
  /** The move must carry a written reason. */
  needsNote?: boolean;
  /** Made only by the release verb (password, flow tests) or as its side effect. */
  special?: "release" | "supersede";
};

export const REVISION_MOVES: readonly RevisionMove[] = [
  { from: "draft", to: "proving", roles: MACHINISTS, label: "Send to proving" },
  { from: "proving", to: "draft", roles: MACHINISTS, label: "Back to draft", needsNote: true },
  { from: "proving", to: "released", roles: LEADS, label: "Release", special: "release" },
  { from: "released", to: "superseded", roles: LEADS, label: "Supersede", special: "supersede" },
  { from: "draft", to: "withdrawn", roles: LEADS, label: "Withdraw", needsNote: true },
  { from: "proving", to: "withdrawn", roles: LEADS, label: "Withdraw", needsNote: true },
  { from: "released", to: "withdrawn", roles: LEADS, label: "Withdraw", needsNote: true },
];

export const REVISION_STATE_LABEL: Record<RevisionState, string> = {
  draft: "Draft",
  proving: "Proving",
  released: "Released",
  superseded: "Superseded",
  withdrawn: "Withdrawn",
};

export function findRevisionMove(from: RevisionState, to: RevisionState): RevisionMove | undefined {
  return REVISION_MOVES.find((m) => m.from === from && m.to === to);
}

/** The moves a person with this role may start from this state (including release). */
export function revisionMovesFor(from: RevisionState, role: Role): RevisionMove[] {
  return REVISION_MOVES.filter((m) => m.from === from && m.roles.includes(role) && m.special !== "supersede");
}

/** Files, fields and analyses can change only while a revision is a draft. */
export function isEditable(state: RevisionState): boolean {
  return state === "draft";
}

/** Released, superseded and withdrawn-after-release revisions are frozen by the database too. */
export function isFrozen(state: RevisionState): boolean {
  return state === "released" || state === "superseded" || state === "withdrawn";
}
