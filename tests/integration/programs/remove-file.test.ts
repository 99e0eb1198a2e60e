/**
 * Taking a file off a draft revision through the route: machinists (and leads, admins) may,
 * others may not; released revisions keep their files (the verb refuses, and so does the
 * database); the stored file stays and the removal is an audit event.
 */
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE as removeRoute } from "@/app/api/revisions/[id]/files/[fileId]/route";
import type { Db } from "@/db/client";
import { auditEvents, revisionFiles, revisions, storedFiles } from "@/db/schema";
import { ROLES, type Role } from "@/db/enums";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { buildWorld } from "./world";

let db: Db;
const people = {} as Record<Role, TestUser>;
let world: Awaited<ReturnType<typeof buildWorld>>;

beforeAll(async () => {
  db = freshAppDb();
  for (const r of ROLES) people[r] = makeUser(db, r);
  world = await buildWorld(db, { admin: people.admin, porter: people.porter, machinist: people.machinist });
});

function attachToolpath(revisionId: number, name: string) {
  const sha = Buffer.from(name).toString("hex").padEnd(64, "0").slice(0, 64);
  const file = db
    .insert(storedFiles)
    .values({ kind: "toolpath", storageKey: `toolpath/${sha.slice(0, 2)}/${sha.slice(0, 32)}`, originalName: name, sizeBytes: 100, sha256: sha, state: "stored" })
    .returning()
    .get();
  db.insert(revisionFiles).values({ revisionId, fileId: file.id, role: "toolpath" }).run();
  return file;
}

async function remove(as: TestUser, revisionId: number, fileId: number) {
  const url = `/api/revisions/${revisionId}/files/${fileId}`;
  return json(await removeRoute(await request(url, { as, method: "DELETE" }), params({ id: String(revisionId), fileId: String(fileId) })));
}

const linked = (revisionId: number, fileId: number) =>
  db.select().from(revisionFiles).where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.fileId, fileId))).get();

describe("DELETE /api/revisions/:id/files/:fileId", () => {
  it("lets a machinist take a wrong upload off a draft; the stored file stays and the audit trail says so", async () => {
    const wrong = attachToolpath(world.revision.id, "wrong-head.nc");
    const right = attachToolpath(world.revision.id, "right-head.nc");
    const res = await remove(people.machinist, world.revision.id, wrong.id);
    expect(res.status).toBe(200);
    expect(res.body.removed).toMatchObject({ fileId: wrong.id, role: "toolpath", name: "wrong-head.nc" });
    expect(linked(world.revision.id, wrong.id)).toBeUndefined();
    expect(linked(world.revision.id, right.id)).toBeDefined();
    expect(db.select().from(storedFiles).where(eq(storedFiles.id, wrong.id)).get()).toBeDefined();
    const event = db.select().from(auditEvents).where(eq(auditEvents.action, "revision.file_remove")).all().at(-1)!;
    expect(event.actorId).toBe(people.machinist.id);
    expect(event.entityId).toBe(String(world.revision.id));
    expect(JSON.stringify(event.before)).toContain("wrong-head.nc");
  });

  it("refuses porters and auditors, and a file that is not on the revision", async () => {
    const file = attachToolpath(world.revision.id, "keep-me.nc");
    for (const role of ["porter", "auditor"] as const) {
      expect((await remove(people[role], world.revision.id, file.id)).status).toBe(403);
    }
    expect(linked(world.revision.id, file.id)).toBeDefined();
    expect((await remove(people.machinist, world.revision.id, 987_654)).status).toBe(404);
  });

  it("leaves the files of a revision that left draft alone, and so does the database", async () => {
    const file = attachToolpath(world.revision.id, "proved.nc");
    db.update(revisions).set({ state: "proving" }).where(eq(revisions.id, world.revision.id)).run();
    const res = await remove(people.lead, world.revision.id, file.id);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/files are fixed/);
    expect(linked(world.revision.id, file.id)).toBeDefined();
    db.update(revisions).set({ state: "released", releasedAt: Date.now() }).where(eq(revisions.id, world.revision.id)).run();
    expect(() => db.delete(revisionFiles).where(eq(revisionFiles.fileId, file.id)).run()).toThrow(/immutable/);
  });
});
