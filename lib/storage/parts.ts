/**
 * How a large file is cut into parts for a browser multipart upload, within S3's limits:
 * parts of 5 MiB to 5 GiB (the last may be smaller), at most 10 000 parts
 * (Amazon S3 User Guide, "Amazon S3 multipart upload limits").
 */
export const S3_MIN_PART_BYTES = 5 * 1024 ** 2;
export const S3_MAX_PART_BYTES = 5 * 1024 ** 3;
export const S3_MAX_PARTS = 10_000;
export const DEFAULT_BROWSER_PART_BYTES = 16 * 1024 ** 2;

export type PartRange = { partNumber: number; start: number; end: number };
export type PartPlan = { partSizeBytes: number; partCount: number; parts: PartRange[] };

/**
 * Byte ranges (`end` exclusive, ready for `Blob.slice`). The preferred size grows in whole MiB
 * when the file would otherwise need more than 10 000 parts.
 */
export function planParts(sizeBytes: number, preferredPartBytes = DEFAULT_BROWSER_PART_BYTES): PartPlan {
  if (!Number.isSafeInteger(sizeBytes) || sizeBytes < 1) throw new Error("a multipart upload needs a size of at least one byte");
  if (sizeBytes > S3_MAX_PART_BYTES * S3_MAX_PARTS) throw new Error("file is larger than a multipart upload can hold");
  const mib = 1024 ** 2;
  let partSize = Math.min(S3_MAX_PART_BYTES, Math.max(S3_MIN_PART_BYTES, preferredPartBytes));
  if (Math.ceil(sizeBytes / partSize) > S3_MAX_PARTS) partSize = Math.ceil(sizeBytes / S3_MAX_PARTS / mib) * mib;
  const partCount = Math.ceil(sizeBytes / partSize);
  const parts: PartRange[] = [];
  for (let i = 0; i < partCount; i++) parts.push({ partNumber: i + 1, start: i * partSize, end: Math.min(sizeBytes, (i + 1) * partSize) });
  return { partSizeBytes: partSize, partCount, parts };
}
