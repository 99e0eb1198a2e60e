/**
 * A flow test from a bench CSV: the file is read whole (it is small and capped), every row is
 * checked, and nothing is stored unless the whole file is valid. Problems come back per line of
 * the file as field errors `rows.<line>` (`rows.1` is the header, `mapping` the column mapping),
 * including the flow math's own checks on the points (a lift larger than the valve, say).
 */
import { flowTestFromCsv, parseFlowCsv, type CsvError } from "@/lib/flow";
import type { Db } from "@/db/client";
import { requireRole, type Actor } from "../auth/guard";
import { AppError, type FieldErrors } from "../errors";
import { fieldErrors, parseInput } from "../validation";
import { FLOW_RECORDERS } from "./roles";
import { flowTestImportSchema, flowTestRecordSchema } from "./schema";
import { insertFlowTest, type SavedFlowTest } from "./write";

export type ImportedFlowTest = SavedFlowTest & { import: { columns: Record<string, string>; ignoredColumns: string[]; units: Record<string, string>; rows: number } };

function csvFieldErrors(errors: CsvError[]): FieldErrors {
  const fields: FieldErrors = {};
  for (const e of errors) {
    const key = e.row === 0 ? "mapping" : `rows.${e.row}`;
    (fields[key] ??= []).push(e.column ? `${e.column}: ${e.message}` : e.message);
  }
  return fields;
}

const problems = (n: number) => `${n} ${n === 1 ? "problem" : "problems"}`;

export function importFlowTestCsv(db: Db, actor: Actor | null, input: unknown, now = Date.now()): ImportedFlowTest {
  const who = requireRole(actor, FLOW_RECORDERS);
  const { csv, mapping, test } = parseInput(flowTestImportSchema, input);
  const parsed = parseFlowCsv(csv, mapping);
  if (!parsed.ok) {
    throw new AppError("invalid", `The file has ${problems(parsed.errors.length)}; nothing was saved.`, csvFieldErrors(parsed.errors));
  }
  const { points, liftUnit, flowUnit } = flowTestFromCsv(parsed, {
    valveDiameter: test.valveDiameter,
    depression: test.depression,
    depressionUnit: test.depressionUnit,
  });
  const checked = flowTestRecordSchema.safeParse({ ...test, liftUnit, flowUnit, points });
  if (!checked.success) {
    // Point problems name the file's line; the others keep their field name.
    const fields: FieldErrors = {};
    for (const [key, messages] of Object.entries(fieldErrors(checked.error))) {
      const m = /^points\.(\d+)(?:\.(\w+))?$/.exec(key);
      const target = m ? `rows.${parsed.rows[Number(m[1])]?.line ?? "?"}` : key;
      (fields[target] ??= []).push(...messages.map((msg) => (m?.[2] ? `${m[2]}: ${msg}` : msg)));
    }
    throw new AppError("invalid", `The test has ${problems(Object.values(fields).flat().length)}; nothing was saved.`, fields);
  }
  const saved = insertFlowTest(db, who, checked.data, now, { importedColumns: parsed.columns });
  return {
    ...saved,
    import: { columns: parsed.columns, ignoredColumns: parsed.ignoredColumns, units: parsed.units, rows: parsed.rows.length },
  };
}
