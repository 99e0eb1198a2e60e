import { describe, expect, it } from "vitest";
import { headStateFromCuts, type CutFact } from "@/lib/jobs/head-state";
import { whyNotChoosable, type CandidateRevision, type ChoiceContext } from "@/lib/jobs/revision-choice";
import { customerUpdateSchema, cutSchema, jobCreateSchema } from "@/lib/jobs/schema";

const released: CandidateRevision = { label: "Street intake B", state: "released", port: "intake", headTypeId: 1, hasToolpath: true };
const ctx: ChoiceContext = { port: "intake", headTypeId: 1, castingNumber: "HL-4471-A", cutsPort: true, releasedAlternative: "Street intake B" };

describe("choosing a revision", () => {
  it("accepts a released revision of the job's casting and port", () => {
    expect(whyNotChoosable(released, ctx)).toBeNull();
  });
  it("explains every refusal in words", () => {
    expect(whyNotChoosable({ ...released, label: "Street intake A", state: "superseded" }, ctx)).toBe(
      "Street intake A is superseded: only a released revision can be chosen for a job. The released one is Street intake B.",
    );
    expect(whyNotChoosable({ ...released, state: "proving" }, { ...ctx, releasedAlternative: null })).toMatch(/is proving: only a released/);
    expect(whyNotChoosable({ ...released, port: "exhaust" }, ctx)).toMatch(/cuts the exhaust port, not the intake port/);
    expect(whyNotChoosable({ ...released, headTypeId: 2 }, ctx)).toMatch(/another casting; this job is for HL-4471-A/);
    expect(whyNotChoosable({ ...released, hasToolpath: false }, ctx)).toMatch(/no stored toolpath/);
    expect(whyNotChoosable(released, { ...ctx, cutsPort: false })).toMatch(/does not cut the intake port/);
    expect(whyNotChoosable(null, ctx)).toMatch(/not found/);
  });
});

describe("a head's state from its cuts", () => {
  const c = (id: number, port: CutFact["port"], outcome: CutFact["outcome"], startedAt = id): CutFact => ({ id, port, outcome, startedAt });
  it("follows the latest cut of each port", () => {
    expect(headStateFromCuts(["intake", "exhaust"], [])).toBe("received");
    expect(headStateFromCuts(["intake", "exhaust"], [c(1, "intake", "good")])).toBe("cutting");
    expect(headStateFromCuts(["intake", "exhaust"], [c(1, "intake", "good"), c(2, "exhaust", "good")])).toBe("cut");
    expect(headStateFromCuts(["intake"], [c(1, "intake", "rework"), c(2, "intake", "good")])).toBe("cut");
    expect(headStateFromCuts(["intake"], [c(1, "intake", "good"), c(2, "intake", "rework")])).toBe("cutting");
    // Same start time: the later record wins.
    expect(headStateFromCuts(["intake"], [c(2, "intake", "good", 5), c(1, "intake", "rework", 5)])).toBe("cut");
  });
  it("is scrapped by any scrap cut and stays shipped once shipped", () => {
    expect(headStateFromCuts(["intake"], [c(1, "intake", "good"), c(2, "intake", "scrap")])).toBe("scrapped");
    expect(headStateFromCuts(["intake"], [c(1, "intake", "scrap")], "shipped")).toBe("shipped");
  });
});

describe("the shared schemas", () => {
  it("demand a reason for a cut that is not good, and an end after the start", () => {
    const base = { headId: 1, port: "intake", startedAt: 1_000, outcome: "good" };
    expect(cutSchema.safeParse(base).success).toBe(true);
    const scrap = cutSchema.safeParse({ ...base, outcome: "scrap" });
    expect(scrap.success).toBe(false);
    expect(scrap.error!.issues[0]!.path).toEqual(["reason"]);
    expect(cutSchema.safeParse({ ...base, outcome: "rework", reason: "  " }).success).toBe(false);
    expect(cutSchema.safeParse({ ...base, outcome: "scrap", reason: "core shift" }).success).toBe(true);
    const backwards = cutSchema.safeParse({ ...base, endedAt: 500 });
    expect(backwards.error!.issues[0]!.path).toEqual(["endedAt"]);
  });
  it("normalise job numbers and need at least one port", () => {
    const ok = jobCreateSchema.parse({ number: " j-2026-031 ", customerId: 1, headTypeId: 1, quantity: 2 });
    expect(ok.number).toBe("J-2026-031");
    expect(ok.cutIntake && ok.cutExhaust).toBe(true);
    expect(ok.setupMinutes).toBe(60);
    expect(jobCreateSchema.safeParse({ customerId: 1, headTypeId: 1, quantity: 2, cutIntake: false, cutExhaust: false }).success).toBe(false);
    expect(jobCreateSchema.safeParse({ customerId: 1, headTypeId: 1, quantity: 2, dueOn: "2026-02-30" }).success).toBe(false);
    expect(jobCreateSchema.safeParse({ number: "J 1!", customerId: 1, headTypeId: 1, quantity: 2 }).success).toBe(false);
  });
  it("leave fields out of a customer change alone (no defaults sneak in)", () => {
    expect(customerUpdateSchema.parse({ phone: "1" })).toEqual({ phone: "1" });
    expect(customerUpdateSchema.safeParse({}).success).toBe(false);
  });
});
