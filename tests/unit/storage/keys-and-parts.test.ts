/** Object keys we build ourselves, and how a file is cut into multipart parts. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { contentKey, newObjectId, objectKey, parseKey } from "@/lib/storage/keys";
import { planParts, S3_MAX_PARTS, S3_MIN_PART_BYTES } from "@/lib/storage/parts";

describe("object keys", () => {
  it("builds kind/fan-out/id and reads it back", () => {
    const id = newObjectId();
    expect(id).toMatch(/^[0-9a-f]{32}$/);
    const key = objectKey("toolpath", id);
    expect(key).toBe(`toolpath/${id.slice(0, 2)}/${id}`);
    expect(parseKey(key)).toEqual({ kind: "toolpath", id });
  });

  it("never lets a file name or a path through", () => {
    for (const bad of ["../etc/passwd", "port 1.nc", "a/b", "", "x".repeat(65), "short"]) {
      expect(() => objectKey("toolpath", bad)).toThrow(/storage id/);
    }
    for (const badKind of ["Toolpath", "../x", "", "sha256", "a-b"]) expect(() => objectKey(badKind, newObjectId())).toThrow();
  });

  it("keys content by its SHA-256", () => {
    const hex = "E3B0C44298FC1C149AFBF4C8996FB92427AE41E4649B934CA495991B7852B855";
    expect(contentKey(hex)).toBe(`sha256/e3/${hex.toLowerCase()}`);
    expect(parseKey(contentKey(hex))).toEqual({ kind: "sha256", id: hex.toLowerCase() });
    expect(() => contentKey("abc")).toThrow(/64 hex/);
  });

  it("rejects keys it did not make", () => {
    expect(parseKey("toolpath/zz/3f2a000000000000")).toBeNull(); // fan-out does not match the id
    expect(parseKey("sha256/ab/notahash0000")).toBeNull();
    expect(parseKey("uploads/some file.png")).toBeNull();
  });

  it("makes distinct ids", () => {
    const ids = new Set(Array.from({ length: 1000 }, newObjectId));
    expect(ids.size).toBe(1000);
  });
});

describe("planParts", () => {
  it("cuts 12.5 MiB into 5 MiB parts with a short last part", () => {
    const size = 12.5 * 1024 * 1024;
    const plan = planParts(size, 5 * 1024 * 1024);
    expect(plan.partCount).toBe(3);
    expect(plan.parts.map((p) => p.end - p.start)).toEqual([5 * 1024 * 1024, 5 * 1024 * 1024, 2.5 * 1024 * 1024]);
  });

  it("raises a too-small part size to S3's 5 MiB minimum (Amazon S3 multipart limits)", () => {
    expect(planParts(20 * 1024 * 1024, 1024).partSizeBytes).toBe(S3_MIN_PART_BYTES);
  });

  it("grows the part size so a 2 TiB file needs at most 10 000 parts", () => {
    const plan = planParts(2 * 1024 ** 4, 16 * 1024 ** 2);
    expect(plan.partCount).toBeLessThanOrEqual(S3_MAX_PARTS);
    expect(plan.partSizeBytes % (1024 * 1024)).toBe(0);
  });

  it("covers every byte exactly once, in order, for any size", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 40 }), fc.integer({ min: 1, max: 2 ** 31 }), (size, preferred) => {
        const plan = planParts(size, preferred);
        // Plain loop (not one expect per part): a plan can hold 10 000 parts.
        const broken = plan.parts.findIndex(
          (p, i) =>
            p.partNumber !== i + 1 ||
            p.start !== (i === 0 ? 0 : plan.parts[i - 1]!.end) ||
            (i < plan.parts.length - 1 ? p.end - p.start !== plan.partSizeBytes : p.end - p.start < 1 || p.end - p.start > plan.partSizeBytes),
        );
        expect(broken).toBe(-1);
        expect(plan.parts.at(-1)!.end).toBe(size);
        expect(plan.partCount).toBeLessThanOrEqual(S3_MAX_PARTS);
        expect(plan.partSizeBytes).toBeGreaterThanOrEqual(S3_MIN_PART_BYTES);
      }),
      { numRuns: 200 },
    );
  });

  it("refuses an empty file", () => {
    expect(() => planParts(0)).toThrow();
  });
});
