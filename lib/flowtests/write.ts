/**
 * Recording, changing and deleting flow tests. Each verb: role guard, zod parse, one transaction
 * with its audit event. The audit snapshot holds the stored values and the lift table, so a
 * changed or deleted test can be read back from the trail.
 */
import { eq } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { flowPoints, flowTests } from "@/db/schema";
import { cutsLinkedTo } from "@/db/queries/flow-tests";
import { recordAudit } from "../audit/record";
import { requireRole, type Actor } from "../auth/guard";
import { AppError } from "../errors";
import { parseInput } from "../validation";
import { checkLinks } from "./links";
import { recordToStored, type StoredFlowTest, type StoredPoint } from "./normalize";
import { FLOW_EDITORS, FLOW_RECORDERS } from "./roles";
import { flowTestRecordSchema, type FlowTestRecord } from "./schema";

export type SavedFlowTest = StoredFlowTest & { id: number; points: StoredPoint[] };

/** What the audit trail keeps of a test: every stored field and the lift table as [mm, cfm] pairs. */
export function auditSnapshot(test: StoredFlowTest, points: StoredPoint[]) {
  return { ...test, points: points.map((p) => [p.liftMm, p.flowCfm]) };
}

function readStored(tx: Tx | Db, id: number): SavedFlowTest | undefined {
  const row = tx.select().from(flowTests).where(eq(flowTests.id, id)).get();
  if (!row) return undefined;
  const points = tx
    .select({ liftMm: flowPoints.liftMm, flowCfm: flowPoints.flowCfm })
    .from(flowPoints)
    .where(eq(flowPoints.flowTestId, id))
    .orderBy(flowPoints.liftMm)
    .all();
  const { createdAt: _c, updatedAt: _u, ...test } = row;
  void _c;
  void _u;
  return { ...test, points };
}

function insertPoints(tx: Tx, flowTestId: number, points: StoredPoint[]) {
  if (points.length) tx.insert(flowPoints).values(points.map((p) => ({ flowTestId, ...p }))).run();
}

/** Writes an already validated record; shared by the form's route and the CSV import. */
export function insertFlowTest(db: Db, who: Actor, record: FlowTestRecord, now = Date.now(), auditExtra?: Record<string, unknown>): SavedFlowTest {
  const { test, points } = recordToStored(record, who.id);
  return db.transaction((tx) => {
    checkLinks(tx, test);
    const { id } = tx
      .insert(flowTests)
      .values({ ...test, createdAt: now, updatedAt: now })
      .returning({ id: flowTests.id })
      .get();
    insertPoints(tx, id, points);
    recordAudit(tx, { actor: who, action: "flow_test.create", entity: "flow_test", entityId: id, after: { ...auditSnapshot(test, points), ...auditExtra } }, now);
    return { id, ...test, points };
  });
}

export function createFlowTest(db: Db, actor: Actor | null, input: unknown, now = Date.now()): SavedFlowTest {
  const who = requireRole(actor, FLOW_RECORDERS);
  const record = parseInput(flowTestRecordSchema, input);
  return insertFlowTest(db, who, record, now);
}

/** Replaces a test's fields and lift table (lead and admin). The operator stays unless one is named. */
export function updateFlowTest(db: Db, actor: Actor | null, id: number, input: unknown, now = Date.now()): SavedFlowTest {
  const who = requireRole(actor, FLOW_EDITORS);
  const record = parseInput(flowTestRecordSchema, input);
  return db.transaction((tx) => {
    const before = readStored(tx, id);
    if (!before) throw new AppError("not_found", "That flow test was not found.");
    const { test, points } = recordToStored(record, before.operatorId);
    checkLinks(tx, test);
    tx.update(flowTests)
      .set({ ...test, updatedAt: now })
      .where(eq(flowTests.id, id))
      .run();
    tx.delete(flowPoints).where(eq(flowPoints.flowTestId, id)).run();
    insertPoints(tx, id, points);
    const { id: _id, points: beforePoints, ...beforeTest } = before;
    void _id;
    recordAudit(
      tx,
      {
        actor: who,
        action: "flow_test.update",
        entity: "flow_test",
        entityId: id,
        before: auditSnapshot(beforeTest, beforePoints),
        after: auditSnapshot(test, points),
      },
      now,
    );
    return { id, ...test, points };
  });
}

/** Deletes a test (lead and admin). Refused while a cut names it as its flow result. */
export function deleteFlowTest(db: Db, actor: Actor | null, id: number, now = Date.now()): { id: number } {
  const who = requireRole(actor, FLOW_EDITORS);
  return db.transaction((tx) => {
    const before = readStored(tx, id);
    if (!before) throw new AppError("not_found", "That flow test was not found.");
    const linked = cutsLinkedTo(tx as unknown as Db, id);
    if (linked > 0) {
      throw new AppError("conflict", `${linked === 1 ? "A cut record names" : `${linked} cut records name`} this test as its flow result; it stays part of that head's history.`);
    }
    tx.delete(flowPoints).where(eq(flowPoints.flowTestId, id)).run();
    tx.delete(flowTests).where(eq(flowTests.id, id)).run();
    const { id: _id, points, ...test } = before;
    void _id;
    recordAudit(tx, { actor: who, action: "flow_test.delete", entity: "flow_test", entityId: id, before: auditSnapshot(test, points) }, now);
    return { id };
  });
}
