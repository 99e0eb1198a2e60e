/** The handoff board: masters and revisions by stage, from hand porting to released. */
import { and, desc, eq, inArray, ne } from "drizzle-orm";
import type { Db } from "../client";
import { headTypes, masterHeads, programs, revisions, users, type MasterStage, type Port, type RevisionState } from "../schema";

export const BOARD_STAGES = ["hand_porting", "ready_to_digitize", "digitized", "programmed", "proving", "released"] as const;
export type BoardStage = (typeof BOARD_STAGES)[number];

export type BoardCard =
  | { type: "master"; id: number; label: string; castingNumber: string; stage: MasterStage; who: string | null; updatedAt: number }
  | { type: "revision"; id: number; programId: number; programName: string; port: Port; letter: string; castingNumber: string; state: RevisionState; who: string | null; updatedAt: number };

const REVISION_COLUMN: Partial<Record<RevisionState, BoardStage>> = { draft: "programmed", proving: "proving", released: "released" };

export function handoffBoard(db: Db, opts: { limitPerColumn?: number } = {}): Record<BoardStage, BoardCard[]> {
  const limit = opts.limitPerColumn ?? 100;
  const board = Object.fromEntries(BOARD_STAGES.map((s) => [s, [] as BoardCard[]])) as Record<BoardStage, BoardCard[]>;
  const masters = db
    .select({ id: masterHeads.id, label: masterHeads.label, castingNumber: headTypes.castingNumber, stage: masterHeads.stage, who: users.name, updatedAt: masterHeads.updatedAt })
    .from(masterHeads)
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .leftJoin(users, eq(users.id, masterHeads.porterId))
    .where(ne(masterHeads.stage, "retired"))
    .orderBy(desc(masterHeads.updatedAt))
    .all();
  for (const m of masters) {
    const col = board[m.stage as BoardStage];
    if (col && col.length < limit) col.push({ type: "master", ...m });
  }
  const revs = db
    .select({ id: revisions.id, programId: programs.id, programName: programs.name, port: programs.port, letter: revisions.letter, castingNumber: headTypes.castingNumber, state: revisions.state, who: users.name, updatedAt: revisions.updatedAt })
    .from(revisions)
    .innerJoin(programs, eq(programs.id, revisions.programId))
    .innerJoin(headTypes, eq(headTypes.id, programs.headTypeId))
    .leftJoin(users, eq(users.id, revisions.createdById))
    .where(and(inArray(revisions.state, ["draft", "proving", "released"])))
    .orderBy(desc(revisions.updatedAt))
    .all();
  for (const r of revs) {
    const col = board[REVISION_COLUMN[r.state]!];
    if (col.length < limit) col.push({ type: "revision", ...r });
  }
  return board;
}
