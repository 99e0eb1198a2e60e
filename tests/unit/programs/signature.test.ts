import crypto from "node:crypto";
import { describe, expect, it } from "vitest";
import { releaseSignature } from "@/lib/programs/signature";

const sha = (s: string) => crypto.createHash("sha256").update(s).digest("hex");

describe("release signature", () => {
  const base = { userId: 3, at: 1_780_000_000_000, revisionId: 9, fileSha256s: [sha("a"), sha("b")] };

  it("is the SHA-256 of the canonical tuple (reference: Node's crypto over the same JSON)", () => {
    const expected = sha(JSON.stringify(["portolan-release-v1", 3, 1_780_000_000_000, 9, [sha("a"), sha("b")].sort()]));
    expect(releaseSignature(base)).toBe(expected);
  });

  it("does not depend on the order of the files", () => {
    expect(releaseSignature({ ...base, fileSha256s: [...base.fileSha256s].reverse() })).toBe(releaseSignature(base));
  });

  it("changes when anything it binds changes", () => {
    const s = releaseSignature(base);
    expect(releaseSignature({ ...base, userId: 4 })).not.toBe(s);
    expect(releaseSignature({ ...base, at: base.at + 1 })).not.toBe(s);
    expect(releaseSignature({ ...base, revisionId: 10 })).not.toBe(s);
    expect(releaseSignature({ ...base, fileSha256s: [sha("a"), sha("c")] })).not.toBe(s);
  });
});
