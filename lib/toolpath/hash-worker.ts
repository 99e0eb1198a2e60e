/**
 * SHA-256 on a second thread, for big files: the analysis and the hash read the same chunks
 * in one pass, but on two cores. Buffers travel to the worker and back (transferred, never
 * copied) from a small fixed pool, so memory stays flat whatever the file size.
 */
import { Worker } from "node:worker_threads";

// Plain CommonJS so the worker needs no TypeScript loader.
const WORKER_SOURCE = `
const { parentPort } = require("node:worker_threads");
const { createHash } = require("node:crypto");
const hash = createHash("sha256");
parentPort.on("message", (m) => {
  if (m.type === "chunk") {
    hash.update(new Uint8Array(m.buffer, 0, m.length));
    parentPort.postMessage({ type: "free", buffer: m.buffer }, [m.buffer]);
  } else if (m.type === "end") {
    parentPort.postMessage({ type: "digest", hex: hash.digest("hex") });
  }
});
`;

type Waiter<T> = { resolve: (value: T) => void; reject: (err: Error) => void };
type Message = { type: "free"; buffer: ArrayBuffer } | { type: "digest"; hex: string };

export class ParallelHasher {
  private readonly worker: Worker;
  private readonly free: ArrayBuffer[] = [];
  private waitingForBuffer: Waiter<ArrayBuffer> | null = null;
  private waitingForDigest: Waiter<string> | null = null;
  private failure: Error | null = null;

  constructor(bufferBytes: number, poolSize: number) {
    for (let i = 0; i < poolSize; i++) this.free.push(new ArrayBuffer(bufferBytes));
    this.worker = new Worker(WORKER_SOURCE, { eval: true });
    this.worker.on("message", (m: Message) => {
      if (m.type === "free") {
        const waiter = this.waitingForBuffer;
        this.waitingForBuffer = null;
        if (waiter) waiter.resolve(m.buffer);
        else this.free.push(m.buffer);
      } else if (m.type === "digest") {
        this.waitingForDigest?.resolve(m.hex);
        this.waitingForDigest = null;
      }
    });
    this.worker.on("error", (err) => this.fail(err));
    this.worker.on("exit", (code) => {
      if (code !== 0) this.fail(new Error(`hash worker stopped with code ${code}`));
    });
  }

  /** A free buffer from the pool (waits while all are with the worker). */
  acquire(): Promise<Uint8Array> {
    if (this.failure) return Promise.reject(this.failure);
    const b = this.free.pop();
    if (b) return Promise.resolve(new Uint8Array(b));
    return new Promise((resolve, reject) => {
      this.waitingForBuffer = { resolve: (buffer) => resolve(new Uint8Array(buffer)), reject };
    });
  }

  /** Puts back a buffer that was not handed over. */
  release(buffer: Uint8Array): void {
    this.free.push(buffer.buffer as ArrayBuffer);
  }

  /** Hashes buffer[0, length) next; the buffer leaves this thread until the worker returns it. */
  submit(buffer: Uint8Array, length: number): void {
    const ab = buffer.buffer as ArrayBuffer;
    this.worker.postMessage({ type: "chunk", buffer: ab, length }, [ab]);
  }

  digest(): Promise<string> {
    if (this.failure) return Promise.reject(this.failure);
    return new Promise((resolve, reject) => {
      this.waitingForDigest = { resolve, reject };
      this.worker.postMessage({ type: "end" });
    });
  }

  async close(): Promise<void> {
    this.failure ??= new Error("hash worker closed");
    await this.worker.terminate();
  }

  private fail(err: Error): void {
    if (this.failure) return;
    this.failure = err;
    this.waitingForBuffer?.reject(err);
    this.waitingForDigest?.reject(err);
    this.waitingForBuffer = null;
    this.waitingForDigest = null;
  }
}
