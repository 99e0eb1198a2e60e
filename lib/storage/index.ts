/**
 * File storage for the app, behind the S3 API so a shop can move from the local fake to a
 * hosted S3 by configuration. `storage()` is the bucket from the environment; tests and tools
 * call `createStorage(config)` for another one. Every operation streams.
 */
import { createStorageTarget, type StorageTarget } from "./client";
import { storageConfigFromEnv, type StorageConfig } from "./config";
import { checkStorage as checkTarget, type StorageCheck } from "./health";
import {
  abortMultipartUpload,
  abortStaleMultipartUploads,
  completeMultipartUpload,
  createMultipartUpload,
  listMultipartUploads,
  listUploadedParts,
  presignUploadParts,
} from "./multipart";
import { deleteObject, getStream, headObject, listObjects, listObjectsPage, putStream } from "./objects";
import { presignGet, presignPut } from "./presign";
import { getVerifiedStream, sha256OfObject, verifyObject } from "./verify";

export { storageConfigFromEnv, type StorageConfig } from "./config";
export type { StorageTarget } from "./client";
export { StorageChecksumMismatchError, StorageObjectNotFoundError, StorageUnavailableError } from "./errors";
export { contentKey, newObjectId, objectKey, parseKey } from "./keys";
export { planParts, S3_MAX_PARTS, S3_MIN_PART_BYTES, type PartPlan, type PartRange } from "./parts";
export { attachmentDisposition, type PresignedRequest } from "./presign";
export type { GetResult, ListPage, ObjectInfo, ObjectSummary, PutBody, PutOptions, PutResult } from "./objects";
export type { CompletedPart, MultipartRef, MultipartUploadInfo, StaleCleanup, UploadedPart } from "./multipart";
export type { Digest } from "./checksum";
export type { StorageCheck } from "./health";

type Rest<F> = F extends (t: StorageTarget, ...rest: infer R) => infer Out ? (...rest: R) => Out : never;

/** The operations bound to one bucket. */
export type Storage = {
  readonly target: StorageTarget;
  putStream: Rest<typeof putStream>;
  getStream: Rest<typeof getStream>;
  head: Rest<typeof headObject>;
  delete: Rest<typeof deleteObject>;
  list: Rest<typeof listObjects>;
  listPage: Rest<typeof listObjectsPage>;
  presignPut: Rest<typeof presignPut>;
  presignGet: Rest<typeof presignGet>;
  createMultipartUpload: Rest<typeof createMultipartUpload>;
  presignUploadParts: Rest<typeof presignUploadParts>;
  completeMultipartUpload: Rest<typeof completeMultipartUpload>;
  abortMultipartUpload: Rest<typeof abortMultipartUpload>;
  listUploadedParts: Rest<typeof listUploadedParts>;
  listMultipartUploads: Rest<typeof listMultipartUploads>;
  abortStaleMultipartUploads: Rest<typeof abortStaleMultipartUploads>;
  sha256OfObject: Rest<typeof sha256OfObject>;
  verifyObject: Rest<typeof verifyObject>;
  getVerifiedStream: Rest<typeof getVerifiedStream>;
  check: Rest<typeof checkTarget>;
};

export function createStorage(config: StorageConfig): Storage {
  const t = createStorageTarget(config);
  return {
    target: t,
    putStream: (...a) => putStream(t, ...a),
    getStream: (...a) => getStream(t, ...a),
    head: (...a) => headObject(t, ...a),
    delete: (...a) => deleteObject(t, ...a),
    list: (...a) => listObjects(t, ...a),
    listPage: (...a) => listObjectsPage(t, ...a),
    presignPut: (...a) => presignPut(t, ...a),
    presignGet: (...a) => presignGet(t, ...a),
    createMultipartUpload: (...a) => createMultipartUpload(t, ...a),
    presignUploadParts: (...a) => presignUploadParts(t, ...a),
    completeMultipartUpload: (...a) => completeMultipartUpload(t, ...a),
    abortMultipartUpload: (...a) => abortMultipartUpload(t, ...a),
    listUploadedParts: (...a) => listUploadedParts(t, ...a),
    listMultipartUploads: (...a) => listMultipartUploads(t, ...a),
    abortStaleMultipartUploads: (...a) => abortStaleMultipartUploads(t, ...a),
    sha256OfObject: (...a) => sha256OfObject(t, ...a),
    verifyObject: (...a) => verifyObject(t, ...a),
    getVerifiedStream: (...a) => getVerifiedStream(t, ...a),
    check: (...a) => checkTarget(t, ...a),
  };
}

let shared: Storage | undefined;

/** The bucket configured by the environment (S3_* variables), built on first use. */
export function storage(): Storage {
  shared ??= createStorage(storageConfigFromEnv());
  return shared;
}

/** Health check for the route: the configured bucket, or the one given. */
export function checkStorage(s: Storage = storage()): Promise<StorageCheck> {
  return s.check();
}
