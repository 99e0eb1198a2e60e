import { createHash, randomBytes } from "node:crypto";

export const INVITATION_TTL_MS = 72 * 60 * 60 * 1000;
export const RESET_TTL_MS = 2 * 60 * 60 * 1000;

/** A one-time token for a link; only its hash is stored. */
export function newToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export type TokenState = "valid" | "expired" | "used" | "revoked";

export function tokenState(
  row: { expiresAt: number; usedAt?: number | null; acceptedAt?: number | null; revokedAt?: number | null },
  now = Date.now(),
): TokenState {
  if (row.revokedAt) return "revoked";
  if (row.usedAt || row.acceptedAt) return "used";
  if (now >= row.expiresAt) return "expired";
  return "valid";
}
