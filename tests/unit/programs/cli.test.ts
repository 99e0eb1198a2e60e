import { beforeAll, describe, expect, it } from "vitest";
import { setDatabase } from "@/db/client";
import { programs, headTypes } from "@/db/schema";
import { run as program } from "@/lib/cli/program";
import { run as storageCli } from "@/lib/cli/storage";
import { freshDb } from "../../support/db";

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  return { io: { out: (t: string) => void out.push(t), err: (t: string) => void err.push(t) }, out, err };
}

beforeAll(() => {
  const db = freshDb();
  setDatabase(db);
  const ht = db.insert(headTypes).values({ castingNumber: "CLI-1", engineFamily: "Test", cylinders: 4, valvesPerCylinder: 2, boreMm: 80, strokeMm: 80, intakeValveMm: 40, exhaustValveMm: 34 }).returning().get();
  db.insert(programs).values({ headTypeId: ht.id, port: "exhaust", name: "Bench exhaust" }).run();
});

describe("portolan program", () => {
  it("lists programs as JSON", async () => {
    const c = capture();
    expect(await program(["list", "--json"], c.io)).toBe(0);
    const rows = JSON.parse(c.out.join(""));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ name: "Bench exhaust", castingNumber: "CLI-1", port: "exhaust", revisionCount: 0, releasedLetter: null });
  });

  it("refuses an unknown revision (1) and a missing argument (2)", async () => {
    expect(await program(["compare", "--a", "998", "--b", "999"], capture().io)).toBe(1);
    expect(await program(["compare", "--a", "1"], capture().io)).toBe(2);
    expect(await program(["frobnicate"], capture().io)).toBe(2);
  });
});

describe("portolan storage", () => {
  it("answers usage errors with 2 before touching storage", async () => {
    const c = capture();
    expect(await storageCli(["sweep", "--older-than-hours", "0"], c.io)).toBe(2);
    expect(c.err.join("")).toMatch(/positive/);
    expect(await storageCli(["verify"], capture().io)).toBe(2);
    expect(await storageCli([], capture().io)).toBe(2);
  });

  it("refuses to verify a file that does not exist (1)", async () => {
    expect(await storageCli(["verify", "--file-id", "12345"], capture().io)).toBe(1);
  });
});
