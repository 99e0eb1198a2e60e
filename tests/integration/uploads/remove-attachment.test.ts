/**
 * Taking a photo off a record through DELETE /api/attachments/:id: allowed to the people who may
 * add photos to that record, refused to others; a revision's photos are fixed once it leaves
 * draft; the stored file stays and the removal is an audit event.
 */
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE as removeRoute } from "@/app/api/attachments/[id]/route";
import type { Db } from "@/db/client";
import { attachments, auditEvents, revisions, storedFiles } from "@/db/schema";
import { ROLES, type Role } from "@/db/enums";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { buildWorld } from "../programs/world";

let db: Db;
const people = {} as Record<Role, TestUser>;
let world: Awaited<ReturnType<typeof buildWorld>>;

beforeAll(async () => {
  db = freshAppDb();
  for (const r of ROLES) people[r] = makeUser(db, r);
  world = await buildWorld(db, { admin: people.admin, porter: people.porter, machinist: people.machinist });
});

let seq = 0;
function attachPhoto(entity: string, entityId: number, caption: string) {
  const sha = (++seq).toString(16).padEnd(64, "a");
  const file = db
    .insert(storedFiles)
    .values({ kind: "photo", storageKey: `photo/${sha.slice(0, 2)}/${sha.slice(0, 32)}`, originalName: `${caption}.png`, sizeBytes: 100, sha256: sha, state: "stored", contentType: "image/png" })
    .returning()
    .get();
  return db.insert(attachments).values({ entity, entityId, fileId: file.id, caption }).returning().get();
}

async function remove(as: TestUser, id: number) {
  return json(await removeRoute(await request(`/api/attachments/${id}`, { as, method: "DELETE" }), params({ id: String(id) })));
}
const exists = (id: number) => db.select().from(attachments).where(eq(attachments.id, id)).get() !== undefined;

describe("DELETE /api/attachments/:id", () => {
  it("lets a porter take a master's photo off; the file stays and the audit trail says so", async () => {
    const photo = attachPhoto("master_head", world.master.id, "blurred bowl");
    const res = await remove(people.porter, photo.id);
    expect(res.status).toBe(200);
    expect(res.body.removed).toMatchObject({ entity: "master_head", entityId: world.master.id, caption: "blurred bowl" });
    expect(exists(photo.id)).toBe(false);
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, photo.fileId)).get()).toBeDefined();
    const event = db.select().from(auditEvents).where(eq(auditEvents.action, "attachment.remove")).all().at(-1)!;
    expect(event.actorId).toBe(people.porter.id);
    expect(JSON.stringify(event.before)).toContain("blurred bowl");
  });

  it("refuses those who may not add photos to that record, and unknown photos", async () => {
    const photo = attachPhoto("master_head", world.master.id, "keep");
    for (const role of ["machinist", "auditor"] as const) expect((await remove(people[role], photo.id)).status).toBe(403);
    expect(exists(photo.id)).toBe(true);
    expect((await remove(people.admin, 987_654)).status).toBe(404);
  });

  it("keeps a revision's photos once it has left draft", async () => {
    const draftPhoto = attachPhoto("revision", world.revision.id, "setup on the plate");
    expect((await remove(people.machinist, draftPhoto.id)).status).toBe(200);
    const photo = attachPhoto("revision", world.revision.id, "clamped");
    db.update(revisions).set({ state: "proving" }).where(eq(revisions.id, world.revision.id)).run();
    const res = await remove(people.machinist, photo.id);
    expect(res.status).toBe(409);
    expect(exists(photo.id)).toBe(true);
  });
});
