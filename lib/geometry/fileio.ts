import { open, stat } from "node:fs/promises";
import { basename } from "node:path";
import type { PointCloud } from "./types";
import { readPointCloud, type ReadOptions } from "./readers/index";

/**
 * Chunks of a file read into two 1 MiB buffers used in turn. Reusing buffers avoids touching fresh
 * memory for every chunk (measurably slower on these machines); the readers never keep a chunk
 * after asking for the next one.
 */
export async function* fileChunks(path: string, chunkBytes = 1 << 20): AsyncGenerator<Uint8Array> {
  const fh = await open(path, "r");
  const buffers = [new Uint8Array(chunkBytes), new Uint8Array(chunkBytes)];
  let turn = 0;
  try {
    for (;;) {
      const buf = buffers[turn];
      turn ^= 1;
      const { bytesRead } = await fh.read(buf, 0, buf.length, null);
      if (bytesRead === 0) return;
      yield buf.subarray(0, bytesRead);
    }
  } finally {
    await fh.close();
  }
}

/** Node-only convenience: streams a file and passes its size so binary STL is detected by size. */
export async function readPointCloudFile(path: string, options: Omit<ReadOptions, "sizeBytes"> = {}): Promise<PointCloud> {
  const { size } = await stat(path);
  return readPointCloud(fileChunks(path), { filename: basename(path), ...options, sizeBytes: size });
}

/** Writes chunks from a writer (writePly, writeStlBinary, …) to a file, one chunk at a time. */
export async function writeChunksToFile(path: string, chunks: Iterable<Uint8Array>): Promise<number> {
  const fh = await open(path, "w");
  let bytes = 0;
  try {
    for (const c of chunks) {
      await fh.write(c);
      bytes += c.length;
    }
  } finally {
    await fh.close();
  }
  return bytes;
}
