/**
 * A head's state follows from its cuts: scrapped as soon as one cut is scrap; cut when every
 * port the job cuts has a good latest cut; being cut once any cut exists; received before.
 * Shipping is the one state set by a move of the job, never derived.
 */
import type { Port } from "@/db/enums";
import type { CutOutcome, HeadState } from "./words";

export type CutFact = { id: number; port: Port; outcome: CutOutcome; startedAt: number };

export function headStateFromCuts(portsToCut: readonly Port[], cuts: readonly CutFact[], current: HeadState = "received"): HeadState {
  if (current === "shipped") return "shipped";
  if (cuts.some((c) => c.outcome === "scrap")) return "scrapped";
  if (cuts.length === 0) return "received";
  const latest = new Map<Port, CutFact>();
  for (const c of cuts) {
    const seen = latest.get(c.port);
    if (!seen || c.startedAt > seen.startedAt || (c.startedAt === seen.startedAt && c.id > seen.id)) latest.set(c.port, c);
  }
  const allGood = portsToCut.length > 0 && portsToCut.every((p) => latest.get(p)?.outcome === "good");
  return allGood ? "cut" : "cutting";
}
