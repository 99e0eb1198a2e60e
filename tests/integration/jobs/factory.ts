/**
 * Small factories for the records other parts of the product own (head types, machines,
 * programs, revisions and their files), written straight into the database the way those parts
 * leave them: a released revision is a row moved to `released` after its files were attached,
 * so the database's triggers freeze it exactly as in production.
 */
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { analyses, headTypes, machines, programs, revisionFiles, revisions, storedFiles, type Port, type RevisionState } from "@/db/schema";

let n = 0;
const next = () => ++n;

export function makeHeadType(db: Db, overrides: Partial<typeof headTypes.$inferInsert> = {}) {
  const i = next();
  return db
    .insert(headTypes)
    .values({
      castingNumber: `TST-${i}-A`,
      engineFamily: "Test 4.0 V8",
      cylinders: 8,
      valvesPerCylinder: 2,
      boreMm: 101.6,
      strokeMm: 88.4,
      intakeValveMm: 51.3,
      exhaustValveMm: 40.6,
      ...overrides,
    })
    .returning()
    .get();
}

export function makeMachine(db: Db, name = `Test cell ${next()}`) {
  return db
    .insert(machines)
    .values({ name, axes: "XYZAB", limits: { travelMm: {}, rotaryDeg: {}, rapidPerMin: {} }, maxFeedMmMin: 10000, maxSpindleRpm: 15000, toolChangeS: 6 })
    .returning()
    .get();
}

export function makeProgram(db: Db, headTypeId: number, port: Port, name = `Test ${port} ${next()}`) {
  return db.insert(programs).values({ headTypeId, port, name }).returning().get();
}

export const sha256 = (text: string | Buffer) => createHash("sha256").update(text).digest("hex");

export type RevisionOptions = {
  letter?: string;
  state?: RevisionState;
  /** The toolpath's bytes (their SHA-256 and size are recorded); a storage key is made up unless given. */
  content?: string;
  storageKey?: string;
  /** null = no finished analysis. */
  cycleTimeS?: number | null;
  withToolpath?: boolean;
};

/** A revision with one toolpath file (stored, hashed, analysed), moved to `state` last. */
export function makeRevision(db: Db, programId: number, opts: RevisionOptions = {}) {
  const i = next();
  const content = opts.content ?? `(test program ${i})\nG21 G90\nG1 X${i} Y1 F600\nM30\n`;
  const rev = db
    .insert(revisions)
    .values({ programId, letter: opts.letter ?? String.fromCharCode(64 + (i % 26 || 26)) + i, state: "draft", changeNote: "test" })
    .returning()
    .get();
  let file: typeof storedFiles.$inferSelect | null = null;
  if (opts.withToolpath !== false) {
    file = db
      .insert(storedFiles)
      .values({
        kind: "toolpath",
        storageKey: opts.storageKey ?? `toolpath/te/test${i}${Date.now()}`,
        originalName: `test-${i}.nc`,
        contentType: "text/plain",
        sizeBytes: Buffer.byteLength(content),
        sha256: sha256(content),
        state: "stored",
      })
      .returning()
      .get();
    db.insert(revisionFiles).values({ revisionId: rev.id, fileId: file.id, role: "toolpath" }).run();
    const cycle = opts.cycleTimeS === undefined ? 600 : opts.cycleTimeS;
    if (cycle !== null) {
      db.insert(analyses).values({ fileId: file.id, engine: "toolpath", state: "done", progress: 1, result: { cycleTimeS: cycle, sha256: file.sha256 } }).run();
    }
  }
  const state = opts.state ?? "released";
  if (state !== "draft") moveRevision(db, rev.id, state);
  return { revision: db.select().from(revisions).where(eq(revisions.id, rev.id)).get()!, file, content };
}

/** Moves a revision the way the library does (through released for the ended states). */
export function moveRevision(db: Db, id: number, to: RevisionState, reason = "test move") {
  const now = Date.now();
  const current = db.select().from(revisions).where(eq(revisions.id, id)).get()!;
  if ((to === "superseded" || to === "withdrawn") && current.state !== "released") moveRevision(db, id, "released");
  if (to === "released") {
    db.update(revisions).set({ state: "released", releasedAt: now, releaseSignature: `sig-${id}` }).where(eq(revisions.id, id)).run();
  } else if (to === "superseded" || to === "withdrawn") {
    db.update(revisions).set({ state: to, endReason: reason, updatedAt: now }).where(eq(revisions.id, id)).run();
  } else {
    db.update(revisions).set({ state: to }).where(eq(revisions.id, id)).run();
  }
}

/** A casting with a machine, an intake and an exhaust program, each with a released revision. */
export function makeShopSetup(db: Db, opts: { intake?: RevisionOptions; exhaust?: RevisionOptions } = {}) {
  const headType = makeHeadType(db);
  const machine = makeMachine(db);
  const intakeProgram = makeProgram(db, headType.id, "intake");
  const exhaustProgram = makeProgram(db, headType.id, "exhaust");
  const intake = makeRevision(db, intakeProgram.id, { letter: "A", ...opts.intake });
  const exhaust = makeRevision(db, exhaustProgram.id, { letter: "A", ...opts.exhaust });
  return { headType, machine, intakeProgram, exhaustProgram, intake, exhaust };
}
