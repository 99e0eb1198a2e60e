/**
 * Test doubles for the hosted services, each started on a free port inside a test file's
 * beforeAll so files do not depend on a shared setup:
 *  - startTestS3: the S3 fake (s3rver child process) with a throw-away data directory;
 *  - startMailCatcher: an in-process SMTP server (smtp-server) that parses each message
 *    (mailparser) and keeps it in memory, with waitFor(predicate);
 *  - startTestUploadthing: the uploadthing stand-in, in-process.
 */
import { mkdtemp, rm } from "node:fs/promises";
import type { AddressInfo } from "node:net";
import os from "node:os";
import path from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";
import { SMTPServer } from "smtp-server";
import { startS3Fake, type S3Fake } from "@/storage-fake/s3";
import { startUploadthingStandIn, type UploadthingStandIn } from "@/storage-fake/uploadthing";
import { newLocalUploadthingToken } from "@/storage-fake/uploadthing-token";
import type { StorageConfig } from "@/lib/storage";

export async function tempDir(label: string): Promise<{ dir: string; remove(): Promise<void> }> {
  const dir = await mkdtemp(path.join(os.tmpdir(), `portolan-${label}-`));
  return { dir, remove: () => rm(dir, { recursive: true, force: true }) };
}

export type TestS3 = S3Fake & { config: StorageConfig };

export async function startTestS3(opts: { bucket?: string; origins?: string[] } = {}): Promise<TestS3> {
  const tmp = await tempDir("s3");
  const fake = await startS3Fake({ port: 0, directory: tmp.dir, bucket: opts.bucket ?? "portolan-test", origins: opts.origins });
  const config: StorageConfig = {
    endpoint: fake.url,
    region: "us-east-1",
    bucket: fake.bucket,
    accessKeyId: fake.accessKeyId,
    secretAccessKey: fake.secretAccessKey,
    forcePathStyle: true,
  };
  return {
    ...fake,
    config,
    async stop() {
      await fake.stop();
      await tmp.remove();
    },
  };
}

export type CaughtMail = ParsedMail & { envelopeTo: string[]; envelopeFrom: string };

export type MailCatcher = {
  host: string;
  port: number;
  mails: CaughtMail[];
  /** Resolves with the first caught mail (already here or still to come) matching `predicate`. */
  waitFor(predicate: (mail: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  clear(): void;
  stop(): Promise<void>;
};

export async function startMailCatcher(): Promise<MailCatcher> {
  const mails: CaughtMail[] = [];
  const listeners = new Set<() => void>();
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
          mails.push(Object.assign(parsed, { envelopeTo, envelopeFrom }));
          for (const notify of listeners) notify();
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.server.address() as AddressInfo;

  return {
    host: "127.0.0.1",
    port,
    mails,
    waitFor(predicate, timeoutMs = 5000) {
      return new Promise((resolve, reject) => {
        const check = () => {
          const hit = mails.find(predicate);
          if (!hit) return false;
          cleanup();
          resolve(hit);
          return true;
        };
        const timer = setTimeout(() => {
          cleanup();
          reject(new Error(`no matching mail within ${timeoutMs} ms (caught ${mails.length}: ${mails.map((m) => m.subject).join("; ")})`));
        }, timeoutMs);
        const cleanup = () => {
          clearTimeout(timer);
          listeners.delete(listener);
        };
        const listener = () => void check();
        listeners.add(listener);
        check();
      });
    },
    clear() {
      mails.length = 0;
    },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

export type TestUploadthing = UploadthingStandIn & { token: string; dataDir: string };

export async function startTestUploadthing(opts: { waitTimeoutMs?: number } = {}): Promise<TestUploadthing> {
  const tmp = await tempDir("ut");
  const token = newLocalUploadthingToken("portolan-test");
  const standIn = await startUploadthingStandIn({ token, dataDir: tmp.dir, port: 0, waitTimeoutMs: opts.waitTimeoutMs ?? 10_000 });
  return {
    ...standIn,
    token,
    dataDir: tmp.dir,
    async stop() {
      await standIn.stop();
      await tmp.remove();
    },
  };
}
