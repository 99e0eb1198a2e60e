/**
 * The master head's stages along the handoff and who may move it between them. Pure, so the
 * board can show only the moves a person may make and the verb enforces the same table.
 */
import type { MasterStage, Role } from "@/db/enums";
import { LEADS, MACHINISTS, PORTERS } from "../auth/roles";

export type MasterMove = { from: MasterStage; to: MasterStage; roles: readonly Role[]; label: string };

export const MASTER_MOVES: readonly MasterMove[] = [
  { from: "hand_porting", to: "ready_to_digitize", roles: PORTERS, label: "Hand over for digitizing" },
  { from: "ready_to_digitize", to: "hand_porting", roles: PORTERS, label: "Back to hand porting" },
  { from: "ready_to_digitize", to: "digitized", roles: MACHINISTS, label: "Mark digitized" },
  { from: "digitized", to: "ready_to_digitize", roles: MACHINISTS, label: "Digitize again" },
  { from: "hand_porting", to: "retired", roles: LEADS, label: "Retire" },
  { from: "ready_to_digitize", to: "retired", roles: LEADS, label: "Retire" },
  { from: "digitized", to: "retired", roles: LEADS, label: "Retire" },
];

export const MASTER_STAGE_LABEL: Record<MasterStage, string> = {
  hand_porting: "Hand porting",
  ready_to_digitize: "Ready to digitize",
  digitized: "Digitized",
  retired: "Retired",
};

export function findMasterMove(from: MasterStage, to: MasterStage): MasterMove | undefined {
  return MASTER_MOVES.find((m) => m.from === from && m.to === to);
}

export function masterMovesFor(from: MasterStage, role: Role): MasterMove[] {
  return MASTER_MOVES.filter((m) => m.from === from && m.roles.includes(role));
}
