import { describe, expect, it } from "vitest";
import { ROLES, REVISION_STATES } from "@/db/enums";
import { findRevisionMove, isEditable, isFrozen, revisionMovesFor } from "@/lib/programs/states";

describe("revision moves by role", () => {
  it("lets machinists send a draft to proving, and nobody else but leads/admins", () => {
    const allowed = ROLES.filter((r) => revisionMovesFor("draft", r).some((m) => m.to === "proving"));
    expect(allowed.sort()).toEqual(["admin", "lead", "machinist"]);
  });

  it("lets only leads and admins release and withdraw", () => {
    for (const role of ROLES) {
      const moves = revisionMovesFor("proving", role).map((m) => m.to);
      expect(moves.includes("released")).toBe(role === "lead" || role === "admin");
      expect(moves.includes("withdrawn")).toBe(role === "lead" || role === "admin");
    }
  });

  it("offers nothing to an auditor in any state", () => {
    for (const s of REVISION_STATES) expect(revisionMovesFor(s, "auditor")).toEqual([]);
  });

  it("never offers supersede as a move of its own", () => {
    for (const role of ROLES) expect(revisionMovesFor("released", role).some((m) => m.to === "superseded")).toBe(false);
    expect(findRevisionMove("released", "superseded")?.special).toBe("supersede");
  });

  it("has no way out of superseded or withdrawn, and none back from released", () => {
    for (const to of REVISION_STATES) {
      expect(findRevisionMove("superseded", to)).toBeUndefined();
      expect(findRevisionMove("withdrawn", to)).toBeUndefined();
    }
    expect(findRevisionMove("released", "draft")).toBeUndefined();
    expect(findRevisionMove("released", "proving")).toBeUndefined();
  });

  it("edits drafts only and freezes everything from release on", () => {
    expect(REVISION_STATES.filter(isEditable)).toEqual(["draft"]);
    expect(REVISION_STATES.filter(isFrozen)).toEqual(["released", "superseded", "withdrawn"]);
  });
});
