/**
 * The jobs demo step on top of the foundation's people and library: jobs in several states,
 * a scrapped head with its reason, and an intact audit chain — and only a quote when the
 * library has no released programs yet.
 */
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { seedLibrary } from "@/db/seed/library";
import { seedPeople } from "@/db/seed/people";
import { seedJobs } from "@/db/seed/jobs";
import { cuts, headTypes, heads, jobs, machineTokens } from "@/db/schema";
import { verifyAuditChain } from "@/lib/audit/verify";
import { freshDb } from "../../support/db";
import { makeProgram, makeRevision } from "./factory";

function base() {
  const db = freshDb();
  const people = seedPeople(db);
  seedLibrary(db);
  return { db, people };
}

describe("seedJobs", () => {
  it("builds jobs in several states with the released street revisions, one head scrapped with its reason", async () => {
    const { db, people } = base();
    const casting = db.select().from(headTypes).where(eq(headTypes.castingNumber, "HL-4471-A")).get()!;
    const intakeProgram = makeProgram(db, casting.id, "intake", "Street intake");
    makeRevision(db, intakeProgram.id, { letter: "A", state: "superseded" });
    const intakeB = makeRevision(db, intakeProgram.id, { letter: "B" });
    const exhaustA = makeRevision(db, makeProgram(db, casting.id, "exhaust", "Street exhaust").id, { letter: "A" });
    await seedJobs(db, { people });

    const states = db.select({ number: jobs.number, state: jobs.state }).from(jobs).all();
    expect(new Set(states.map((s) => s.state))).toEqual(new Set(["quoted", "scheduled", "on_machine", "in_inspection", "shipped"]));
    const scrapped = db.select().from(cuts).where(eq(cuts.outcome, "scrap")).all();
    expect(scrapped).toHaveLength(1);
    expect(scrapped[0]!.reason).toMatch(/water jacket/);
    expect(db.select().from(heads).where(eq(heads.id, scrapped[0]!.headId)).get()!.state).toBe("scrapped");
    const intakeCuts = db.select().from(cuts).where(eq(cuts.port, "intake")).all();
    expect(intakeCuts.every((c) => c.revisionId === intakeB.revision.id && c.toolpathSha256 === intakeB.file!.sha256)).toBe(true);
    expect(db.select().from(cuts).where(eq(cuts.port, "exhaust")).all().every((c) => c.revisionId === exhaustA.revision.id)).toBe(true);
    expect(db.select().from(heads).where(eq(heads.state, "shipped")).all()).toHaveLength(2);
    expect(db.select().from(machineTokens).all()).toHaveLength(0);
    expect(verifyAuditChain(db.$client).ok).toBe(true);
  });

  it("opens only quotes when the library has no released programs", async () => {
    const { db, people } = base();
    await seedJobs(db, { people });
    const all = db.select().from(jobs).all();
    expect(all.length).toBeGreaterThan(0);
    expect(all.every((j) => j.state === "quoted" && j.intakeRevisionId == null)).toBe(true);
    expect(db.select().from(cuts).all()).toHaveLength(0);
  });
});
