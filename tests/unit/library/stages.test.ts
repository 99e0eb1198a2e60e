import { describe, expect, it } from "vitest";
import { MASTER_STAGES, ROLES } from "@/db/enums";
import { findMasterMove, masterMovesFor } from "@/lib/library/stages";

describe("master stages", () => {
  it("lets porters (and leads, admins) hand a master over, not machinists or auditors", () => {
    const who = ROLES.filter((r) => masterMovesFor("hand_porting", r).some((m) => m.to === "ready_to_digitize"));
    expect(who.sort()).toEqual(["admin", "lead", "porter"]);
  });

  it("lets machinists mark a master digitized", () => {
    expect(masterMovesFor("ready_to_digitize", "machinist").map((m) => m.to)).toContain("digitized");
    expect(masterMovesFor("ready_to_digitize", "porter").map((m) => m.to)).not.toContain("digitized");
  });

  it("has no move out of retired and none for auditors", () => {
    for (const to of MASTER_STAGES) expect(findMasterMove("retired", to)).toBeUndefined();
    for (const s of MASTER_STAGES) expect(masterMovesFor(s, "auditor")).toEqual([]);
  });
});
