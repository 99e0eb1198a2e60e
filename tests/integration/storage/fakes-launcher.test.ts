/**
 * The launcher behind `npm run fakes` and the demo: all three stand-ins come up as child
 * processes, the env it returns is enough to reach each of them, stop() frees the ports, and a
 * busy port is refused up front with a message naming port and service.
 */
import { spawn } from "node:child_process";
import net from "node:net";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createMailer } from "@/lib/mail";
import { createStorage, newObjectId, objectKey } from "@/lib/storage";
import { readEnv } from "@/lib/env";
import { mailConfigFromEnv } from "@/lib/mail/config";
import { storageConfigFromEnv } from "@/lib/storage/config";
import { projectRoot } from "@/storage-fake/child";
import { isPortFree } from "@/storage-fake/net";
import { PortInUseError, startFakes, type RunningFakes } from "@/storage-fake/start";
import { tempDir } from "../support/fakes";

let fakes: RunningFakes;
let data: Awaited<ReturnType<typeof tempDir>>;

beforeAll(async () => {
  data = await tempDir("fakes");
  fakes = await startFakes({ s3Port: 0, smtpPort: 0, mailWebPort: 0, uploadthingPort: 0, dataDir: data.dir });
});

afterAll(async () => {
  await fakes?.stop();
  await data?.remove();
});

/** A port held by a plain TCP server for the duration of a test. */
async function occupyPort(): Promise<{ port: number; release(): Promise<void> }> {
  const server = net.createServer();
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  return { port: (server.address() as net.AddressInfo).port, release: () => new Promise((r) => server.close(() => r())) };
}

describe("startFakes", () => {
  it("returns an env the app's configuration accepts and that reaches storage and mail", async () => {
    // The app reads these variables through lib/env.ts; nothing else is needed.
    const appEnv = readEnv({ ...fakes.env, DATA_DIR: data.dir });
    const store = createStorage(storageConfigFromEnv(appEnv));
    expect(await store.check()).toMatchObject({ ok: true });
    const key = objectKey("photo", newObjectId());
    await store.putStream(key, Buffer.from("fixture plate, datum side"));
    expect((await store.head(key))?.sizeBytes).toBe(25);

    const mailer = createMailer(mailConfigFromEnv(appEnv));
    expect(await mailer.check()).toMatchObject({ ok: true });
    const subject = `Launcher check ${newObjectId()}`;
    await mailer.send({ to: "lead@shop.example", subject, text: "hello" });
    mailer.close();
    // maildev's REST API: mail is queryable once sendMail has resolved.
    const res = await fetch(`${fakes.mailWebUrl}/api/email?subject=${encodeURIComponent(subject)}`);
    const found = (await res.json()) as Array<{ subject: string; to: Array<{ address: string }> }>;
    expect(found.map((m) => [m.subject, m.to[0]?.address])).toEqual([[subject, "lead@shop.example"]]);
  });

  it("points the uploadthing settings at the running stand-in", async () => {
    expect(fakes.env.UPLOADTHING_INGEST_URL).toBe(fakes.uploadthingUrl);
    const token = JSON.parse(Buffer.from(fakes.env.UPLOADTHING_TOKEN!, "base64").toString("utf8")) as { apiKey: string; appId: string; regions: string[] };
    expect(token.apiKey).toMatch(/^sk_/);
    expect(token.regions.length).toBeGreaterThan(0);
    const health = await fetch(`${fakes.uploadthingUrl}/`);
    expect(await health.json()).toMatchObject({ ok: true, appId: token.appId });
    // The stand-in accepts the same key the app will use.
    const list = await fetch(`${fakes.uploadthingUrl}/v6/listFiles`, { method: "POST", headers: { "x-uploadthing-api-key": token.apiKey }, body: "{}" });
    expect(list.status).toBe(200);
  });

  it("refuses a busy port before starting anything", async () => {
    const held = await occupyPort();
    try {
      const err = await startFakes({ s3Port: 0, smtpPort: 0, mailWebPort: 0, uploadthingPort: held.port, dataDir: data.dir }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(PortInUseError);
      expect((err as Error).message).toBe(
        `port ${held.port} is already in use (wanted by the uploadthing stand-in); stop whatever holds it or pick another port`,
      );
    } finally {
      await held.release();
    }
  });

  it("frees every port on stop()", async () => {
    const second = await startFakes({ s3Port: 0, smtpPort: 0, mailWebPort: 0, uploadthingPort: 0, dataDir: path.join(data.dir, "second") });
    const ports = [second.s3Url, second.mailWebUrl, second.uploadthingUrl].map((u) => Number(new URL(u).port)).concat(second.smtp.port);
    for (const p of ports) expect(await isPortFree(p)).toBe(false);
    await second.stop();
    for (const p of ports) expect(await isPortFree(p)).toBe(true);
  });
});

describe("npm run fakes", () => {
  it("exits non-zero with a one-line message naming the busy port and the service", async () => {
    const held = await occupyPort();
    try {
      const child = spawn(process.execPath, ["--import", "tsx", path.join(projectRoot, "storage-fake/start.ts"), "--s3-port", String(held.port)], {
        cwd: projectRoot,
        stdio: ["ignore", "pipe", "pipe"],
      });
      let stderr = "";
      child.stderr.setEncoding("utf8").on("data", (c: string) => (stderr += c));
      const code = await new Promise<number | null>((r) => child.on("exit", r));
      expect(code).toBe(1);
      expect(stderr.trim()).toBe(`fakes: port ${held.port} is already in use (wanted by the S3 storage fake); stop whatever holds it or pick another port`);
    } finally {
      await held.release();
    }
  });
});
