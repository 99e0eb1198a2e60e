/**
 * The stand-in's token and signature handling, checked against the uploadthing SDK itself
 * (7.7.4) as the reference: URLs the SDK signs must verify, and tokens we make must be ones
 * the SDK accepts.
 */
import { describe, expect, it } from "vitest";
import { UTApi } from "uploadthing/server";
import { signPayload, signUrl, utParam, verifyPayload, verifySignedUrl } from "@/storage-fake/uploadthing-signing";
import { decodeUploadthingToken, encodeUploadthingToken, newLocalUploadthingToken } from "@/storage-fake/uploadthing-token";

const token = newLocalUploadthingToken("app-unit");
const { apiKey, appId } = decodeUploadthingToken(token);

describe("uploadthing token", () => {
  it("round-trips and is accepted by the SDK", async () => {
    expect(apiKey).toMatch(/^sk_local_[0-9a-f]{48}$/);
    expect(decodeUploadthingToken(encodeUploadthingToken({ apiKey, appId, regions: ["r1"] }))).toEqual({ apiKey, appId, regions: ["r1"] });
    // The SDK parses the token to sign a URL; a malformed token makes this throw.
    const utapi = new UTApi({ token, ufsHost: "localhost:9320", ufsAppIdLocation: "path", logLevel: "Error" });
    const { ufsUrl } = await utapi.generateSignedURL("abc123", { expiresIn: 60 });
    expect(ufsUrl.startsWith(`http://localhost:9320/a/${appId}/abc123?expires=`)).toBe(true);
  });

  it("refuses keys without sk_ and empty regions", () => {
    expect(() => encodeUploadthingToken({ apiKey: "pk_x", appId, regions: ["r"] })).toThrow(/sk_/);
    expect(() => encodeUploadthingToken({ apiKey: "sk_x", appId, regions: [] })).toThrow(/region/);
    expect(() => decodeUploadthingToken(Buffer.from('{"apiKey":"x"}').toString("base64"))).toThrow(/apiKey/);
  });
});

describe("signed URLs", () => {
  it("verifies a URL signed by the SDK and refuses it after one changed character", async () => {
    const utapi = new UTApi({ token, ufsHost: "localhost:9320", ufsAppIdLocation: "path", logLevel: "Error" });
    const { ufsUrl } = await utapi.generateSignedURL("k3y", { expiresIn: 60 });
    const u = new URL(ufsUrl);
    const pathAndQuery = u.pathname + u.search;
    expect(verifySignedUrl(pathAndQuery, ["http://localhost:9320"], apiKey).ok).toBe(true);
    expect(verifySignedUrl(pathAndQuery.replace("k3y", "k4y"), ["http://localhost:9320"], apiKey)).toEqual({ ok: false, reason: "invalid signature" });
    expect(verifySignedUrl(pathAndQuery, ["http://localhost:9999"], apiKey).ok).toBe(false);
    expect(verifySignedUrl(pathAndQuery, ["http://localhost:9320"], "sk_other").ok).toBe(false);
  });

  it("refuses an expired URL", () => {
    const url = new URL(signUrl("http://127.0.0.1:9320/f/key1", apiKey, 10, 1_000_000));
    const pq = url.pathname + url.search;
    expect(verifySignedUrl(pq, ["http://127.0.0.1:9320"], apiKey, 1_000_000 + 9_000).ok).toBe(true);
    expect(verifySignedUrl(pq, ["http://127.0.0.1:9320"], apiKey, 1_000_000 + 11_000)).toEqual({ ok: false, reason: "URL expired" });
    expect(verifySignedUrl("/f/key1?expires=1", ["http://127.0.0.1:9320"], apiKey)).toEqual({ ok: false, reason: "missing signature" });
  });

  it("undoes the SDK's double encoding of x-ut-* values", () => {
    const params = new URL(`http://x/?x-ut-file-name=${encodeURIComponent(encodeURIComponent("port #2 – bowl.png"))}`).searchParams;
    expect(utParam(params, "x-ut-file-name")).toBe("port #2 – bowl.png");
  });
});

describe("payload signatures", () => {
  it("is HMAC-SHA256 in hex with the SDK's prefix, and verifies only the same body", () => {
    // RFC 4231 test case 2: key "Jefe", data "what do ya want for nothing?".
    expect(signPayload("what do ya want for nothing?", "Jefe")).toBe("hmac-sha256=5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843");
    const sig = signPayload('{"a":1}', apiKey);
    expect(verifyPayload('{"a":1}', sig, apiKey)).toBe(true);
    expect(verifyPayload('{"a":2}', sig, apiKey)).toBe(false);
    expect(verifyPayload('{"a":1}', sig.replace("hmac-sha256=", ""), apiKey)).toBe(false);
    expect(verifyPayload('{"a":1}', null, apiKey)).toBe(false);
  });
});
