/**
 * Where the uploadthing stand-in keeps files: `<dir>/files/<key>` with a JSON sidecar
 * `<key>.json`, and `<key>.partial` while an upload is in flight (so an interrupted upload
 * can resume from the byte the SDK asks about with HEAD).
 */
import crypto from "node:crypto";
import { createReadStream, createWriteStream, promises as fs } from "node:fs";
import path from "node:path";
import { pipeline } from "node:stream/promises";

export type FileAcl = "public-read" | "private";
export type ContentDisposition = "inline" | "attachment";

export type StoredFile = {
  key: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  acl: FileAcl;
  contentDisposition: ContentDisposition;
  /** MD5 (hex) of the content, which is what the SDK calls fileHash. */
  fileHash: string;
  uploadedAt: number;
};

const KEY_PATTERN = /^[A-Za-z0-9_-]{1,128}$/;

/** The upload carried more bytes than its presigned URL allowed. */
export class TooLargeError extends Error {
  constructor(limit: number) {
    super(`file is larger than the declared ${limit} bytes`);
    this.name = "TooLargeError";
  }
}

export function isValidFileKey(key: string): boolean {
  return KEY_PATTERN.test(key);
}

export class FileStore {
  readonly dir: string;

  constructor(dataDir: string) {
    this.dir = path.join(dataDir, "files");
  }

  async init(): Promise<void> {
    await fs.mkdir(this.dir, { recursive: true });
  }

  private pathOf(key: string, suffix = ""): string {
    if (!isValidFileKey(key)) throw new Error(`invalid file key`);
    return path.join(this.dir, key + suffix);
  }

  contentPath(key: string): string {
    return this.pathOf(key);
  }

  /** Bytes received so far for an unfinished upload (0 when none). */
  async partialSize(key: string): Promise<number> {
    try {
      return (await fs.stat(this.pathOf(key, ".partial"))).size;
    } catch {
      return 0;
    }
  }

  /**
   * Writes bytes to the partial file starting at `startAt` (earlier bytes are kept, later ones
   * dropped). Stops with an error past `maxBytes`. Returns the partial file's size.
   */
  async receive(key: string, bytes: AsyncIterable<Buffer>, startAt: number, maxBytes: number): Promise<number> {
    const partial = this.pathOf(key, ".partial");
    if (startAt > 0) await fs.truncate(partial, startAt);
    let written = startAt;
    const limited = async function* () {
      for await (const chunk of bytes) {
        written += chunk.length;
        if (written > maxBytes) throw new TooLargeError(maxBytes);
        yield chunk;
      }
    };
    try {
      await pipeline(limited(), createWriteStream(partial, { flags: startAt > 0 ? "a" : "w" }));
    } catch (err) {
      // An oversized upload cannot be resumed; an interrupted one keeps its bytes for HEAD.
      if (err instanceof TooLargeError) await this.discardPartial(key);
      throw err;
    }
    return written;
  }

  async discardPartial(key: string): Promise<void> {
    await fs.rm(this.pathOf(key, ".partial"), { force: true });
  }

  /** Turns the partial file into the stored file and records its description. */
  async finish(key: string, info: Omit<StoredFile, "key" | "size" | "fileHash" | "uploadedAt">): Promise<StoredFile> {
    const partial = this.pathOf(key, ".partial");
    const md5 = crypto.createHash("md5");
    let size = 0;
    for await (const chunk of createReadStream(partial, { highWaterMark: 1 << 20 })) {
      md5.update(chunk as Buffer);
      size += (chunk as Buffer).length;
    }
    const file: StoredFile = { ...info, key, size, fileHash: md5.digest("hex"), uploadedAt: Date.now() };
    await fs.writeFile(this.pathOf(key, ".json"), JSON.stringify(file));
    await fs.rename(partial, this.pathOf(key));
    return file;
  }

  async get(key: string): Promise<StoredFile | null> {
    if (!isValidFileKey(key)) return null;
    try {
      return JSON.parse(await fs.readFile(this.pathOf(key, ".json"), "utf8")) as StoredFile;
    } catch {
      return null;
    }
  }

  async findByCustomId(customId: string): Promise<StoredFile | null> {
    return (await this.list()).find((f) => f.customId === customId) ?? null;
  }

  /** Every finished file, oldest first. */
  async list(): Promise<StoredFile[]> {
    const names = (await fs.readdir(this.dir)).filter((n) => n.endsWith(".json"));
    const files = await Promise.all(names.map((n) => this.get(n.slice(0, -".json".length))));
    return files.filter((f): f is StoredFile => f !== null).sort((a, b) => a.uploadedAt - b.uploadedAt || (a.key < b.key ? -1 : 1));
  }

  async update(key: string, patch: Partial<Pick<StoredFile, "name" | "acl">>): Promise<boolean> {
    const file = await this.get(key);
    if (!file) return false;
    await fs.writeFile(this.pathOf(key, ".json"), JSON.stringify({ ...file, ...patch }));
    return true;
  }

  async delete(key: string): Promise<boolean> {
    const file = await this.get(key);
    await Promise.all([fs.rm(this.pathOf(key), { force: true }), fs.rm(this.pathOf(key, ".json"), { force: true })]);
    return file !== null;
  }
}
