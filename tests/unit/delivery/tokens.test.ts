import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { machines, machineTokens, users } from "@/db/schema";
import { deliveryFileName, type ProgramPlan } from "@/lib/delivery/program";
import { authenticateMachine, newMachineToken, TOKEN_PREFIX } from "@/lib/delivery/tokens";
import { freshDb } from "../../support/db";

describe("machine tokens", () => {
  it("carry 32 random bytes and are stored as their SHA-256 only", () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const { token, tokenHash } = newMachineToken();
      expect(token.startsWith(TOKEN_PREFIX)).toBe(true);
      expect(Buffer.from(token.slice(TOKEN_PREFIX.length), "base64url")).toHaveLength(32);
      expect(tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
      seen.add(token);
    }
    expect(seen.size).toBe(200);
  });

  it("authenticate only as `Bearer <token>` of an active, unrevoked token", () => {
    const db = freshDb();
    const machine = db.insert(machines).values({ name: "Cell 1", axes: "XYZ", limits: { travelMm: {}, rotaryDeg: {}, rapidPerMin: {} }, maxFeedMmMin: 1, maxSpindleRpm: 1, toolChangeS: 1 }).returning().get();
    const admin = db.insert(users).values({ email: "a@x.invalid", name: "A", role: "admin" }).returning().get();
    const live = newMachineToken();
    const dead = newMachineToken();
    db.insert(machineTokens).values({ machineId: machine.id, label: "live", tokenHash: live.tokenHash, createdById: admin.id }).run();
    db.insert(machineTokens).values({ machineId: machine.id, label: "dead", tokenHash: dead.tokenHash, createdById: admin.id, revokedAt: 1 }).run();

    const caller = authenticateMachine(db, `Bearer ${live.token}`);
    expect(caller).toMatchObject({ machineId: machine.id, machineName: "Cell 1", label: "live" });
    expect(caller.actor.id).toBeNull();
    expect(caller.actor.email).not.toContain(live.token);
    expect(authenticateMachine(db, `bearer   ${live.token}  `).tokenId).toBe(caller.tokenId);
    for (const header of [null, "", live.token, `Basic ${live.token}`, `Bearer ${dead.token}`, `Bearer ${live.token}x`, "Bearer a b"]) {
      expect(() => authenticateMachine(db, header)).toThrow(expect.objectContaining({ code: "unauthenticated" }));
    }
  });
});

describe("the delivered file's name", () => {
  it("names job, port, program and letter, keeping the file's extension", () => {
    const plan = {
      jobNumber: "J-2026-007",
      port: "intake",
      revision: { programName: "Street intake", letter: "B" },
      file: { originalName: "street-intake-b.ngc" },
    } as unknown as ProgramPlan;
    expect(deliveryFileName(plan)).toBe("J-2026-007-intake-Street-intake-B.ngc");
    expect(deliveryFileName({ ...plan, file: { ...plan.file, originalName: "no extension" } } as ProgramPlan)).toBe("J-2026-007-intake-Street-intake-B.nc");
  });
});
