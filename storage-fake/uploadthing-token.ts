/**
 * The UPLOADTHING_TOKEN the SDK expects: base64 of JSON `{ apiKey, appId, regions }`, where the
 * key starts with `sk_` and regions is non-empty. For local use we make our own random key and
 * keep it in the stand-in's data folder so restarts keep the app's configuration valid.
 */
import crypto from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

export type UploadthingTokenParts = { apiKey: string; appId: string; regions: string[] };

export const LOCAL_APP_ID = "portolan-local";
export const LOCAL_REGION = "local-1";

export function encodeUploadthingToken(parts: UploadthingTokenParts): string {
  if (!parts.apiKey.startsWith("sk_")) throw new Error("the uploadthing API key must start with sk_");
  if (!parts.appId) throw new Error("the uploadthing app id must not be empty");
  if (parts.regions.length === 0) throw new Error("the uploadthing token needs at least one region");
  return Buffer.from(JSON.stringify({ apiKey: parts.apiKey, appId: parts.appId, regions: parts.regions }), "utf8").toString("base64");
}

export function decodeUploadthingToken(token: string): UploadthingTokenParts {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(token.trim(), "base64").toString("utf8"));
  } catch {
    throw new Error("UPLOADTHING_TOKEN is not base64-encoded JSON");
  }
  const p = parsed as Partial<UploadthingTokenParts>;
  if (typeof p.apiKey !== "string" || !p.apiKey.startsWith("sk_")) throw new Error("UPLOADTHING_TOKEN: apiKey must be a string starting with sk_");
  if (typeof p.appId !== "string" || !p.appId) throw new Error("UPLOADTHING_TOKEN: appId is missing");
  if (!Array.isArray(p.regions) || p.regions.length === 0 || !p.regions.every((r) => typeof r === "string")) {
    throw new Error("UPLOADTHING_TOKEN: regions must be a non-empty list of strings");
  }
  return { apiKey: p.apiKey, appId: p.appId, regions: p.regions };
}

/** A fresh token with a random key, for local use only. */
export function newLocalUploadthingToken(appId = LOCAL_APP_ID): string {
  return encodeUploadthingToken({ apiKey: `sk_local_${crypto.randomBytes(24).toString("hex")}`, appId, regions: [LOCAL_REGION] });
}

/** The token kept in `dir/token`, created on first use. */
export function loadOrCreateLocalToken(dir: string): string {
  const file = path.join(dir, "token");
  try {
    const token = readFileSync(file, "utf8").trim();
    decodeUploadthingToken(token);
    return token;
  } catch {
    mkdirSync(dir, { recursive: true });
    const token = newLocalUploadthingToken();
    writeFileSync(file, `${token}\n`, { mode: 0o600 });
    return token;
  }
}
