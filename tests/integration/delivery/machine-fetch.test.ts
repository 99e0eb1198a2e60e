/**
 * Program delivery end to end: an admin issues a machine token; the cell computer fetches the
 * job's released toolpath, streamed from the S3 stand-in with its SHA-256 in a header; the CLI
 * verifies the bytes and keeps the file only when they match. Token scope and revocation,
 * revision state, and a tampered object are all checked.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import type { NextRequest } from "next/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as listTokensRoute, POST as issueRoute } from "@/app/api/machine-tokens/route";
import { DELETE as revokeRoute } from "@/app/api/machine-tokens/[id]/route";
import { GET as programRoute } from "@/app/api/machine/program/route";
import type { Db } from "@/db/client";
import { auditEvents, heads, jobs, machineTokens } from "@/db/schema";
import { run as programCli } from "@/lib/cli/program";
import { createHead } from "@/lib/jobs/heads";
import { createStorage, type Storage } from "@/lib/storage";
import { chooseRevision, createJob, moveJob } from "@/lib/jobs/jobs";
import { createCustomer } from "@/lib/jobs/customers";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { startTestS3, type TestS3 } from "../support/fakes";
import { makeMachine, makeShopSetup, moveRevision, sha256 } from "../jobs/factory";
import { serveFixed, serveRoute, type Served } from "./http-adapter";

let db: Db;
let s3: TestS3;
let store: Storage;
let served: Served;
let admin: TestUser, lead: TestUser, machinist: TestUser, auditor: TestUser;
let shop: ReturnType<typeof makeShopSetup>;
let jobNumber: string;
let jobId: number;
const program = `%\n(invented test program)\nG21 G90 G94\nT1 M6\nS12000 M3\n${Array.from({ length: 2000 }, (_, i) => `G1 X${(i % 50).toFixed(3)} Y${(i / 40).toFixed(3)} Z-1.5 F900`).join("\n")}\nM30\n%\n`;
const workDir = fs.mkdtempSync(path.join(os.tmpdir(), "portolan-fetch-"));

beforeAll(async () => {
  s3 = await startTestS3();
  // The route handler uses the app's storage from the environment: point it at the stand-in.
  process.env.S3_ENDPOINT = s3.config.endpoint;
  process.env.S3_BUCKET = s3.config.bucket;
  process.env.S3_ACCESS_KEY_ID = s3.config.accessKeyId;
  process.env.S3_SECRET_ACCESS_KEY = s3.config.secretAccessKey;
  store = createStorage(s3.config);
  db = freshAppDb();
  admin = makeUser(db, "admin");
  lead = makeUser(db, "lead");
  machinist = makeUser(db, "machinist");
  auditor = makeUser(db, "auditor");
  shop = makeShopSetup(db, { intake: { content: program, storageKey: "toolpath/ab/abtestfetch0001" } });
  await store.putStream("toolpath/ab/abtestfetch0001", Buffer.from(program), { contentType: "text/plain" });

  const customer = createCustomer(db, lead, { name: "Brackwater Motorsport" });
  const job = createJob(db, lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 1, machineId: shop.machine.id, cutExhaust: false });
  chooseRevision(db, lead, job.id, { port: "intake", revisionId: shop.intake.revision.id });
  await moveJob(db, lead, job.id, { to: "scheduled" });
  jobNumber = job.number;
  jobId = job.id;
  served = await serveRoute((req) => programRoute(req));
});
afterAll(async () => {
  await served?.stop();
  await s3?.stop();
  fs.rmSync(workDir, { recursive: true, force: true });
});

async function issue(machineId: number, label = "cell PC") {
  const res = await json(await issueRoute(await request("/api/machine-tokens", { as: admin, json: { machineId, label } }), params({})));
  expect(res.status).toBe(201);
  return res.body as { id: number; token: string };
}

const fetchAs = async (token: string | null, query = `job=${jobNumber}&port=intake`) =>
  programRoute((await request(`/api/machine/program?${query}`, { headers: token ? { authorization: `Bearer ${token}` } : {} })) as NextRequest);

function captureIo() {
  const out: string[] = [];
  const err: string[] = [];
  return { io: { out: (t: string) => out.push(t), err: (t: string) => err.push(t) }, out, err };
}

describe("machine tokens", () => {
  it("are issued by the admin only, shown once, and stored as a hash", async () => {
    const { id, token } = await issue(shop.machine.id);
    expect(token).toMatch(/^ptm_[A-Za-z0-9_-]{43}$/);
    const row = db.select().from(machineTokens).where(eq(machineTokens.id, id)).get()!;
    expect(row.tokenHash).toBe(sha256(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const listed = await json(await listTokensRoute(await request("/api/machine-tokens", { as: auditor }), params({})));
    expect(JSON.stringify(listed.body)).not.toContain(token);
    expect(JSON.stringify(listed.body)).not.toContain(row.tokenHash);
    const refused = await issueRoute(await request("/api/machine-tokens", { as: lead, json: { machineId: shop.machine.id, label: "x1" } }), params({}));
    expect(refused.status).toBe(403);
    // The audit event never carries the token.
    const ev = db.select().from(auditEvents).where(and(eq(auditEvents.action, "machine_token.issue"), eq(auditEvents.entityId, String(id)))).get()!;
    expect(JSON.stringify(ev)).not.toContain(token);
  });
});

describe("GET /api/machine/program", () => {
  it("streams the released toolpath with its SHA-256 and records the fetch", async () => {
    const { id, token } = await issue(shop.machine.id);
    const res = await fetchAs(token);
    expect(res.status).toBe(200);
    expect(res.headers.get("x-content-sha256")).toBe(sha256(program));
    expect(Number(res.headers.get("content-length"))).toBe(Buffer.byteLength(program));
    const body = Buffer.from(await res.arrayBuffer());
    expect(sha256(body)).toBe(sha256(program));
    const token_ = db.select().from(machineTokens).where(eq(machineTokens.id, id)).get()!;
    expect(token_.lastUsedAt).not.toBeNull();
    const ev = db.select().from(auditEvents).where(eq(auditEvents.action, "program.fetch")).all().at(-1)!;
    expect(ev.actorEmail).toContain(`machine-token:${id}`);
    expect(ev.actorId).toBeNull();
    expect(ev.after).toMatchObject({ job: jobNumber, port: "intake", sha256: sha256(program), tokenId: id });
  });

  it("answers 401 without a token, with an unknown one, and once revoked", async () => {
    expect((await fetchAs(null)).status).toBe(401);
    expect((await fetchAs("ptm_not-a-real-token")).status).toBe(401);
    const { id, token } = await issue(shop.machine.id, "to be revoked");
    expect((await fetchAs(token)).status).toBe(200);
    const revoked = await revokeRoute(await request(`/api/machine-tokens/${id}`, { method: "DELETE", as: admin }), params({ id: String(id) }));
    expect(revoked.status).toBe(200);
    const after = await fetchAs(token);
    expect(after.status).toBe(401);
    expect(after.headers.get("www-authenticate")).toMatch(/^Bearer/);
  });

  it("answers 403 to another machine's token, and records the refusal", async () => {
    const other = makeMachine(db, "Cell 9 — test lathe");
    const { token } = await issue(other.id);
    const res = await json(await fetchAs(token));
    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain("not on Cell 9");
    const ev = db.select().from(auditEvents).where(eq(auditEvents.action, "program.fetch_refused")).all().at(-1)!;
    expect(ev.after).toMatchObject({ job: jobNumber, port: "intake" });
  });

  it("answers 404 for a port the job does not cut and 422 for a malformed query", async () => {
    const { token } = await issue(shop.machine.id);
    expect((await fetchAs(token, `job=${jobNumber}&port=exhaust`)).status).toBe(404);
    expect((await fetchAs(token, `job=NOPE-1&port=intake`)).status).toBe(404);
    expect((await fetchAs(token, `job=${jobNumber}&port=sideways`)).status).toBe(422);
  });

  it("answers 409 once the revision is no longer released", async () => {
    const local = makeShopSetup(db);
    const customer = createCustomer(db, lead, { name: "Tallow Creek Garage" });
    const job = createJob(db, lead, { customerId: customer.id, headTypeId: local.headType.id, quantity: 1, machineId: local.machine.id, cutExhaust: false });
    chooseRevision(db, lead, job.id, { port: "intake", revisionId: local.intake.revision.id });
    await moveJob(db, lead, job.id, { to: "scheduled" });
    const { token } = await issue(local.machine.id);
    moveRevision(db, local.intake.revision.id, "withdrawn", "test: withdrawn");
    const res = await json(await fetchAs(token, `job=${job.number}&port=intake`));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/withdrawn and may not be cut/);
  });
});

describe("portolan program fetch", () => {
  it("downloads, verifies the hash and keeps the file", async () => {
    const { token } = await issue(shop.machine.id);
    const out = path.join(workDir, "ok.nc");
    const cap = captureIo();
    const code = await programCli(["fetch", "--job", jobNumber, "--port", "intake", "--out", out, "--url", served.url, "--token", token, "--json"], cap.io);
    expect(code).toBe(0);
    const result = JSON.parse(cap.out.join(""));
    expect(result).toMatchObject({ ok: true, sha256: sha256(program), bytes: Buffer.byteLength(program), port: "intake" });
    expect(sha256(fs.readFileSync(out))).toBe(sha256(program));
    expect(fs.readdirSync(workDir).filter((f) => f.endsWith(".part"))).toEqual([]);
  });

  it("takes the token from PORTOLAN_MACHINE_TOKEN and the address from APP_URL", async () => {
    const { token } = await issue(shop.machine.id);
    const saved = { t: process.env.PORTOLAN_MACHINE_TOKEN, u: process.env.APP_URL };
    process.env.PORTOLAN_MACHINE_TOKEN = token;
    process.env.APP_URL = served.url;
    try {
      const out = path.join(workDir, "env.nc");
      const code = await programCli(["fetch", "--job", jobNumber, "--port", "intake", "--out", out], captureIo().io);
      expect(code).toBe(0);
      expect(fs.existsSync(out)).toBe(true);
    } finally {
      process.env.PORTOLAN_MACHINE_TOKEN = saved.t;
      process.env.APP_URL = saved.u;
    }
  });

  it("refuses and removes the file when the stored object was replaced (hash mismatch)", async () => {
    const local = makeShopSetup(db, { intake: { content: "G1 X1 F100\nM30\n", storageKey: "toolpath/cd/cdtestswap0001" } });
    // Someone swaps the object behind the record's back.
    await store.putStream("toolpath/cd/cdtestswap0001", Buffer.from("G1 X999 F100\nM30\n"));
    const customer = createCustomer(db, lead, { name: "Slate Ridge Works" });
    const job = createJob(db, lead, { customerId: customer.id, headTypeId: local.headType.id, quantity: 1, machineId: local.machine.id, cutExhaust: false });
    chooseRevision(db, lead, job.id, { port: "intake", revisionId: local.intake.revision.id });
    await moveJob(db, lead, job.id, { to: "scheduled" });
    const { token } = await issue(local.machine.id);
    const out = path.join(workDir, "swapped.nc");
    const cap = captureIo();
    const code = await programCli(["fetch", "--job", job.number, "--port", "intake", "--out", out, "--url", served.url, "--token", token, "--json"], cap.io);
    expect(code).toBe(1);
    const failure = JSON.parse(cap.out.join(""));
    expect(failure.ok).toBe(false);
    // The bytes hash to something else; depending on when the server's own check trips, the
    // download arrives whole (mismatch) or broken off (incomplete). Either way nothing is kept.
    expect(["mismatch", "incomplete"]).toContain(failure.error);
    expect(fs.existsSync(out)).toBe(false);
    expect(fs.readdirSync(workDir).filter((f) => f.startsWith(".swapped"))).toEqual([]);
  });

  it("refuses a body that does not hash to the announced SHA-256, leaving nothing behind", async () => {
    const body = "G1 X5 F100\nM30\n";
    const liar = await serveFixed(200, { "x-content-sha256": sha256("something else"), "content-type": "text/plain" }, body);
    try {
      const out = path.join(workDir, "liar.nc");
      const cap = captureIo();
      const code = await programCli(["fetch", "--job", "J-1", "--port", "intake", "--out", out, "--url", liar.url, "--token", "ptm_x", "--json"], cap.io);
      expect(code).toBe(1);
      const result = JSON.parse(cap.out.join(""));
      expect(result).toMatchObject({ ok: false, error: "mismatch", expected: sha256("something else"), actual: sha256(body) });
      expect(fs.existsSync(out)).toBe(false);
      expect(fs.readdirSync(workDir).filter((f) => f.startsWith(".liar"))).toEqual([]);
    } finally {
      await liar.stop();
    }
  });

  it("leaves an existing file alone when the server refuses, and exits 1", async () => {
    const out = path.join(workDir, "existing.nc");
    fs.writeFileSync(out, "previous program");
    const cap = captureIo();
    const code = await programCli(["fetch", "--job", jobNumber, "--port", "intake", "--out", out, "--url", served.url, "--token", "ptm_wrong"], cap.io);
    expect(code).toBe(1);
    expect(cap.err.join("")).toMatch(/refused \(401\)/);
    expect(fs.readFileSync(out, "utf8")).toBe("previous program");
  });

  it("exits 2 on a usage error", async () => {
    const saved = process.env.PORTOLAN_MACHINE_TOKEN;
    delete process.env.PORTOLAN_MACHINE_TOKEN;
    try {
      expect(await programCli(["fetch", "--job", "J-1", "--port", "roof", "--out", "x"], captureIo().io)).toBe(2);
      expect(await programCli(["pull"], captureIo().io)).toBe(2);
    } finally {
      if (saved !== undefined) process.env.PORTOLAN_MACHINE_TOKEN = saved;
    }
  });
});

describe("the fetched program goes on to cut a head", () => {
  it("records the cut with the same checksum the machine verified", async () => {
    const head = createHead(db, machinist, { jobId, serial: "FETCH-1", source: "customer_core" });
    const { recordCut } = await import("@/lib/jobs/cuts");
    const { cut } = recordCut(db, machinist, { headId: head.id, port: "intake", startedAt: Date.now(), outcome: "good" });
    expect(cut.toolpathSha256).toBe(sha256(program));
    expect(db.select().from(heads).where(eq(heads.id, head.id)).get()!.state).toBe("cut");
    expect(db.select().from(jobs).where(eq(jobs.id, jobId)).get()!.state).toBe("on_machine");
  });
});
