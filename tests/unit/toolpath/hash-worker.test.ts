/** SHA-256 on a second thread (used for big files) gives the digest of the bytes, in order. */
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { mulberry32 } from "@/lib/toolpath/generate";
import { ParallelHasher } from "@/lib/toolpath/hash-worker";

describe("ParallelHasher", () => {
  it("hashes chunks sent through a small pool of recycled buffers", async () => {
    const random = mulberry32(3);
    const data = Uint8Array.from({ length: 50_000 }, () => Math.floor(random() * 256));
    const hasher = new ParallelHasher(4096, 2);
    try {
      for (let at = 0; at < data.length; ) {
        const buffer = await hasher.acquire(); // waits while both buffers are with the worker
        const n = Math.min(buffer.length, data.length - at, 1000 + (at % 3000));
        buffer.set(data.subarray(at, at + n));
        hasher.submit(buffer, n);
        at += n;
      }
      expect(await hasher.digest()).toBe(createHash("sha256").update(data).digest("hex"));
    } finally {
      await hasher.close();
    }
  });

  it("chunks handed over before the thread starts are hashed first, in order", async () => {
    const hasher = new ParallelHasher(8, 3);
    try {
      const first = await hasher.acquire();
      first.set([1, 2, 3, 4]);
      hasher.submit(first, 4);
      const second = await hasher.acquire();
      second.set([5, 6]);
      hasher.submit(second, 2);
      expect(hasher.started).toBe(false);
      hasher.start();
      expect(hasher.started).toBe(true);
      const third = await hasher.acquire();
      third.set([7]);
      hasher.submit(third, 1);
      expect(await hasher.digest()).toBe(createHash("sha256").update(Uint8Array.of(1, 2, 3, 4, 5, 6, 7)).digest("hex"));
    } finally {
      await hasher.close();
    }
  });

  it("starts its thread rather than wait for a buffer only the thread can free", async () => {
    const hasher = new ParallelHasher(8, 1);
    try {
      const only = await hasher.acquire();
      only.set([9, 9]);
      hasher.submit(only, 2);
      const again = await hasher.acquire(); // the pool is empty: this starts the thread
      expect(hasher.started).toBe(true);
      again.set([8]);
      hasher.submit(again, 1);
      expect(await hasher.digest()).toBe(createHash("sha256").update(Uint8Array.of(9, 9, 8)).digest("hex"));
    } finally {
      await hasher.close();
    }
  });

  it("an empty input hashes to the digest of nothing", async () => {
    const hasher = new ParallelHasher(16, 1);
    try {
      expect(await hasher.digest()).toBe(createHash("sha256").digest("hex"));
    } finally {
      await hasher.close();
    }
  });

  it("takes back an unused buffer and refuses buffers from outside its pool", async () => {
    const hasher = new ParallelHasher(64, 1);
    try {
      const buffer = await hasher.acquire();
      hasher.release(buffer);
      const again = await hasher.acquire(); // would wait forever had release lost the slot
      expect(again).toBe(buffer);
      expect(() => hasher.submit(new Uint8Array(64), 10)).toThrow(/not a buffer from this pool/);
      again.set([1, 2, 3]);
      hasher.submit(again, 3);
      expect(await hasher.digest()).toBe(createHash("sha256").update(Uint8Array.of(1, 2, 3)).digest("hex"));
    } finally {
      await hasher.close();
    }
  });
});
