import { describe, expect, it } from "vitest";
import { INVITATION_TTL_MS, hashToken, newToken, tokenState } from "@/lib/auth/tokens";

describe("one-time tokens", () => {
  it("stores only a hash that matches the token", () => {
    const { token, tokenHash } = newToken();
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(tokenHash).toBe(hashToken(token));
    expect(tokenHash).not.toContain(token);
    expect(newToken().token).not.toBe(token);
  });

  it("invitations last 72 hours", () => {
    expect(INVITATION_TTL_MS).toBe(72 * 3600 * 1000);
  });

  it("expires exactly at its expiry time", () => {
    const expiresAt = 1_000_000;
    expect(tokenState({ expiresAt }, expiresAt - 1)).toBe("valid");
    expect(tokenState({ expiresAt }, expiresAt)).toBe("expired");
  });

  it("is single use and can be withdrawn", () => {
    expect(tokenState({ expiresAt: 10, acceptedAt: 5 }, 1)).toBe("used");
    expect(tokenState({ expiresAt: 10, usedAt: 5 }, 1)).toBe("used");
    expect(tokenState({ expiresAt: 10, revokedAt: 5 }, 1)).toBe("revoked");
  });
});
