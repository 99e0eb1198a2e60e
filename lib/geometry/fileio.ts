import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { basename } from "node:path";
import type { PointCloud } from "./types";
import { readPointCloud, type ReadOptions } from "./readers/index";

/**
 * Node-only convenience: streams a file in 1 MiB chunks (several times faster than the 64 KiB
 * default) and passes its size so binary STL is detected by size.
 */
export async function readPointCloudFile(path: string, options: Omit<ReadOptions, "sizeBytes"> = {}): Promise<PointCloud> {
  const { size } = await stat(path);
  const stream = createReadStream(path, { highWaterMark: 1 << 20 });
  try {
    return await readPointCloud(stream, { filename: basename(path), ...options, sizeBytes: size });
  } finally {
    stream.destroy();
  }
}

/** Writes chunks from a writer (writePly, writeStlBinary, …) to a file, one chunk at a time. */
export async function writeChunksToFile(path: string, chunks: Iterable<Uint8Array>): Promise<number> {
  const { open } = await import("node:fs/promises");
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
