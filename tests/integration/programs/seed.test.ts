/**
 * The demo's programs step on the foundation's people and library, against the S3 stand-in:
 * the labels later steps rely on, every generated file stored and analysed by the real engines,
 * the street revisions released in order, and an intact audit chain.
 */
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedLibrary } from "@/db/seed/library";
import { seedPeople } from "@/db/seed/people";
import { seedPrograms } from "@/db/seed/programs";
import { analyses, masterHeads, programs, revisions, storedFiles } from "@/db/schema";
import { verifyAuditChain } from "@/lib/audit/verify";
import { createStorage } from "@/lib/storage";
import { freshDb } from "../../support/db";
import { startTestS3, type TestS3 } from "../support/fakes";

let s3: TestS3;
beforeAll(async () => {
  s3 = await startTestS3();
});
afterAll(async () => {
  await s3?.stop();
});

describe("seedPrograms", () => {
  it("leaves masters at each stage and the street programs released, every file analysed", async () => {
    const db = freshDb();
    const people = seedPeople(db);
    const library = seedLibrary(db);
    const store = createStorage(s3.config);
    await seedPrograms(db, { people, library }, store);

    const stage = (label: string) => db.select({ stage: masterHeads.stage }).from(masterHeads).where(eq(masterHeads.label, label)).get()?.stage;
    expect(stage("M-4471-01")).toBe("digitized");
    expect(stage("M-2205-01")).toBe("ready_to_digitize");
    expect(stage("M-9032-01")).toBe("hand_porting");

    const revs = db.select({ program: programs.name, letter: revisions.letter, state: revisions.state, parentId: revisions.parentId, id: revisions.id }).from(revisions).innerJoin(programs, eq(programs.id, revisions.programId)).all();
    const find = (p: string, l: string) => revs.find((r) => r.program === p && r.letter === l)!;
    expect(find("Street intake", "A").state).toBe("superseded");
    expect(find("Street intake", "B").state).toBe("released");
    expect(find("Street intake", "B").parentId).toBe(find("Street intake", "A").id);
    expect(find("Street exhaust", "A").state).toBe("released");
    expect(find("Race intake", "A").state).toBe("proving");

    const all = db.select({ state: analyses.state, engine: analyses.engine, result: analyses.result, preview: analyses.previewFileId }).from(analyses).all();
    expect(all.filter((a) => a.engine === "toolpath")).toHaveLength(4);
    expect(all.filter((a) => a.engine === "geometry")).toHaveLength(2);
    expect(all.every((a) => a.state === "done" && a.preview !== null)).toBe(true);
    // Released programs must pass the machine and plate checks they were released against.
    for (const a of all.filter((x) => x.engine === "toolpath")) expect((a.result as { violations: unknown[] }).violations).toEqual([]);

    const files = db.select().from(storedFiles).where(eq(storedFiles.kind, "toolpath")).all();
    for (const f of files) {
      expect(f.sizeBytes).toBeGreaterThan(2_000_000); // a few MB each
      expect((await store.verifyObject(f.storageKey, f.sha256!)).sizeBytes).toBe(f.sizeBytes);
    }
    expect(verifyAuditChain(db.$client).ok).toBe(true);
  });
});
