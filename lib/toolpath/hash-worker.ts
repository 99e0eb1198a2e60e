/**
 * SHA-256 on a second thread, for big files: the analysis and the hash read the same chunks
 * in one pass, but on two cores. The buffers live in one SharedArrayBuffer that both threads
 * see, so a chunk is handed over by its slot number alone: transferring a 1 MiB ArrayBuffer
 * with postMessage cost about 0.5 ms a chunk on the reading thread, sharing costs nothing.
 * The pool is small and fixed, so memory stays flat whatever the file size.
 */
import { Worker } from "node:worker_threads";

// Plain CommonJS so the worker needs no TypeScript loader (and none is started in it).
const WORKER_SOURCE = `
const { parentPort, workerData } = require("node:worker_threads");
const { createHash } = require("node:crypto");
const { shared, bufferBytes, poolSize } = workerData;
const slots = [];
for (let i = 0; i < poolSize; i++) slots.push(new Uint8Array(shared, i * bufferBytes, bufferBytes));
const hash = createHash("sha256");
parentPort.on("message", (m) => {
  if (m.type === "chunk") {
    hash.update(slots[m.slot].subarray(0, m.length));
    parentPort.postMessage({ type: "free", slot: m.slot });
  } else if (m.type === "end") {
    parentPort.postMessage({ type: "digest", hex: hash.digest("hex") });
  }
});
`;

type Waiter<T> = { resolve: (value: T) => void; reject: (err: Error) => void };
type Message = { type: "free"; slot: number } | { type: "digest"; hex: string };

export class ParallelHasher {
  private readonly worker: Worker;
  /** One view per slot of the shared pool; a slot is named by its index in this list. */
  private readonly slots: Uint8Array[] = [];
  private readonly free: number[] = [];
  private waitingForBuffer: Waiter<Uint8Array> | null = null;
  private waitingForDigest: Waiter<string> | null = null;
  private failure: Error | null = null;

  constructor(bufferBytes: number, poolSize: number) {
    const shared = new SharedArrayBuffer(bufferBytes * poolSize);
    for (let i = 0; i < poolSize; i++) {
      this.slots.push(new Uint8Array(shared, i * bufferBytes, bufferBytes));
      this.free.push(poolSize - 1 - i); // slot 0 is handed out first
    }
    // execArgv: [] keeps the parent's loaders (tsx under the CLI) out of this plain-JS worker
    this.worker = new Worker(WORKER_SOURCE, { eval: true, execArgv: [], workerData: { shared, bufferBytes, poolSize } });
    this.worker.on("message", (m: Message) => {
      if (m.type === "free") {
        const waiter = this.waitingForBuffer;
        this.waitingForBuffer = null;
        if (waiter) waiter.resolve(this.slots[m.slot]);
        else this.free.push(m.slot);
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
    const slot = this.free.pop();
    if (slot !== undefined) return Promise.resolve(this.slots[slot]);
    return new Promise((resolve, reject) => {
      this.waitingForBuffer = { resolve, reject };
    });
  }

  /** Puts back a buffer that was not handed over. */
  release(buffer: Uint8Array): void {
    this.free.push(this.slotOf(buffer));
  }

  /**
   * Hashes buffer[0, length) next. The buffer belongs to the worker until acquire hands it out
   * again: the caller must not write to it before then.
   */
  submit(buffer: Uint8Array, length: number): void {
    this.worker.postMessage({ type: "chunk", slot: this.slotOf(buffer), length });
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

  private slotOf(buffer: Uint8Array): number {
    const slot = this.slots.indexOf(buffer);
    if (slot < 0) throw new Error("ParallelHasher: not a buffer from this pool");
    return slot;
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
