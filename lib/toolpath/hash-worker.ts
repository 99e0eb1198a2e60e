/**
 * SHA-256 on a second thread, for big files: the analysis and the hash read the same chunks
 * in one pass, but on two cores. The buffers live in one SharedArrayBuffer that both threads
 * see, so a chunk is handed over by its slot number alone: transferring a 1 MiB ArrayBuffer
 * with postMessage cost about 0.5 ms a chunk on the reading thread, sharing costs nothing.
 * The pool is small and fixed, so memory stays flat whatever the file size.
 */
import { createHash, type Hash } from "node:crypto";
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
  /** One view per slot of the shared pool; a slot is named by its index in this list. */
  private readonly slots: Uint8Array[] = [];
  private readonly free: number[] = [];
  private waitingForBuffer: Waiter<Uint8Array> | null = null;
  private waitingForDigest: Waiter<string> | null = null;
  private failure: Error | null = null;

  private worker: Worker | null = null;
  private readonly workerData: { shared: SharedArrayBuffer; bufferBytes: number; poolSize: number };
  /** Set instead of a thread when none could start. */
  private inline: Hash | null = null;
  /** Chunks submitted before the thread was started, in order. */
  private readonly queued: Array<{ slot: number; length: number }> = [];

  /**
   * The thread itself starts on start(): its start-up (20-30 ms of the other core) is best
   * kept clear of the first moments of an analysis, when the JIT compiles the hot code there.
   */
  constructor(bufferBytes: number, poolSize: number) {
    const shared = new SharedArrayBuffer(bufferBytes * poolSize);
    for (let i = 0; i < poolSize; i++) {
      this.slots.push(new Uint8Array(shared, i * bufferBytes, bufferBytes));
      this.free.push(poolSize - 1 - i); // slot 0 is handed out first
    }
    this.workerData = { shared, bufferBytes, poolSize };
  }

  get started(): boolean {
    return this.worker !== null;
  }

  /** Starts the thread; chunks submitted so far are hashed first. */
  start(): void {
    if (this.worker || this.inline) return;
    let worker: Worker;
    try {
      // execArgv: [] keeps the parent's loaders (tsx under the CLI) out of this plain-JS worker
      worker = new Worker(WORKER_SOURCE, { eval: true, execArgv: [], workerData: this.workerData });
    } catch {
      // where threads cannot start, the hash runs on this thread
      this.inline = createHash("sha256");
      for (const q of this.queued.splice(0)) this.hashInline(q.slot, q.length);
      return;
    }
    this.worker = worker;
    worker.on("message", (m: Message) => {
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
    worker.on("error", (err) => this.fail(err));
    worker.on("exit", (code) => {
      if (code !== 0) this.fail(new Error(`hash worker stopped with code ${code}`));
    });
    for (const q of this.queued.splice(0)) worker.postMessage({ type: "chunk", ...q });
  }

  /** A free buffer from the pool (waits while all are with the worker). */
  acquire(): Promise<Uint8Array> {
    if (this.failure) return Promise.reject(this.failure);
    if (this.free.length === 0) this.start(); // never wait on a thread that is not running
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
    const chunk = { slot: this.slotOf(buffer), length };
    if (this.worker) this.worker.postMessage({ type: "chunk", ...chunk });
    else if (this.inline) this.hashInline(chunk.slot, chunk.length);
    else this.queued.push(chunk);
  }

  private hashInline(slot: number, length: number): void {
    this.inline!.update(this.slots[slot].subarray(0, length));
    this.free.push(slot);
  }

  digest(): Promise<string> {
    if (this.failure) return Promise.reject(this.failure);
    this.start();
    if (this.inline) return Promise.resolve(this.inline.digest("hex"));
    return new Promise((resolve, reject) => {
      this.waitingForDigest = { resolve, reject };
      this.worker!.postMessage({ type: "end" });
    });
  }

  async close(): Promise<void> {
    this.failure ??= new Error("hash worker closed");
    await this.worker?.terminate();
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
