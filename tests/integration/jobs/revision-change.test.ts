/**
 * The library's own release and withdraw verbs tell the leads about open jobs that still use
 * the revision they just ended (superseded by a new release, or withdrawn).
 */
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { revisions } from "@/db/schema";
import { createCustomer } from "@/lib/jobs/customers";
import { chooseRevision, createJob } from "@/lib/jobs/jobs";
import { moveRevision, releaseRevision } from "@/lib/programs/revisions";
import { freshAppDb, makeUser, type TestUser } from "../support/app";
import { startMailCatcher, type MailCatcher } from "../support/fakes";
import { makeProgram, makeRevision, makeShopSetup } from "./factory";

let db: Db;
let mail: MailCatcher;
let lead: TestUser;
let shop: ReturnType<typeof makeShopSetup>;

beforeAll(async () => {
  mail = await startMailCatcher();
  process.env.SMTP_HOST = mail.host;
  process.env.SMTP_PORT = String(mail.port);
  db = freshAppDb();
  lead = makeUser(db, "lead", { password: "lead-password-123" });
  shop = makeShopSetup(db);
});
afterAll(async () => mail.stop());
beforeEach(() => mail.clear());

function jobOn(revisionId: number) {
  const customer = createCustomer(db, lead, { name: `Customer ${revisionId}` });
  const job = createJob(db, lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 1, machineId: shop.machine.id, cutExhaust: false });
  chooseRevision(db, lead, job.id, { port: "intake", revisionId });
  return job;
}

const aboutJobs = (m: { subject?: string }) => /open jobs? uses? it/.test(m.subject ?? "");

describe("revision changes reach the leads of open jobs", () => {
  it("when releasing a new revision supersedes the one a job uses", async () => {
    const program = makeProgram(db, shop.headType.id, "intake", "Street intake (release test)");
    const a = makeRevision(db, program.id, { letter: "A" });
    const job = jobOn(a.revision.id);
    const b = makeRevision(db, program.id, { letter: "B", state: "proving" });
    const result = await releaseRevision(db, lead, b.revision.id, { password: "lead-password-123", overrideReason: "bench booked; first-article flow follows" });
    expect(result.superseded?.id).toBe(a.revision.id);
    expect(result.jobNotice?.jobs).toEqual([job.number]);
    const caught = await mail.waitFor(aboutJobs);
    expect(caught.subject).toBe("Street intake (release test) A was superseded: 1 open job uses it");
    expect(caught.text).toContain(job.number);
  });

  it("when a revision a job uses is withdrawn", async () => {
    const program = makeProgram(db, shop.headType.id, "intake", "Street intake (withdraw test)");
    const a = makeRevision(db, program.id, { letter: "A" });
    const job = jobOn(a.revision.id);
    const result = await moveRevision(db, lead, a.revision.id, { to: "withdrawn", note: "thin wall found under the short side" });
    expect(db.select().from(revisions).where(eq(revisions.id, a.revision.id)).get()!.state).toBe("withdrawn");
    expect(result.jobNotice?.sent).toBe(true);
    const caught = await mail.waitFor(aboutJobs);
    expect(caught.text).toContain("thin wall found under the short side");
    expect(caught.text).toContain(job.number);
  });

  it("and says nothing about jobs when no open job uses the revision", async () => {
    const program = makeProgram(db, shop.headType.id, "intake", "Street intake (unused)");
    const a = makeRevision(db, program.id, { letter: "A" });
    const result = await moveRevision(db, lead, a.revision.id, { to: "withdrawn", note: "never used" });
    expect(result.jobNotice?.jobs).toEqual([]);
    await new Promise((r) => setTimeout(r, 300));
    expect(mail.mails.some(aboutJobs)).toBe(false);
  });
});
