import { createHash } from "node:crypto";

/** JSON with sorted keys, so the same content always hashes the same. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value && typeof value === "object") {
    return Object.fromEntries(
      Object.keys(value as Record<string, unknown>)
        .sort()
        .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
        .map((k) => [k, sortKeys((value as Record<string, unknown>)[k])]),
    );
  }
  return value;
}

export type AuditContent = {
  at: number;
  actorId: number | null;
  actorEmail: string;
  action: string;
  entity: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
};

/** Each event's hash covers the previous hash and its own content: editing any row breaks the chain from there on. */
export function eventHash(prevHash: string, content: AuditContent): string {
  return createHash("sha256")
    .update(prevHash)
    .update("\n")
    .update(
      canonicalJson({
        ...content,
        before: content.before ?? null,
        after: content.after ?? null,
      }),
    )
    .digest("hex");
}
