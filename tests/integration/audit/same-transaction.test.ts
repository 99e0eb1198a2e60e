/**
 * Every change of customers, jobs, heads, cuts and machine tokens writes its audit event in the
 * same transaction: when the event cannot be written, the change itself does not happen. The
 * test makes the audit table refuse inserts (a temporary trigger) and checks nothing changed.
 */
import { count } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { auditEvents, customers, cuts, heads, jobs, machineTokens } from "@/db/schema";
import { issueMachineToken, revokeMachineToken } from "@/lib/delivery/tokens";
import { recordCut, updateCut } from "@/lib/jobs/cuts";
import { createCustomer, updateCustomer } from "@/lib/jobs/customers";
import { createHead, updateHead } from "@/lib/jobs/heads";
import { chooseRevision, createJob, moveJob, updateJob } from "@/lib/jobs/jobs";
import { freshAppDb, makeUser, type TestUser } from "../support/app";
import { makeShopSetup } from "../jobs/factory";

let db: Db;
let lead: TestUser, machinist: TestUser, admin: TestUser;
let shop: ReturnType<typeof makeShopSetup>;

beforeAll(() => {
  db = freshAppDb();
  lead = makeUser(db, "lead");
  machinist = makeUser(db, "machinist");
  admin = makeUser(db, "admin");
  shop = makeShopSetup(db);
});

/** Snapshot of every table these verbs write. */
function snapshot() {
  return {
    customers: JSON.stringify(db.select().from(customers).all()),
    jobs: JSON.stringify(db.select().from(jobs).all()),
    heads: JSON.stringify(db.select().from(heads).all()),
    cuts: JSON.stringify(db.select().from(cuts).all()),
    tokens: JSON.stringify(db.select().from(machineTokens).all()),
    events: db.select({ n: count() }).from(auditEvents).get()!.n,
  };
}

async function withAuditRefused(fn: () => unknown) {
  db.$client.exec("CREATE TRIGGER test_refuse_audit BEFORE INSERT ON audit_events BEGIN SELECT RAISE(ABORT, 'audit refused for the test'); END;");
  try {
    const before = snapshot();
    let threw = false;
    try {
      await fn();
    } catch (err) {
      threw = true;
      expect(String(err)).toMatch(/audit refused for the test/);
    }
    expect(threw).toBe(true);
    expect(snapshot()).toEqual(before);
  } finally {
    db.$client.exec("DROP TRIGGER test_refuse_audit");
  }
}

describe("each change and its audit event are one transaction", () => {
  it("holds for every verb of this area", async () => {
    // Build the records with auditing on, then try each change with auditing refused.
    const customer = createCustomer(db, lead, { name: "Gannet Row Performance" });
    await withAuditRefused(() => createCustomer(db, lead, { name: "Never Saved Ltd" }));
    await withAuditRefused(() => updateCustomer(db, lead, customer.id, { phone: "123" }));

    const job = createJob(db, lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 2, machineId: shop.machine.id });
    await withAuditRefused(() => createJob(db, lead, { customerId: customer.id, headTypeId: shop.headType.id, quantity: 1 }));
    await withAuditRefused(() => updateJob(db, lead, job.id, { quantity: 3 }));
    await withAuditRefused(() => chooseRevision(db, lead, job.id, { port: "intake", revisionId: shop.intake.revision.id }));
    chooseRevision(db, lead, job.id, { port: "intake", revisionId: shop.intake.revision.id });
    chooseRevision(db, lead, job.id, { port: "exhaust", revisionId: shop.exhaust.revision.id });
    await withAuditRefused(() => moveJob(db, lead, job.id, { to: "scheduled" }));
    await moveJob(db, lead, job.id, { to: "scheduled" });

    const head = createHead(db, machinist, { jobId: job.id, serial: "TX-1", source: "shop_stock" });
    await withAuditRefused(() => createHead(db, machinist, { jobId: job.id, serial: "TX-2", source: "shop_stock" }));
    await withAuditRefused(() => updateHead(db, machinist, head.id, { incomingNotes: "crack at the exhaust seat" }));
    // The first cut also moves the job onto the machine: both or neither.
    await withAuditRefused(() => recordCut(db, machinist, { headId: head.id, port: "intake", startedAt: Date.now(), outcome: "good" }));
    const { cut } = recordCut(db, machinist, { headId: head.id, port: "intake", startedAt: Date.now(), outcome: "good" });
    await withAuditRefused(() => updateCut(db, machinist, cut.id, { notes: "deburred" }));

    const token = issueMachineToken(db, admin, { machineId: shop.machine.id, label: "cell PC" });
    await withAuditRefused(() => issueMachineToken(db, admin, { machineId: shop.machine.id, label: "second" }));
    await withAuditRefused(() => revokeMachineToken(db, admin, token.id));
  });
});
