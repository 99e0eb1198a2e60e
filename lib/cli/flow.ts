/**
 * `portolan flow <compute|compare|ratio|engine|demo>`: the flow-bench math from the shell.
 * Exit codes: 0 ok, 1 the input was refused (file, CSV or values), 2 usage error.
 */
import { readFile, stat } from "node:fs/promises";
import { parseArgs } from "node:util";
import type { CliIo } from "./io";
import {
  type ColumnMappingInput,
  type CsvError,
  type FlowIssue,
  type FlowTestFields,
  type FlowTestResult,
  ESTIMATE_CAUTION,
  compareFlowTests,
  computeEngineEstimates,
  demoFlowCurve,
  engineInputSchema,
  exhaustIntakeRatio,
  flowTestFromCsv,
  formatIssues,
  parseFlowCsv,
  tryComputeFlowTest,
} from "../flow";

/** Flow CSVs hold a few dozen rows; anything this big is the wrong file, refused before reading. */
const MAX_CSV_BYTES = 1024 * 1024;

const USAGE = `usage:
  portolan flow compute FILE.csv --valve-mm D --depression-inh2o P [test options] [--json]
  portolan flow compare BASELINE.csv CANDIDATE.csv --valve-mm D --depression-inh2o P
                        [--candidate-valve-mm D2] [--candidate-depression-inh2o P2] [test options] [--json]
  portolan flow ratio EXHAUST.csv INTAKE.csv --exhaust-valve-mm DE --intake-valve-mm DI --depression-inh2o P
                        [--exhaust-depression-inh2o PE] [test options] [--json]
  portolan flow engine --bore-mm B --stroke-mm S --rpm N [--cylinders C] [--intake-valve-mm D]
                        [--mean-cd CD] [--section-mm2 A] [--intake-cfm28 Q] [--inlet-temp-c T] [--json]
  portolan flow demo --valve-mm D [--kind stock|ported] [--port intake|exhaust] [--seed N]
test options:
  --valve-in D | --depression-pa P | --seat-mm S | --section-mm2 A | --standard iso2533|fan075
  --temp-c T | --temp-f T, --baro-kpa B | --baro-inhg B, --rh R (percent; dry if left out)
  --lift-column C --lift-unit mm|in --flow-column C --flow-unit cfm|L/s|m3/s|m3/h
  [--depression-column C --depression-unit inH2O|Pa|kPa] [--no-header]  (C: header name or 0-based index)`;

class UsageError extends Error {}
class RefusedError extends Error {
  constructor(
    message: string,
    readonly details: unknown,
  ) {
    super(message);
  }
}

const str = { type: "string" } as const;
const TEST_OPTIONS = {
  json: { type: "boolean" },
  "valve-mm": str,
  "valve-in": str,
  "depression-inh2o": str,
  "depression-pa": str,
  "seat-mm": str,
  "section-mm2": str,
  standard: str,
  "temp-c": str,
  "temp-f": str,
  "baro-kpa": str,
  "baro-inhg": str,
  rh: str,
  "lift-column": str,
  "lift-unit": str,
  "flow-column": str,
  "flow-unit": str,
  "depression-column": str,
  "depression-unit": str,
  "no-header": { type: "boolean" },
} as const;

type Values = Record<string, string | boolean | undefined>;

function parse(args: string[], options: Record<string, { type: "string" | "boolean" }>) {
  try {
    return parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (err) {
    throw new UsageError(err instanceof Error ? err.message : String(err));
  }
}

function num(values: Values, name: string): number | undefined {
  const raw = values[name];
  if (raw === undefined || typeof raw === "boolean") return undefined;
  const value = Number(raw);
  if (raw.trim() === "" || !Number.isFinite(value)) throw new UsageError(`--${name} needs a number, got "${raw}"`);
  return value;
}

function oneOf(values: Values, a: string, b: string): [number, string] | undefined {
  const first = num(values, a);
  const second = num(values, b);
  if (first !== undefined && second !== undefined) throw new UsageError(`give --${a} or --${b}, not both`);
  if (first !== undefined) return [first, a];
  if (second !== undefined) return [second, b];
  return undefined;
}

function columnRef(raw: string): string | number {
  return /^\d+$/.test(raw) ? Number(raw) : raw;
}

/** The column mapping, when the user gave one on the command line. */
function mappingFrom(values: Values): ColumnMappingInput | undefined {
  const liftColumn = values["lift-column"] as string | undefined;
  const flowColumn = values["flow-column"] as string | undefined;
  if (liftColumn === undefined && flowColumn === undefined && !values["no-header"]) return undefined;
  if (liftColumn === undefined || flowColumn === undefined || !values["lift-unit"] || !values["flow-unit"]) {
    throw new UsageError("a column mapping needs --lift-column, --lift-unit, --flow-column and --flow-unit");
  }
  const depressionColumn = values["depression-column"] as string | undefined;
  return {
    lift: { column: columnRef(liftColumn), unit: values["lift-unit"] as "mm" },
    flow: { column: columnRef(flowColumn), unit: values["flow-unit"] as "cfm" },
    ...(depressionColumn !== undefined
      ? { depression: { column: columnRef(depressionColumn), unit: (values["depression-unit"] ?? "inH2O") as "inH2O" } }
      : {}),
    hasHeader: !values["no-header"],
  };
}

type FlagPair = readonly [string, string];
const VALVE_FLAGS: FlagPair = ["valve-mm", "valve-in"];
const DEPRESSION_FLAGS: FlagPair = ["depression-inh2o", "depression-pa"];

/** Test-wide fields from flags; compare and ratio pass their own valve and depression flag names. */
function testFields(values: Values, valveFlags = VALVE_FLAGS, depressionFlags = DEPRESSION_FLAGS): FlowTestFields {
  const valve = oneOf(values, ...valveFlags);
  if (!valve) throw new UsageError(`--${valveFlags[0]} (or --${valveFlags[1]}) is required`);
  const depression = oneOf(values, ...depressionFlags);
  if (!depression) throw new UsageError(`--${depressionFlags[0]} (or --${depressionFlags[1]}) is required`);
  const temperature = oneOf(values, "temp-c", "temp-f");
  const baro = oneOf(values, "baro-kpa", "baro-inhg");
  const rh = num(values, "rh");
  if ((temperature === undefined) !== (baro === undefined)) {
    throw new UsageError("ambient air needs both a temperature (--temp-c/--temp-f) and a barometric pressure (--baro-kpa/--baro-inhg)");
  }
  if (rh !== undefined && temperature === undefined) throw new UsageError("--rh needs --temp-c and --baro-kpa too");
  const fields: FlowTestFields = {
    valveDiameter: valve[0],
    lengthUnit: valve[1].endsWith("-in") ? "in" : "mm",
    depression: depression[0],
    depressionUnit: depression[1].endsWith("-pa") ? "Pa" : "inH2O",
  };
  const seat = num(values, "seat-mm");
  if (seat !== undefined) fields.seatDiameter = fields.lengthUnit === "in" ? seat / 25.4 : seat;
  const section = num(values, "section-mm2");
  if (section !== undefined) Object.assign(fields, { minSectionArea: section, areaUnit: "mm2" });
  if (values.standard !== undefined) fields.standardAir = values.standard as "iso2533";
  if (temperature && baro) {
    fields.ambient = {
      temperature: temperature[0],
      temperatureUnit: temperature[1] === "temp-f" ? "F" : "C",
      pressure: baro[0],
      pressureUnit: baro[1] === "baro-inhg" ? "inHg" : "kPa",
      ...(rh !== undefined ? { relativeHumidityPercent: rh } : {}),
    };
  }
  return fields;
}

async function readCsv(file: string): Promise<string> {
  let size: number;
  try {
    size = (await stat(file)).size;
  } catch {
    throw new RefusedError(`cannot read ${file}`, [{ row: 0, message: `cannot read ${file}` }]);
  }
  if (size > MAX_CSV_BYTES) {
    throw new RefusedError(`${file} is ${size} bytes; a flow-test CSV is far smaller (limit ${MAX_CSV_BYTES})`, [
      { row: 0, message: "file too large for a flow test" },
    ]);
  }
  return readFile(file, "utf8");
}

type LoadedTest = { file: string; columns: Record<string, string>; ignoredColumns: string[]; result: FlowTestResult };

async function loadTest(file: string, fields: FlowTestFields, mapping: ColumnMappingInput | undefined): Promise<LoadedTest> {
  const imported = parseFlowCsv(await readCsv(file), mapping);
  if (!imported.ok) {
    throw new RefusedError(`${file}: ${imported.errors.length} problem(s)\n${imported.errors.map(formatCsvError).join("\n")}`, imported.errors);
  }
  const computed = tryComputeFlowTest(flowTestFromCsv(imported, fields));
  if (!computed.ok) {
    throw new RefusedError(`${file}: ${computed.issues.map(formatIssue).join("; ")}`, computed.issues);
  }
  return { file, columns: imported.columns, ignoredColumns: imported.ignoredColumns, result: computed.result };
}

const formatCsvError = (e: CsvError) => `  line ${e.row}${e.column ? `, column "${e.column}"` : ""}: ${e.message}`;
const formatIssue = (i: FlowIssue) => (i.path ? `${i.path}: ${i.message}` : i.message);
const fixed = (value: number | null, digits: number) => (value === null ? "—" : value.toFixed(digits));

function printTestTable(result: FlowTestResult, io: CliIo) {
  const header = "lift mm  lift in    L/D     cfm  cfm@28  Cd curt  Cd valve";
  const lines = result.points.map((p) =>
    [
      p.liftMm.toFixed(2).padStart(7),
      p.liftIn.toFixed(3).padStart(8),
      p.ld.toFixed(3).padStart(6),
      p.flowCfm.toFixed(1).padStart(7),
      p.flowCfmAt28.toFixed(1).padStart(7),
      p.cdCurtain.toFixed(3).padStart(8),
      p.cdValve.toFixed(3).padStart(9),
    ].join(" "),
  );
  const s = result.summary;
  io.out(
    [
      header,
      ...lines,
      "",
      `air density ${result.densityKgM3.toFixed(5)} kg/m³ (${result.densitySource === "ambient" ? result.conventions.densityLaw : result.standardAir.label})`,
      `corrected to 28 inH₂O and ${result.standardAir.label}; pressures in ${result.conventions.inchOfWater}`,
      `peak ${s.peakFlowCfmAt28.toFixed(1)} cfm@28 at ${s.peakFlowLiftMm.toFixed(2)} mm; mean Cd on valve area ${s.meanCdValve.toFixed(3)}; at L/D 0.25 ${fixed(s.flowCfmAt28AtLd025, 1)} cfm@28`,
      ...result.warnings.map((w) => `warning: ${w}`),
      ...result.notes.map((n) => `note: ${n}`),
    ].join("\n"),
  );
}

async function compute(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parse(args, TEST_OPTIONS);
  if (positionals.length !== 1) throw new UsageError("flow compute takes one CSV file");
  const test = await loadTest(positionals[0], testFields(values), mappingFrom(values));
  if (values.json) {
    io.out(JSON.stringify({ ok: true, file: test.file, columns: test.columns, ignoredColumns: test.ignoredColumns, ...test.result }));
  } else {
    printTestTable(test.result, io);
  }
  return 0;
}

const COMPARE_OPTIONS = { ...TEST_OPTIONS, "candidate-valve-mm": str, "candidate-valve-in": str, "candidate-depression-inh2o": str, "candidate-depression-pa": str } as const;

async function compare(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parse(args, COMPARE_OPTIONS);
  if (positionals.length !== 2) throw new UsageError("flow compare takes BASELINE.csv and CANDIDATE.csv");
  const mapping = mappingFrom(values);
  const baseFields = testFields(values);
  const candidateValveGiven = oneOf(values, "candidate-valve-mm", "candidate-valve-in") !== undefined;
  const candidateDepressionGiven = oneOf(values, "candidate-depression-inh2o", "candidate-depression-pa") !== undefined;
  const candidateFields = testFields(
    values,
    candidateValveGiven ? ["candidate-valve-mm", "candidate-valve-in"] : VALVE_FLAGS,
    candidateDepressionGiven ? ["candidate-depression-inh2o", "candidate-depression-pa"] : DEPRESSION_FLAGS,
  );
  // A seat diameter given for the baseline valve says nothing about another valve.
  if (candidateValveGiven) delete candidateFields.seatDiameter;
  const baseline = await loadTest(positionals[0], baseFields, mapping);
  const candidate = await loadTest(positionals[1], candidateFields, mapping);
  const comparison = compareFlowTests(baseline.result, candidate.result);
  if (values.json) {
    io.out(JSON.stringify({ ok: true, baseline: baseline.file, candidate: candidate.file, ...comparison, caution: ESTIMATE_CAUTION }));
    return 0;
  }
  io.out(
    [
      "lift mm  base cfm@28  cand cfm@28   gain %",
      ...comparison.rows.map((r) => `${r.liftMm.toFixed(2).padStart(7)} ${r.baselineCfmAt28.toFixed(1).padStart(12)} ${r.candidateCfmAt28.toFixed(1).padStart(12)} ${fixed(r.gainPercent, 1).padStart(8)}`),
      "",
      `mean gain ${fixed(comparison.meanGainPercent, 1)} %; peak flow gain ${fixed(comparison.peakFlowGainPercent, 1)} %`,
      `note: ${ESTIMATE_CAUTION}`,
    ].join("\n"),
  );
  return 0;
}

const RATIO_OPTIONS = {
  ...TEST_OPTIONS,
  "exhaust-valve-mm": str,
  "exhaust-valve-in": str,
  "intake-valve-mm": str,
  "intake-valve-in": str,
  "exhaust-depression-inh2o": str,
  "exhaust-depression-pa": str,
} as const;

async function ratio(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parse(args, RATIO_OPTIONS);
  if (positionals.length !== 2) throw new UsageError("flow ratio takes EXHAUST.csv and INTAKE.csv");
  const mapping = mappingFrom(values);
  const exhaustDepressionGiven = oneOf(values, "exhaust-depression-inh2o", "exhaust-depression-pa") !== undefined;
  const intakeFields = testFields(values, ["intake-valve-mm", "intake-valve-in"]);
  const exhaustFields = testFields(
    values,
    ["exhaust-valve-mm", "exhaust-valve-in"],
    exhaustDepressionGiven ? ["exhaust-depression-inh2o", "exhaust-depression-pa"] : DEPRESSION_FLAGS,
  );
  // The ratio uses corrected flows only; a seat or section belongs to one port, so neither is applied.
  for (const fields of [intakeFields, exhaustFields]) {
    delete fields.seatDiameter;
    delete fields.minSectionArea;
  }
  const exhaust = await loadTest(positionals[0], exhaustFields, mapping);
  const intake = await loadTest(positionals[1], intakeFields, mapping);
  const result = exhaustIntakeRatio(exhaust.result, intake.result);
  if (values.json) {
    io.out(JSON.stringify({ ok: true, exhaust: exhaust.file, intake: intake.file, ...result }));
    return 0;
  }
  io.out(
    [
      "lift mm  intake cfm@28  exhaust cfm@28  ratio",
      ...result.rows.map((r) => `${r.liftMm.toFixed(2).padStart(7)} ${r.intakeCfmAt28.toFixed(1).padStart(14)} ${r.exhaustCfmAt28.toFixed(1).padStart(15)} ${fixed(r.ratio, 3).padStart(6)}`),
      "",
      `mean ratio ${fixed(result.meanRatio, 3)}; ${result.guideline.label}`,
    ].join("\n"),
  );
  return 0;
}

const ENGINE_OPTIONS = {
  json: { type: "boolean" },
  "bore-mm": str,
  "stroke-mm": str,
  rpm: str,
  cylinders: str,
  "intake-valve-mm": str,
  "mean-cd": str,
  "section-mm2": str,
  "intake-cfm28": str,
  "inlet-temp-c": str,
} as const;

async function engine(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parse(args, ENGINE_OPTIONS);
  if (positionals.length) throw new UsageError("flow engine takes no file");
  for (const required of ["bore-mm", "stroke-mm", "rpm"]) {
    if (values[required as keyof typeof values] === undefined) throw new UsageError(`--${required} is required`);
  }
  const input = {
    bore: num(values, "bore-mm"),
    stroke: num(values, "stroke-mm"),
    lengthUnit: "mm",
    rpm: num(values, "rpm"),
    cylinders: num(values, "cylinders"),
    intakeValveDiameter: num(values, "intake-valve-mm"),
    meanFlowCoefficient: num(values, "mean-cd"),
    sectionArea: num(values, "section-mm2"),
    areaUnit: "mm2",
    intakeCfmAt28: num(values, "intake-cfm28"),
    inletTemperatureC: num(values, "inlet-temp-c"),
  };
  const parsed = engineInputSchema.safeParse(input);
  if (!parsed.success) throw new RefusedError(formatIssues(parsed.error).map(formatIssue).join("; "), formatIssues(parsed.error));
  const estimates = computeEngineEstimates(parsed.data);
  if (values.json) {
    io.out(JSON.stringify({ ok: true, ...estimates }));
    return 0;
  }
  const e = estimates;
  io.out(
    [
      `mean piston speed ${e.meanPistonSpeedMs.toFixed(2)} m/s (${e.meanPistonSpeedFtMin.toFixed(0)} ft/min)`,
      `port mean velocity ${fixed(e.portMeanVelocityMs, 1)} m/s; ${e.labels.portVelocityRule}: ${fixed(e.portVelocityRuleFtS, 0)} ft/s`,
      `inlet Mach index ${fixed(e.machIndex, 3)} (threshold ${e.machIndexThreshold}; reached at ${fixed(e.rpmAtMachThreshold, 0)} rpm)`,
      `${e.labels.power}: ${fixed(e.powerEstimateHp, 0)} hp`,
      `note: ${e.labels.caution}`,
    ].join("\n"),
  );
  return 0;
}

async function demo(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parse(args, { "valve-mm": str, kind: str, port: str, seed: str });
  if (positionals.length) throw new UsageError("flow demo takes no file");
  const valveMm = num(values, "valve-mm");
  if (valveMm === undefined || valveMm <= 0) throw new UsageError("--valve-mm is required and must be positive");
  const kind = (values.kind ?? "stock") as string;
  const port = (values.port ?? "intake") as string;
  if (kind !== "stock" && kind !== "ported") throw new UsageError("--kind is stock or ported");
  if (port !== "intake" && port !== "exhaust") throw new UsageError("--port is intake or exhaust");
  const points = demoFlowCurve({ valveMm, kind, port, seed: num(values, "seed") });
  io.out(["# invented demo curve at 28 inH2O, not a measurement", "lift_mm,flow_cfm", ...points.map((p) => `${p.liftMm.toFixed(3)},${p.flowCfm.toFixed(1)}`)].join("\n"));
  return 0;
}

const commands: Record<string, (args: string[], io: CliIo) => Promise<number>> = { compute, compare, ratio, engine, demo };

export async function run(args: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = args;
  const command = name ? commands[name] : undefined;
  if (!command) {
    io.err(USAGE);
    return 2;
  }
  const json = rest.includes("--json");
  try {
    return await command(rest, io);
  } catch (err) {
    if (err instanceof UsageError) {
      io.err(`portolan flow ${name}: ${err.message}\n${USAGE}`);
      return 2;
    }
    if (err instanceof RefusedError) {
      if (json) io.out(JSON.stringify({ ok: false, errors: err.details }));
      io.err(`portolan flow ${name}: ${err.message}`);
      return 1;
    }
    throw err;
  }
}
