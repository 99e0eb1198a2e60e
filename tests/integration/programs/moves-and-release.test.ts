/**
 * Every revision move by every role through the route handlers (allowed and refused), the
 * password-signed release with its flow-test rule, superseding, the notices that reach the
 * SMTP catcher, and immutability enforced by the database itself.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { POST as moveRoute } from "@/app/api/revisions/[id]/moves/route";
import { POST as releaseRoute } from "@/app/api/revisions/[id]/release/route";
import { POST as masterMoveRoute } from "@/app/api/masters/[id]/moves/route";
import { PUT as putRevision } from "@/app/api/revisions/[id]/route";
import { POST as newRevision } from "@/app/api/programs/[id]/revisions/route";
import type { Db } from "@/db/client";
import { analyses, auditEvents, flowTests, revisionFiles, revisionMoves, revisions, storedFiles } from "@/db/schema";
import { ROLES, type Role } from "@/db/enums";
import { createMaster } from "@/lib/library/masters";
import { releaseSignature } from "@/lib/programs/signature";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { startMailCatcher, type MailCatcher } from "../support/fakes";
import { buildWorld } from "./world";

let db: Db;
let mail: MailCatcher;
const people = {} as Record<Role, TestUser>;
let world: Awaited<ReturnType<typeof buildWorld>>;

beforeAll(async () => {
  mail = await startMailCatcher();
  process.env.SMTP_HOST = mail.host;
  process.env.SMTP_PORT = String(mail.port);
  db = freshAppDb();
  for (const r of ROLES) people[r] = makeUser(db, r);
  world = await buildWorld(db, { admin: people.admin, porter: people.porter, machinist: people.machinist });
});
afterAll(async () => {
  await mail.stop();
});
beforeEach(() => mail.clear());

/** A stored toolpath with a finished analysis, as an upload and a run would leave it. */
function attachAnalysedToolpath(revisionId: number, seed: string) {
  const sha = seed.padEnd(64, "0").slice(0, 64);
  const file = db
    .insert(storedFiles)
    .values({ kind: "toolpath", storageKey: `toolpath/${sha.slice(0, 2)}/${sha.slice(0, 32)}`, originalName: `${seed}.nc`, sizeBytes: 100, sha256: sha, state: "stored" })
    .returning()
    .get();
  db.insert(revisionFiles).values({ revisionId, fileId: file.id, role: "toolpath" }).run();
  db.insert(analyses).values({ fileId: file.id, engine: "toolpath", state: "done", progress: 1, result: { cycleTimeS: 60 } }).run();
  return file;
}

async function newDraft(note = "another pass on the short side") {
  return newRevision(await request(`/api/programs/${world.program.id}/revisions`, { as: people.machinist, json: { changeNote: note } }), params({ id: String(world.program.id) }));
}

async function move(as: TestUser, id: number, body: Record<string, unknown>) {
  return json(await moveRoute(await request(`/api/revisions/${id}/moves`, { as, json: body }), params({ id: String(id) })));
}
async function release(as: TestUser, id: number, body: Record<string, unknown>) {
  return json(await releaseRoute(await request(`/api/revisions/${id}/release`, { as, json: body }), params({ id: String(id) })));
}
const stateOf = (id: number) => db.select({ state: revisions.state }).from(revisions).where(eq(revisions.id, id)).get()!.state;

describe("draft → proving", () => {
  it("refuses to prove a revision with no uploaded toolpath", async () => {
    const res = await move(people.machinist, world.revision.id, { to: "proving" });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/no uploaded toolpath/);
  });

  it.each([
    ["porter", 403],
    ["auditor", 403],
  ] as const)("refuses a %s (%i)", async (role, status) => {
    attachAnalysedToolpath(world.revision.id, `aa${role}`);
    const res = await move(people[role], world.revision.id, { to: "proving" });
    expect(res.status).toBe(status);
    expect(stateOf(world.revision.id)).toBe("draft");
  });

  it("lets the machinist do it, records who and when, and e-mails the leads", async () => {
    const res = await move(people.machinist, world.revision.id, { to: "proving" });
    expect(res.status).toBe(200);
    expect(res.body.revision.state).toBe("proving");
    expect(res.body.notice.sent).toBe(true);
    const m = db.select().from(revisionMoves).where(and(eq(revisionMoves.revisionId, world.revision.id), eq(revisionMoves.toState, "proving"))).get()!;
    expect(m).toMatchObject({ fromState: "draft", byId: people.machinist.id });
    const caught = await mail.waitFor((x) => x.envelopeTo.includes(people.lead.email));
    expect(caught.subject).toMatch(/revision A is in proving/);
    expect(mail.mails.some((x) => x.envelopeTo.includes(people.porter.email))).toBe(false);
  });

  it("refuses edits once the revision has left draft", async () => {
    const res = await json(await putRevision(await request(`/api/revisions/${world.revision.id}`, { as: people.machinist, method: "PUT", json: { changeNote: "sneaky change" } }), params({ id: String(world.revision.id) })));
    expect(res.status).toBe(409);
  });
});

describe("release", () => {
  it.each(["porter", "machinist", "auditor"] as const)("is refused to a %s", async (role) => {
    const res = await release(people[role], world.revision.id, { password: people[role].password, overrideReason: "bench is broken this week" });
    expect(res.status).toBe(403);
    expect(stateOf(world.revision.id)).toBe("proving");
  });

  it("needs the releaser's own password, and records the refused attempt", async () => {
    const res = await release(people.lead, world.revision.id, { password: "not-my-password", overrideReason: "bench is broken this week" });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.password).toBeDefined();
    expect(stateOf(world.revision.id)).toBe("proving");
    expect(db.select().from(auditEvents).where(eq(auditEvents.action, "revision.release_refused")).all()).toHaveLength(1);
  });

  it("needs a linked flow test or a written reason", async () => {
    const res = await release(people.lead, world.revision.id, { password: people.lead.password });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.overrideReason).toBeDefined();
  });

  it("releases with a flow test linked: signature over who, when and the file checksums", async () => {
    db.insert(flowTests).values({ subject: "revision", headTypeId: world.headType.id, revisionId: world.revision.id, port: "intake", depressionInH2O: 28, valveDiameterMm: 45, testedOn: "2026-11-25" }).run();
    const res = await release(people.lead, world.revision.id, { password: people.lead.password });
    expect(res.status).toBe(200);
    const row = db.select().from(revisions).where(eq(revisions.id, world.revision.id)).get()!;
    expect(row).toMatchObject({ state: "released", releasedById: people.lead.id, releaseOverrideReason: null });
    const files = db.select({ sha: storedFiles.sha256 }).from(revisionFiles).innerJoin(storedFiles, eq(storedFiles.id, revisionFiles.fileId)).where(eq(revisionFiles.revisionId, row.id)).all();
    expect(row.releaseSignature).toBe(releaseSignature({ userId: people.lead.id, at: row.releasedAt!, revisionId: row.id, fileSha256s: files.map((f) => f.sha!) }));
    // Everyone concerned hears of it: leads, machinists, the creator, the master's porter.
    for (const who of [people.lead, people.machinist, people.porter]) await mail.waitFor((x) => x.envelopeTo.includes(who.email) && /released/.test(x.subject ?? ""));
    expect(mail.mails.some((x) => x.envelopeTo.includes(people.auditor.email))).toBe(false);
  });

  it("supersedes the previous release when the next revision is released (override reason kept)", async () => {
    const b = await json(await newDraft());
    expect(b.status).toBe(201);
    expect(b.body).toMatchObject({ letter: "B", parentId: world.revision.id, state: "draft" });
    attachAnalysedToolpath(b.body.id, "bbbb");
    expect((await move(people.machinist, b.body.id, { to: "proving" })).status).toBe(200);
    const res = await release(people.admin, b.body.id, { password: people.admin.password, overrideReason: "Same flow as A within 1 %, bench results to follow." });
    expect(res.status).toBe(200);
    expect(res.body.superseded.id).toBe(world.revision.id);
    expect(stateOf(world.revision.id)).toBe("superseded");
    expect(stateOf(b.body.id)).toBe("released");
    const sup = db.select().from(revisionMoves).where(and(eq(revisionMoves.revisionId, world.revision.id), eq(revisionMoves.toState, "superseded"))).get()!;
    expect(sup).toMatchObject({ fromState: "released", byId: people.admin.id });
    expect(db.select().from(revisions).where(eq(revisions.id, b.body.id)).get()!.releaseOverrideReason).toMatch(/bench results to follow/);
  });

  it("is refused for a draft (only proving revisions are released)", async () => {
    const c = await json(await newDraft("third try"));
    attachAnalysedToolpath(c.body.id, "cccc");
    const res = await release(people.lead, c.body.id, { password: people.lead.password, overrideReason: "trying to skip proving" });
    expect(res.status).toBe(409);
  });
});

describe("withdrawal and the other moves", () => {
  it("back to draft needs a machinist and a reason; auditors and porters are refused", async () => {
    const d = await json(await newDraft("fourth"));
    attachAnalysedToolpath(d.body.id, "dddd");
    await move(people.machinist, d.body.id, { to: "proving" });
    expect((await move(people.porter, d.body.id, { to: "draft", note: "bad" })).status).toBe(403);
    expect((await move(people.auditor, d.body.id, { to: "draft", note: "bad" })).status).toBe(403);
    expect((await move(people.machinist, d.body.id, { to: "draft" })).status).toBe(422);
    const back = await move(people.machinist, d.body.id, { to: "draft", note: "first article was oversize" });
    expect(back.status).toBe(200);
    expect(stateOf(d.body.id)).toBe("draft");
  });

  it("withdrawing a released revision is for leads and admins only, with a reason, and tells everyone", async () => {
    const released = db.select().from(revisions).where(and(eq(revisions.programId, world.program.id), eq(revisions.state, "released"))).get()!;
    for (const role of ["porter", "machinist", "auditor"] as const) {
      expect((await move(people[role], released.id, { to: "withdrawn", note: "looks wrong" })).status).toBe(403);
    }
    const res = await move(people.lead, released.id, { to: "withdrawn", note: "casting variation broke into the jacket on cyl 3" });
    expect(res.status).toBe(200);
    expect(stateOf(released.id)).toBe("withdrawn");
    await mail.waitFor((x) => x.envelopeTo.includes(people.machinist.email) && /withdrawn/.test(x.subject ?? ""));
  });

  it("has no way back from withdrawn or superseded", async () => {
    const ended = db.select().from(revisions).where(eq(revisions.programId, world.program.id)).all().filter((r) => r.state === "withdrawn" || r.state === "superseded");
    expect(ended.length).toBeGreaterThanOrEqual(2);
    for (const r of ended) for (const to of ["draft", "proving", "withdrawn"]) expect((await move(people.admin, r.id, { to, note: "undo please" })).status).toBe(409);
  });
});

describe("immutability in the database itself", () => {
  it("refuses direct SQL changes to a released or ended revision, its files and its analysis", () => {
    const frozen = db.select().from(revisions).where(eq(revisions.programId, world.program.id)).all().filter((r) => r.state === "superseded");
    const r = frozen[0];
    const sql = db.$client;
    expect(() => sql.prepare("UPDATE revisions SET change_note = 'edited' WHERE id = ?").run(r.id)).toThrow(/immutable/);
    expect(() => sql.prepare("DELETE FROM revisions WHERE id = ?").run(r.id)).toThrow(/cannot be deleted/);
    const link = db.select().from(revisionFiles).where(eq(revisionFiles.revisionId, r.id)).get()!;
    expect(() => sql.prepare("UPDATE stored_files SET sha256 = 'x' WHERE id = ?").run(link.fileId)).toThrow(/immutable/);
    expect(() => sql.prepare("UPDATE analyses SET result = '{}' WHERE file_id = ?").run(link.fileId)).toThrow(/immutable/);
    expect(() => sql.prepare("DELETE FROM revision_files WHERE id = ?").run(link.id)).toThrow(/immutable/);
    expect(() => sql.prepare("INSERT INTO revision_files (revision_id, file_id, role) VALUES (?, ?, 'toolpath')").run(r.id, link.fileId)).toThrow(/immutable/);
  });

  it("refuses direct SQL edits to a released revision except its supersede or withdrawal", () => {
    const d = db.select().from(revisions).where(and(eq(revisions.programId, world.program.id), eq(revisions.letter, "D"))).get()!;
    // Put D through proving → released by hand-written rows, as a rogue script might.
    db.$client.prepare("UPDATE revisions SET state = 'released', released_at = 1 WHERE id = ?").run(d.id);
    expect(() => db.$client.prepare("UPDATE revisions SET release_signature = 'forged' WHERE id = ?").run(d.id)).toThrow(/immutable/);
    expect(() => db.$client.prepare("UPDATE revisions SET state = 'draft' WHERE id = ?").run(d.id)).toThrow(/immutable/);
    expect(() => db.$client.prepare("UPDATE revisions SET state = 'superseded', end_reason = 'by E' WHERE id = ?").run(d.id)).not.toThrow();
  });
});

describe("master handoff", () => {
  it("lets a porter hand a master over and e-mails the machinists; a machinist may not", async () => {
    const m = createMaster(db, { ...people.porter }, { label: "M-HANDOFF", headTypeId: world.headType.id });
    const refused = await json(await masterMoveRoute(await request(`/api/masters/${m.id}/moves`, { as: people.machinist, json: { to: "ready_to_digitize" } }), params({ id: String(m.id) })));
    expect(refused.status).toBe(403);
    const auditorTry = await json(await masterMoveRoute(await request(`/api/masters/${m.id}/moves`, { as: people.auditor, json: { to: "ready_to_digitize" } }), params({ id: String(m.id) })));
    expect(auditorTry.status).toBe(403);
    const ok = await json(await masterMoveRoute(await request(`/api/masters/${m.id}/moves`, { as: people.porter, json: { to: "ready_to_digitize" } }), params({ id: String(m.id) })));
    expect(ok.status).toBe(200);
    expect(ok.body.master.stage).toBe("ready_to_digitize");
    const caught = await mail.waitFor((x) => x.envelopeTo.includes(people.machinist.email));
    expect(caught.subject).toBe("Master M-HANDOFF is ready to digitize");
    expect(caught.text).toContain(`/masters/${m.id}`);
  });
});
