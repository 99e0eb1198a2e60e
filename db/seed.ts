/**
 * Loads the invented demo shop into an empty database (`npm run db:seed`). Does nothing when
 * people already exist, so restarting the demo keeps what was entered.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { count } from "drizzle-orm";
import { db as defaultDb, type Db } from "./client";
import { users } from "./schema";
import { seedFlow } from "./seed/flow";
import { seedJobs } from "./seed/jobs";
import { seedLibrary } from "./seed/library";
import { seedPeople } from "./seed/people";
import { seedPrograms } from "./seed/programs";

export type SeedContext = { people: ReturnType<typeof seedPeople>; library: ReturnType<typeof seedLibrary> };

/** Later parts of the demo (programs, jobs, flow tests) hook in here, in order. */
export const seedSteps: Array<(db: Db, ctx: SeedContext) => Promise<void> | void> = [
  (db, ctx) => seedPrograms(db, ctx),
  seedFlow,
  seedJobs,
];

export async function seedDemo(db: Db = defaultDb()): Promise<boolean> {
  if (db.select({ n: count() }).from(users).get()!.n > 0) return false;
  const ctx = db.transaction((tx) => {
    const people = seedPeople(tx as unknown as Db);
    const library = seedLibrary(tx as unknown as Db);
    return { people, library };
  });
  for (const step of seedSteps) await step(db, ctx);
  return true;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  seedDemo().then(
    (seeded) => console.log(seeded ? "demo data loaded" : "database already has data; seed skipped"),
    (err) => {
      console.error(`seed failed: ${err instanceof Error ? err.message : String(err)}`);
      process.exitCode = 1;
    },
  );
}
