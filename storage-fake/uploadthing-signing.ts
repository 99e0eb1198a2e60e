/**
 * HMAC-SHA256 signatures as the uploadthing SDK writes them (`hmac-sha256=<hex>`, keyed with the
 * API key): on callback bodies and on presigned URLs, where the signature covers the whole URL
 * up to `&signature=` and `expires` is a time in milliseconds.
 */
import crypto from "node:crypto";

const PREFIX = "hmac-sha256=";

export function signPayload(payload: string, apiKey: string): string {
  return PREFIX + crypto.createHmac("sha256", apiKey).update(payload, "utf8").digest("hex");
}

export function verifyPayload(payload: string, signature: string | null | undefined, apiKey: string): boolean {
  if (!signature?.startsWith(PREFIX)) return false;
  const given = Buffer.from(signature.slice(PREFIX.length), "hex");
  const expected = crypto.createHmac("sha256", apiKey).update(payload, "utf8").digest();
  return given.length === expected.length && crypto.timingSafeEqual(given, expected);
}

export type SignedUrlCheck = { ok: true; params: URLSearchParams } | { ok: false; reason: string };

/**
 * Checks a presigned URL as received. `origins` are the base URLs it may have been signed for
 * (the SDK signs with the configured ingest URL, which may name the host differently from the
 * Host header we see, e.g. localhost vs 127.0.0.1).
 */
export function verifySignedUrl(pathAndQuery: string, origins: string[], apiKey: string, now = Date.now()): SignedUrlCheck {
  const at = pathAndQuery.lastIndexOf("&signature=");
  if (at < 0) return { ok: false, reason: "missing signature" };
  const signature = decodeURIComponent(pathAndQuery.slice(at + "&signature=".length).split("&")[0] ?? "");
  const signed = pathAndQuery.slice(0, at);
  if (!origins.some((origin) => verifyPayload(origin.replace(/\/$/, "") + signed, signature, apiKey))) {
    return { ok: false, reason: "invalid signature" };
  }
  const params = new URL(pathAndQuery, "http://x").searchParams;
  const expires = Number(params.get("expires"));
  if (!Number.isFinite(expires) || expires <= 0) return { ok: false, reason: "missing expiry" };
  if (now > expires) return { ok: false, reason: "URL expired" };
  return { ok: true, params };
}

/** The SDK URL-encodes each `x-ut-*` value before URLSearchParams encodes it again. */
export function utParam(params: URLSearchParams, name: string): string | undefined {
  const raw = params.get(name);
  if (raw === null) return undefined;
  try {
    return decodeURIComponent(raw);
  } catch {
    return raw;
  }
}

/** Builds a URL the way the SDK does, for our own signed file links. */
export function signUrl(url: string, apiKey: string, ttlSeconds: number, now = Date.now()): string {
  const parsed = new URL(url);
  parsed.searchParams.append("expires", String(now + ttlSeconds * 1000));
  const signature = signPayload(parsed.toString(), apiKey);
  parsed.searchParams.append("signature", signature);
  return parsed.href;
}
