/**
 * Byte sources and a small cursor over them. Readers pull chunks from any async iterable of bytes
 * (a Node Readable, a web ReadableStream, an S3 body) and keep only the unread tail of the
 * previous chunk, so a file of any size is read with memory bounded by one chunk.
 */
export type ByteSource =
  | Uint8Array
  | ArrayBuffer
  | Iterable<Uint8Array>
  | AsyncIterable<Uint8Array | string>
  | ReadableStream<Uint8Array>;

const EMPTY = new Uint8Array(0);
/** Slices handed out for in-memory sources, so progress moves and the cursor logic is the same. */
const MEMORY_CHUNK = 1 << 20;

function isAsyncIterable(x: unknown): x is AsyncIterable<Uint8Array | string> {
  return typeof x === "object" && x !== null && Symbol.asyncIterator in x;
}

async function* fromReadableStream(stream: ReadableStream<Uint8Array>): AsyncGenerator<Uint8Array> {
  const reader = stream.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      yield value;
    }
  } finally {
    reader.releaseLock();
  }
}

async function* fromBytes(bytes: Uint8Array): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += MEMORY_CHUNK) yield bytes.subarray(i, i + MEMORY_CHUNK);
}

async function* fromIterable(it: Iterable<Uint8Array>): AsyncGenerator<Uint8Array> {
  for (const chunk of it) yield chunk;
}

export function toAsyncChunks(source: ByteSource): AsyncIterator<Uint8Array | string> {
  if (source instanceof Uint8Array) return fromBytes(source);
  if (source instanceof ArrayBuffer) return fromBytes(new Uint8Array(source));
  if (isAsyncIterable(source)) return source[Symbol.asyncIterator]();
  const maybeStream = source as unknown as ReadableStream<Uint8Array>;
  if (typeof maybeStream.getReader === "function") return fromReadableStream(maybeStream);
  return fromIterable(source as Iterable<Uint8Array>);
}

const encoder = new TextEncoder();

/**
 * `buf[pos..end)` is the unread window. When a record or line straddles two chunks, only a small
 * bridge is built: the unread tail plus just enough of the next chunk to finish it (the bytes a
 * binary reader asked for, or up to the next line end for text); the rest of that chunk is then
 * used in place. Chunks are never copied whole, so a source may even reuse its buffer between
 * reads: nothing here holds on to a chunk once the next one is requested.
 */
export class ByteCursor {
  buf: Uint8Array = EMPTY;
  pos = 0;
  end = 0;
  eof = false;
  bytesRead = 0;
  private readonly it: AsyncIterator<Uint8Array | string>;
  private readonly onProgress?: (bytesRead: number) => void;
  /** Unused remainder of the last chunk, after a bridge was cut from its start. */
  private pending: Uint8Array = EMPTY;

  constructor(source: ByteSource, onProgress?: (bytesRead: number) => void) {
    this.it = toAsyncChunks(source);
    this.onProgress = onProgress;
  }

  get available(): number {
    return this.end - this.pos;
  }

  private async nextChunk(): Promise<Uint8Array | null> {
    if (this.pending.length > 0) {
      const p = this.pending;
      this.pending = EMPTY;
      return p;
    }
    for (;;) {
      const r = await this.it.next();
      if (r.done) return null;
      const v = r.value;
      const chunk = typeof v === "string" ? encoder.encode(v) : v instanceof Uint8Array ? v : new Uint8Array(v as ArrayBuffer);
      if (chunk.length === 0) continue;
      this.bytesRead += chunk.length;
      this.onProgress?.(this.bytesRead);
      return chunk;
    }
  }

  /**
   * Moves on to more bytes; false when the source is exhausted. With `need`, a straddling tail is
   * completed with exactly `need` more bytes (binary records); without, up to the next newline.
   */
  async more(need?: number): Promise<boolean> {
    if (this.eof) return false;
    const rest = this.end - this.pos;
    // Copy the tail before pulling: the source may reuse its buffer on the next read.
    const tail = rest > 0 ? this.buf.slice(this.pos, this.end) : EMPTY;
    const chunk = await this.nextChunk();
    if (!chunk) {
      this.eof = true;
      this.buf = tail;
      this.pos = 0;
      this.end = tail.length;
      return false;
    }
    if (rest === 0) {
      this.buf = chunk;
    } else {
      let cut: number;
      if (need !== undefined) {
        cut = Math.min(chunk.length, Math.max(1, need));
      } else {
        const nl = chunk.indexOf(10);
        cut = nl < 0 ? chunk.length : nl + 1;
      }
      const bridge = new Uint8Array(rest + cut);
      bridge.set(tail, 0);
      bridge.set(chunk.subarray(0, cut), rest);
      this.pending = cut < chunk.length ? chunk.subarray(cut) : EMPTY;
      this.buf = bridge;
    }
    this.pos = 0;
    this.end = this.buf.length;
    return true;
  }

  /** Ensures at least n unread bytes; false if the source ended first. */
  async fill(n: number): Promise<boolean> {
    while (this.end - this.pos < n) {
      if (!(await this.more(n - (this.end - this.pos)))) return this.end - this.pos >= n;
    }
    return true;
  }

  /** Reads and discards everything that is left (used to count trailing bytes). */
  async drain(): Promise<number> {
    let extra = this.end - this.pos;
    this.pos = this.end;
    while (await this.more()) {
      extra += this.end - this.pos;
      this.pos = this.end;
    }
    return extra;
  }
}
