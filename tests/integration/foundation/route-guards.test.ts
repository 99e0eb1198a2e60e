/**
 * Every route handler refuses a request without a session: walks app/api and calls each
 * exported method, so a new route that forgets its guard fails here.
 */
import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { freshAppDb, makeUser, params, request, type TestUser } from "../support/app";

const API = path.resolve(import.meta.dirname, "../../../app/api");
/** Routes that are public on purpose, or speak another protocol with its own checks. */
const OPEN = new Set(["health", "auth/[...nextauth]", "uploadthing"]);
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function routeFiles(dir: string, prefix = ""): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const rel = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) return routeFiles(path.join(dir, entry.name), rel);
    return entry.name === "route.ts" ? [prefix] : [];
  });
}

const routes = routeFiles(API).filter((r) => !OPEN.has(r));

let auditor: TestUser;
beforeAll(() => {
  auditor = makeUser(freshAppDb(), "auditor");
});

describe("route handlers without a session", () => {
  it("finds the routes", () => {
    expect(routes.length).toBeGreaterThan(30);
  });

  for (const route of routes) {
    it(`/api/${route} answers 401`, async () => {
      const mod = (await import(path.join(API, route, "route.ts"))) as Record<string, unknown>;
      const exported = METHODS.filter((m) => typeof mod[m] === "function");
      expect(exported.length).toBeGreaterThan(0);
      // Dynamic segments get a plausible value; the guard must answer before any lookup.
      const segs = Object.fromEntries([...route.matchAll(/\[(\w+)\]/g)].map((m) => [m[1], "1"]));
      const url = `/api/${route.replace(/\[(\w+)\]/g, "1")}`;
      for (const method of exported) {
        const handler = mod[method] as (req: Request, ctx: unknown) => Promise<Response>;
        const res = await handler(await request(url, { method, ...(method === "GET" || method === "DELETE" ? {} : { json: {} }) }), params(segs));
        expect(res.status, `${method} ${url}`).toBe(401);
      }
    });
  }
});

describe("the auditor changes nothing", () => {
  // Machine delivery authenticates cell computers by token, not by session.
  const writable = routes.filter((r) => !r.startsWith("machine/"));
  for (const route of writable) {
    it(`/api/${route} refuses the auditor's writes with 403`, async () => {
      const mod = (await import(path.join(API, route, "route.ts"))) as Record<string, unknown>;
      const writes = METHODS.filter((m) => m !== "GET" && typeof mod[m] === "function");
      const segs = Object.fromEntries([...route.matchAll(/\[(\w+)\]/g)].map((m) => [m[1], "1"]));
      const url = `/api/${route.replace(/\[(\w+)\]/g, "1")}`;
      for (const method of writes) {
        const handler = mod[method] as (req: Request, ctx: unknown) => Promise<Response>;
        const res = await handler(await request(url, { method, as: auditor, ...(method === "DELETE" ? {} : { json: {} }) }), params(segs));
        expect(res.status, `${method} ${url}`).toBe(403);
      }
    });
  }
});
