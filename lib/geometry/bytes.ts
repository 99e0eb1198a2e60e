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
 * `buf[pos..end)` is the unread window. `fill(n)` pulls chunks until n bytes are unread or the
 * source ends; the unread tail is copied in front of the next chunk (a few bytes for binary
 * records, one partial line for text).
 */
export class ByteCursor {
  buf: Uint8Array = EMPTY;
  pos = 0;
  end = 0;
  eof = false;
  bytesRead = 0;
  private readonly it: AsyncIterator<Uint8Array | string>;
  private readonly onProgress?: (bytesRead: number) => void;

  constructor(source: ByteSource, onProgress?: (bytesRead: number) => void) {
    this.it = toAsyncChunks(source);
    this.onProgress = onProgress;
  }

  get available(): number {
    return this.end - this.pos;
  }

  /** Reads one more chunk onto the window; false when the source is exhausted. */
  async more(): Promise<boolean> {
    if (this.eof) return false;
    // Copy the tail first: some sources reuse their chunk buffer on the next read.
    const rest = this.end - this.pos;
    const tail = rest > 0 ? this.buf.slice(this.pos, this.end) : EMPTY;
    let chunk: Uint8Array = EMPTY;
    while (chunk.length === 0) {
      const r = await this.it.next();
      if (r.done) {
        this.eof = true;
        this.buf = tail;
        this.pos = 0;
        this.end = tail.length;
        return false;
      }
      const v = r.value;
      chunk = typeof v === "string" ? encoder.encode(v) : v instanceof Uint8Array ? v : new Uint8Array(v as ArrayBuffer);
    }
    this.bytesRead += chunk.length;
    this.onProgress?.(this.bytesRead);
    if (rest === 0) {
      this.buf = chunk;
    } else {
      const merged = new Uint8Array(rest + chunk.length);
      merged.set(tail, 0);
      merged.set(chunk, rest);
      this.buf = merged;
    }
    this.pos = 0;
    this.end = this.buf.length;
    return true;
  }

  /** Ensures at least n unread bytes; false if the source ended first. */
  async fill(n: number): Promise<boolean> {
    while (this.end - this.pos < n) {
      if (!(await this.more())) return this.end - this.pos >= n;
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
