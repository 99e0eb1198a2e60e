import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { analyses, storedFiles, users } from "@/db/schema";
import { claim, claimNext, enqueueAnalysis, engineFor, markFailed, queuedCount, requeueInterrupted, rerunAnalysis } from "@/lib/analysis/queue";
import { freshDb } from "../../support/db";

function setup() {
  const db = freshDb();
  const u = db.insert(users).values({ email: "m@test.invalid", name: "M", role: "machinist" }).returning().get();
  const a = db.insert(users).values({ email: "a@test.invalid", name: "A", role: "auditor" }).returning().get();
  const file = (n: number) =>
    db.insert(storedFiles).values({ kind: "toolpath", storageKey: `toolpath/aa/aaaaaaaa${n}`, originalName: `${n}.nc`, sizeBytes: 10, sha256: "0".repeat(64), state: "stored" }).returning().get().id;
  const actor = (x: typeof u) => ({ id: x.id, email: x.email, name: x.name, role: x.role });
  return { db, machinist: actor(u), auditor: actor(a), file };
}

describe("the analysis queue", () => {
  it("picks the engine by file kind and refuses the others", () => {
    expect(engineFor("toolpath")).toBe("toolpath");
    expect(engineFor("point_cloud")).toBe("geometry");
    expect(engineFor("photo")).toBeNull();
  });

  it("hands out queued analyses oldest first, each exactly once", () => {
    const { db, file } = setup();
    const a = enqueueAnalysis(db, file(1), "toolpath");
    const b = enqueueAnalysis(db, file(2), "toolpath");
    expect(queuedCount(db)).toBe(2);
    expect(claimNext(db)).toBe(a);
    expect(claim(db, a)).toBe(false); // already running
    expect(claimNext(db)).toBe(b);
    expect(claimNext(db)).toBeNull();
  });

  it("puts analyses a crash left running back in the queue", () => {
    const { db, file } = setup();
    const a = enqueueAnalysis(db, file(1), "toolpath");
    claimNext(db);
    expect(requeueInterrupted(db)).toBe(1);
    expect(db.select().from(analyses).where(eq(analyses.id, a)).get()!.state).toBe("queued");
  });

  it("re-runs a failed analysis for a machinist, not for an auditor, and not while running", () => {
    const { db, file, machinist, auditor } = setup();
    const a = enqueueAnalysis(db, file(1), "toolpath");
    expect(() => rerunAnalysis(db, machinist, a)).toThrow(/already queued or running/);
    claimNext(db);
    markFailed(db, a, "not G-code: line 1");
    expect(() => rerunAnalysis(db, auditor, a)).toThrow(/role/);
    expect(rerunAnalysis(db, machinist, a)).toEqual({ id: a, state: "queued" });
    const row = db.select().from(analyses).where(eq(analyses.id, a)).get()!;
    expect(row).toMatchObject({ state: "queued", error: null, progress: 0 });
  });
});
