/**
 * CSV → lift table. A pure function on a string, so the browser and the CLI share it.
 *
 * The header names each column's quantity and unit: `lift_in`, `lift_mm`, `flow_cfm`, `flow_ls`,
 * `flow_m3s`, `flow_m3h`, optionally `depression_inh2o` / `depression_pa` / `depression_kpa`.
 * Spaces, brackets and slashes count as separators ("Lift (in)", "Flow [L/s]" are fine). When the
 * headers are not recognised the user maps the columns instead (ColumnMapping).
 *
 * All or nothing: any malformed row makes the whole import fail, with one error per problem, so
 * half a test is never stored. `row` in an error is the 1-based line number of the file.
 * Delimiter: tab or semicolon when the first line holds one, else comma; with tab or semicolon a
 * decimal comma is read as a decimal point.
 */
import Papa from "papaparse";
import { type ColumnMappingInput, type FlowTestInput, LIFT_UNITS, MAX_POINTS, columnMappingSchema } from "./schema";
import { type FlowUnit, type LengthUnit, type PressureUnit, pressure } from "./units";

export type LiftUnit = (typeof LIFT_UNITS)[number];
export type CsvUnits = { lift: LiftUnit; flow: FlowUnit; depression?: PressureUnit };
export type CsvRow = { line: number; lift: number; flow: number; depression?: number };
export type CsvError = { row: number; column?: string; message: string };

export type CsvImport =
  | {
      ok: true;
      /** In file order, in the file's units. */
      rows: CsvRow[];
      units: CsvUnits;
      /** Header (or "#index") each quantity was read from. */
      columns: { lift: string; flow: string; depression?: string };
      ignoredColumns: string[];
      delimiter: string;
    }
  | { ok: false; errors: CsvError[]; headers: string[] };

type Role = "lift" | "flow" | "depression";
type ColumnPick = { index: number; unit: string; name: string };

/** Lower-case, unify separators and superscripts: "Flow [m³/s]" → "flow_m3_s". */
export function normalizeHeader(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/³/g, "3")
    .replace(/₂/g, "2")
    .replace(/[^a-z0-9]+/g, "_")
    .replace(/^_+|_+$/g, "");
}

const ROLE_PREFIX: Record<Role, RegExp> = {
  lift: /^(valve_)?lift(?:_(.*))?$/,
  flow: /^(air_?)?flow(?:_(.*))?$/,
  depression: /^(test_)?(depression|pressure_drop|dp)(?:_(.*))?$/,
};

const UNIT_ALIASES: Record<Role, Record<string, string>> = {
  lift: { in: "in", inch: "in", inches: "in", mm: "mm" } satisfies Record<string, LengthUnit>,
  flow: { cfm: "cfm", ls: "L/s", l_s: "L/s", lps: "L/s", m3s: "m3/s", m3_s: "m3/s", m3h: "m3/h", m3_h: "m3/h" } satisfies Record<
    string,
    FlowUnit
  >,
  depression: {
    inh2o: "inH2O",
    in_h2o: "inH2O",
    inwc: "inH2O",
    in_wc: "inH2O",
    pa: "Pa",
    kpa: "kPa",
    hpa: "hPa",
    inhg: "inHg",
    in_hg: "inHg",
  } satisfies Record<string, PressureUnit>,
};

/** Header forms the import recognises, for the upload screen's help text. */
export const CSV_HEADER_EXAMPLES: Record<Role, string> = {
  lift: "lift_in or lift_mm",
  flow: "flow_cfm, flow_ls, flow_m3s or flow_m3h",
  depression: "depression_inh2o, depression_pa or depression_kpa",
};

type Detection = { picks: Partial<Record<Role, ColumnPick>>; errors: CsvError[] };

function detectColumns(headers: string[]): Detection {
  const picks: Partial<Record<Role, ColumnPick>> = {};
  const errors: CsvError[] = [];
  const reported = new Set<Role>();
  headers.forEach((header, index) => {
    const key = normalizeHeader(header);
    for (const role of Object.keys(ROLE_PREFIX) as Role[]) {
      const match = ROLE_PREFIX[role].exec(key);
      if (!match) continue;
      reported.add(role);
      const unitText = match[match.length - 1];
      const unit = unitText === undefined ? undefined : UNIT_ALIASES[role][unitText];
      if (!unit) {
        errors.push({
          row: 1,
          column: header,
          message: unitText
            ? `unknown unit "${unitText}" for ${role}; name the column ${CSV_HEADER_EXAMPLES[role]}, or map it`
            : `the ${role} column names no unit; name it ${CSV_HEADER_EXAMPLES[role]}, or map it`,
        });
      } else if (picks[role]) {
        errors.push({ row: 1, column: header, message: `two ${role} columns ("${picks[role]!.name}" and "${header}"); keep one or map it` });
      } else {
        picks[role] = { index, unit, name: header };
      }
      break;
    }
  });
  for (const role of ["lift", "flow"] as const) {
    if (!reported.has(role)) {
      errors.push({
        row: 1,
        message: `no ${role} column found in the header (${headers.map((h) => `"${h}"`).join(", ") || "empty"}); name it ${CSV_HEADER_EXAMPLES[role]}, or map the columns`,
      });
    }
  }
  return { picks, errors };
}

function mappedColumns(headers: string[] | null, mapping: ColumnMappingInput): Detection {
  const parsed = columnMappingSchema.safeParse(mapping);
  if (!parsed.success) {
    return { picks: {}, errors: parsed.error.issues.map((i) => ({ row: 0, column: i.path.join("."), message: `column mapping: ${i.message}` })) };
  }
  const picks: Partial<Record<Role, ColumnPick>> = {};
  const errors: CsvError[] = [];
  for (const role of ["lift", "flow", "depression"] as const) {
    const entry = parsed.data[role];
    if (!entry) continue;
    let index: number;
    if (typeof entry.column === "number") {
      index = entry.column;
      if (headers && index >= headers.length) {
        errors.push({ row: 1, message: `column #${index} mapped to ${role} does not exist (the file has ${headers.length} columns)` });
        continue;
      }
    } else if (!headers) {
      errors.push({ row: 0, column: entry.column, message: `the file has no header row, so map ${role} by column index` });
      continue;
    } else {
      const wanted = normalizeHeader(entry.column);
      index = headers.findIndex((h) => h === entry.column || normalizeHeader(h) === wanted);
      if (index < 0) {
        errors.push({ row: 1, column: entry.column, message: `no column "${entry.column}" in the header` });
        continue;
      }
    }
    picks[role] = { index, unit: entry.unit, name: headers ? headers[index] : `#${index}` };
  }
  const indices = Object.values(picks).map((p) => p!.index);
  if (new Set(indices).size !== indices.length) errors.push({ row: 0, message: "column mapping uses one column for two quantities" });
  return { picks, errors };
}

/** A strict decimal number; a decimal comma is accepted when the file is not comma-delimited. */
function parseNumber(text: string, delimiter: string): number | null {
  let cell = text.trim();
  if (delimiter !== "," && /^[+-]?\d+,\d+$/.test(cell)) cell = cell.replace(",", ".");
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell)) return null;
  const value = Number(cell);
  return Number.isFinite(value) ? value : null;
}

/**
 * Tab, then semicolon, then comma, judged on the first line that is neither blank nor a comment.
 * Explicit rather than papaparse's guess, which picks the comma in "2,5;33,0" (decimal commas).
 */
export function detectDelimiter(text: string): string {
  const first = text.split(/\r\n|\n|\r/).find((line) => line.trim() !== "" && !line.trim().startsWith("#")) ?? "";
  if (first.includes("\t")) return "\t";
  if (first.includes(";")) return ";";
  return ",";
}

const isBlank = (cells: string[]) => cells.every((c) => c.trim() === "");
const isComment = (cells: string[]) => (cells[0] ?? "").trim().startsWith("#");

/** Imports a flow-bench CSV. Pass `mapping` when the headers are not self-describing. */
export function parseFlowCsv(text: string, mapping?: ColumnMappingInput): CsvImport {
  const source = text.replace(/^\uFEFF/, "");
  const delimiter = detectDelimiter(source);
  const parsed = Papa.parse<string[]>(source, { header: false, skipEmptyLines: false, delimiter });
  const lines = parsed.data;

  // Line numbers follow the file: papaparse yields one array per line (quoted newlines aside).
  const content = lines.map((cells, i) => ({ cells, line: i + 1 })).filter(({ cells }) => !isBlank(cells) && !isComment(cells));
  const hasHeader = mapping ? mapping.hasHeader !== false : true;
  const headerLine = hasHeader ? content.shift() : undefined;
  const headers = headerLine ? headerLine.cells.map((h) => h.trim()) : null;
  if (hasHeader && !headers) return { ok: false, errors: [{ row: 1, message: "the file is empty" }], headers: [] };

  const detection = mapping ? mappedColumns(headers, mapping) : detectColumns(headers ?? []);
  const { picks } = detection;
  const errors = [...detection.errors];
  if (errors.length || !picks.lift || !picks.flow) return { ok: false, errors, headers: headers ?? [] };
  const lift = picks.lift;
  const flowPick = picks.flow;
  const depression = picks.depression;

  if (content.length === 0) errors.push({ row: (headerLine?.line ?? 0) + 1, message: "no data rows after the header" });
  if (content.length > MAX_POINTS) {
    errors.push({ row: content[MAX_POINTS].line, message: `more than ${MAX_POINTS} rows; a flow test has far fewer, so this is probably not a flow-test file` });
    return { ok: false, errors, headers: headers ?? [] };
  }

  const rows: CsvRow[] = [];
  const firstLineOfLift = new Map<number, number>();
  for (const { cells, line } of content) {
    const read = (pick: ColumnPick, what: string, rule: (v: number) => string | null): number | null => {
      const cell = cells[pick.index];
      if (cell === undefined || cell.trim() === "") {
        errors.push({ row: line, column: pick.name, message: `missing ${what}` });
        return null;
      }
      const value = parseNumber(cell, delimiter);
      if (value === null) {
        errors.push({ row: line, column: pick.name, message: `"${cell.trim()}" is not a number` });
        return null;
      }
      const problem = rule(value);
      if (problem) {
        errors.push({ row: line, column: pick.name, message: problem });
        return null;
      }
      return value;
    };
    const liftValue = read(lift, "lift", (v) => (v > 0 ? null : "lift must be greater than zero"));
    const flowValue = read(flowPick, "flow", (v) => (v >= 0 ? null : "flow cannot be negative"));
    const depressionValue = depression ? read(depression, "depression", (v) => (v > 0 ? null : "depression must be greater than zero")) : undefined;
    if (liftValue === null || flowValue === null || depressionValue === null) continue;
    const earlier = firstLineOfLift.get(liftValue);
    if (earlier !== undefined) {
      errors.push({ row: line, column: lift.name, message: `lift ${liftValue} already measured on line ${earlier}` });
      continue;
    }
    firstLineOfLift.set(liftValue, line);
    rows.push(depressionValue === undefined ? { line, lift: liftValue, flow: flowValue } : { line, lift: liftValue, flow: flowValue, depression: depressionValue });
  }
  if (errors.length) return { ok: false, errors, headers: headers ?? [] };

  const used = new Set([lift.index, flowPick.index, depression?.index]);
  return {
    ok: true,
    rows,
    units: {
      lift: lift.unit as LiftUnit,
      flow: flowPick.unit as FlowUnit,
      ...(depression ? { depression: depression.unit as PressureUnit } : {}),
    },
    columns: { lift: lift.name, flow: flowPick.name, ...(depression ? { depression: depression.name } : {}) },
    ignoredColumns: (headers ?? []).filter((_, i) => !used.has(i)),
    delimiter,
  };
}

/** Fields of a flow test that do not come from the CSV. */
export type FlowTestFields = Omit<FlowTestInput, "points" | "liftUnit" | "flowUnit">;

/**
 * Builds a flow-test input from an accepted import. Per-row depressions are converted to the
 * test's depression unit, since a test carries one unit for all its depressions.
 */
export function flowTestFromCsv(imported: Extract<CsvImport, { ok: true }>, fields: FlowTestFields): FlowTestInput {
  const depressionUnit = fields.depressionUnit ?? "inH2O";
  const rowUnit = imported.units.depression;
  return {
    ...fields,
    depressionUnit,
    liftUnit: imported.units.lift,
    flowUnit: imported.units.flow,
    points: imported.rows.map((row) =>
      row.depression === undefined || rowUnit === undefined
        ? { lift: row.lift, flow: row.flow }
        : { lift: row.lift, flow: row.flow, depression: pressure.convert(row.depression, rowUnit, depressionUnit) },
    ),
  };
}
