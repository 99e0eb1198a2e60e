/**
 * Planned machine time: each chosen revision's cycle time × ports per head × heads, plus the
 * setup. Pure, so the job page, the schedule and the tests compute it the same way. A port whose
 * revision has no finished analysis makes the whole figure unknown rather than too small.
 */
import type { Port } from "@/db/enums";

export type PortCycle = {
  port: Port;
  /** Seconds for one run of the program (one port), from the toolpath analysis; null = not analysed. */
  cycleTimeS: number | null;
  /** False when no revision is chosen for this port yet. */
  revisionChosen: boolean;
};

export type PlanInput = {
  ports: PortCycle[];
  portsPerHead: number;
  heads: number;
  setupMinutes: number;
};

export type Plan =
  | { known: true; totalS: number; cuttingS: number; setupS: number; perPortS: Partial<Record<Port, number>> }
  | { known: false; reason: "no_ports" | "no_revision" | "not_analysed"; ports: Port[] };

export function plannedMachineTime(input: PlanInput): Plan {
  if (input.ports.length === 0) return { known: false, reason: "no_ports", ports: [] };
  const unchosen = input.ports.filter((p) => !p.revisionChosen).map((p) => p.port);
  if (unchosen.length) return { known: false, reason: "no_revision", ports: unchosen };
  const missing = input.ports.filter((p) => p.cycleTimeS == null || !Number.isFinite(p.cycleTimeS)).map((p) => p.port);
  if (missing.length) return { known: false, reason: "not_analysed", ports: missing };
  const perPortS: Partial<Record<Port, number>> = {};
  let cuttingS = 0;
  for (const p of input.ports) {
    const s = p.cycleTimeS! * input.portsPerHead * input.heads;
    perPortS[p.port] = s;
    cuttingS += s;
  }
  const setupS = input.setupMinutes * 60;
  return { known: true, totalS: cuttingS + setupS, cuttingS, setupS, perPortS };
}

export const PLAN_UNKNOWN_TEXT: Record<Extract<Plan, { known: false }>["reason"], string> = {
  no_ports: "no port to cut",
  no_revision: "no revision chosen yet",
  not_analysed: "not yet analysed",
};

/**
 * Ports of one kind on one head when the job does not say: one per cylinder on the casting.
 * A vee or flat engine has two heads, so half its cylinders sit on each.
 */
export function defaultPortsPerHead(headType: { cylinders: number; engineFamily: string }): number {
  const split = /\b(v|w)\s?-?\d+\b|\bflat\b|\bboxer\b|\bopposed\b/i.test(headType.engineFamily);
  return Math.max(1, split ? Math.ceil(headType.cylinders / 2) : headType.cylinders);
}

/** "1 h 05 min" for planning figures (minutes are the useful resolution here). */
export function formatHours(seconds: number): string {
  const totalMin = Math.round(seconds / 60);
  const h = Math.floor(totalMin / 60);
  const m = totalMin % 60;
  return h > 0 ? `${h} h ${String(m).padStart(2, "0")} min` : `${m} min`;
}
