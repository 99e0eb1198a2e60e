import { parseArgs } from "node:util";
import { writeFile } from "node:fs/promises";
import type { CliIo } from "./io";
import {
  analyzePort,
  buildPreviewCloud,
  compareScans,
  encodePreviewCloud,
  GeometryInputError,
  intakePortShape,
  sampleTubeCloud,
  tubeMesh,
  writePly,
  writeStlAscii,
  writeStlBinary,
  writeXyz,
  type PortKind,
  type PortReport,
  type ReadFormat,
  type Vec3,
} from "../geometry/index";
import { readPointCloudFile, writeChunksToFile } from "../geometry/fileio";

/**
 * `portolan cloud …`: digitized port geometry from the command line.
 *   analyze FILE   section profile, minimum section, volume
 *   compare A B    per-station area change and point deviation of B against A
 *   preview FILE OUT   decimated preview blob for the 3D viewer
 *   generate OUT   an invented sample port (demo data, tests)
 * Exit codes: 0 ok, 1 input refused (with a one-line reason), 2 usage.
 */
const USAGE = [
  "usage: portolan cloud analyze FILE [--valve-mm D] [--step-mm S] [--units mm|in] [--format ply|stl|xyz|csv]",
  "                                   [--entry X,Y,Z] [--exit X,Y,Z] [--port intake|exhaust] [--outlines] [--json]",
  "       portolan cloud compare A B [--valve-mm D] [--step-mm S] [--units mm|in] [--json]",
  "       portolan cloud preview FILE OUT [--max-points N] [--units mm|in] [--json]",
  "       portolan cloud generate OUT [--points N] [--seed S] [--fin] [--valve-mm D]",
  "                                   [--as ply|ply-ascii|ply-be|stl|stl-ascii|xyz|csv] [--json]",
].join("\n");

class UsageError extends Error {}

const common = {
  "valve-mm": { type: "string" },
  "step-mm": { type: "string" },
  units: { type: "string" },
  format: { type: "string" },
  json: { type: "boolean", default: false },
} as const;

function num(v: string | undefined, name: string): number | undefined {
  if (v === undefined) return undefined;
  const n = Number(v);
  if (!Number.isFinite(n)) throw new UsageError(`--${name} needs a number, got "${v}"`);
  return n;
}

function point(v: string | undefined, name: string): Vec3 | undefined {
  if (v === undefined) return undefined;
  const parts = v.split(",").map(Number);
  if (parts.length !== 3 || !parts.every(Number.isFinite)) throw new UsageError(`--${name} needs X,Y,Z in mm, got "${v}"`);
  return parts as Vec3;
}

function units(v: string | undefined): "mm" | "in" | undefined {
  if (v === undefined || v === "mm" || v === "in") return v;
  throw new UsageError(`--units must be mm or in, got "${v}"`);
}

function format(v: string | undefined): ReadFormat | undefined {
  if (v === undefined || v === "ply" || v === "stl" || v === "xyz" || v === "csv") return v;
  throw new UsageError(`--format must be ply, stl, xyz or csv, got "${v}"`);
}

const f = (x: number | null | undefined, d = 2) => (x === null || x === undefined ? "–" : x.toFixed(d));

function withoutOutlines(r: PortReport): unknown {
  return { ...r, sections: r.sections.map(({ outline: _o, ...rest }) => rest) };
}

function printReport(r: PortReport, io: CliIo): void {
  io.out(`points ${r.points}, centerline ${f(r.centerline.lengthMm, 1)} mm, ${r.sections.length} sections every ${r.stepMm} mm`);
  io.out("station mm   area mm²   perim mm   eq. dia mm   hyd. dia mm   coverage");
  for (const s of r.sections) {
    io.out(
      `${f(s.stationMm, 1).padStart(10)} ${f(s.areaMm2, 1).padStart(10)} ${f(s.perimeterMm, 1).padStart(10)} ${f(s.equivalentDiameterMm).padStart(12)} ${f(s.hydraulicDiameterMm).padStart(13)} ${(Math.round(s.coverage * 100) + " %").padStart(10)}${s.complete ? "" : "  (gaps)"}`,
    );
  }
  const m = r.minSection;
  if (m) {
    io.out(`smallest section: ${f(m.areaMm2, 1)} mm² at ${f(m.stationMm, 1)} mm, equivalent diameter ${f(m.equivalentDiameterMm)} mm` + (m.percentOfValve !== null ? `, ${f(m.percentOfValve, 1)} % of the valve` : ""));
    io.out(`guideline (${r.guideline.basis})` + (r.guideline.verdict ? `: ${r.guideline.verdict}` : ""));
  }
  io.out(`volume from sections: ${f(r.volumeCc)} cc` + (r.mesh ? `; mesh ${r.mesh.closed ? `closed, ${f(r.mesh.volumeCc)} cc` : "open"}` : ""));
  for (const w of r.warnings) io.out(`warning: ${w.message}`);
  io.out("Figures are estimates from the scan: the flow bench and inspection decide; mind wall thickness near water jackets.");
}

async function analyze(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { ...common, entry: { type: "string" }, exit: { type: "string" }, port: { type: "string" }, outlines: { type: "boolean", default: false } },
  });
  if (positionals.length !== 1) throw new UsageError("analyze needs exactly one FILE");
  const port = values.port;
  if (port !== undefined && port !== "intake" && port !== "exhaust") throw new UsageError(`--port must be intake or exhaust`);
  const portKind: PortKind | undefined = port;
  const opts = { units: units(values.units), format: format(values.format) };
  const analyzeOptions = {
    stepMm: num(values["step-mm"], "step-mm"),
    valveDiameterMm: num(values["valve-mm"], "valve-mm"),
    entry: point(values.entry, "entry"),
    exit: point(values.exit, "exit"),
    portKind,
  };
  const cloud = await readPointCloudFile(positionals[0], opts);
  const { report } = analyzePort(cloud, { ...analyzeOptions, pointStations: false });
  if (values.json) io.out(JSON.stringify(values.outlines ? report : withoutOutlines(report)));
  else printReport(report, io);
  return 0;
}

async function compare(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: common });
  if (positionals.length !== 2) throw new UsageError("compare needs two files, A (reference) and B");
  const opts = { units: units(values.units), format: format(values.format) };
  const compareOptions = { stepMm: num(values["step-mm"], "step-mm"), valveDiameterMm: num(values["valve-mm"], "valve-mm") };
  const a = await readPointCloudFile(positionals[0], opts);
  const b = await readPointCloudFile(positionals[1], opts);
  const c = compareScans(a, b, compareOptions);
  if (values.json) {
    io.out(JSON.stringify(c));
    return 0;
  }
  io.out(`A ${c.a.points} points, ${f(c.a.volumeCc)} cc; B ${c.b.points} points, ${f(c.b.volumeCc)} cc; B − A ${f(c.volumeDifferenceCc)} cc`);
  io.out("station mm   A mm²   B mm²   B − A mm²   %");
  for (const s of c.stations) io.out(`${f(s.stationMm, 1).padStart(10)} ${f(s.areaAMm2, 1).padStart(7)} ${f(s.areaBMm2, 1).padStart(7)} ${f(s.differenceMm2, 1).padStart(11)} ${f(s.differencePercent, 1).padStart(5)}`);
  const d = c.deviation;
  io.out(`B to nearest A point (${d.queriedPoints} points): max ${f(d.maxMm, 3)} mm, mean ${f(d.meanMm, 3)} mm, 95 % ${f(d.p95Mm, 3)} mm`);
  for (const w of c.warnings) io.out(`warning: ${w.message}`);
  return 0;
}

async function preview(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { ...common, "max-points": { type: "string" } } });
  if (positionals.length !== 2) throw new UsageError("preview needs FILE and OUT");
  const readOptions = { units: units(values.units), format: format(values.format) };
  const stepMm = num(values["step-mm"], "step-mm");
  const maxPoints = num(values["max-points"], "max-points");
  const cloud = await readPointCloudFile(positionals[0], readOptions);
  const { pointStation } = analyzePort(cloud, { stepMm });
  const p = buildPreviewCloud(cloud, pointStation, { maxPoints });
  const blob = encodePreviewCloud(p);
  await writeFile(positionals[1], blob);
  const out = { out: positionals[1], bytes: blob.length, points: p.count, sourcePoints: p.sourceCount, voxelMm: p.voxelMm, stationCount: p.stationCount };
  io.out(values.json ? JSON.stringify(out) : `wrote ${out.out}: ${out.points} of ${out.sourcePoints} points, voxel ${f(out.voxelMm, 3)} mm, ${out.bytes} bytes`);
  return 0;
}

async function generate(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { points: { type: "string" }, seed: { type: "string" }, fin: { type: "boolean", default: false }, "valve-mm": { type: "string" }, as: { type: "string" }, json: { type: "boolean", default: false } },
  });
  if (positionals.length !== 1) throw new UsageError("generate needs OUT");
  const as = values.as ?? "ply";
  const points = num(values.points, "points") ?? 200_000;
  if (!(points >= 100 && points <= 20_000_000 && Number.isInteger(points))) throw new UsageError("--points must be a whole number from 100 to 20 000 000");
  const shape = intakePortShape({ fin: values.fin, valveDiameterMm: num(values["valve-mm"], "valve-mm") });
  const seed = num(values.seed, "seed") ?? 1;
  let chunks: Iterable<Uint8Array>;
  if (as === "stl" || as === "stl-ascii") {
    const mesh = tubeMesh(shape, 1, 96);
    chunks = as === "stl" ? writeStlBinary(mesh) : writeStlAscii(mesh);
  } else {
    const cloud = sampleTubeCloud(shape, { points, seed });
    if (as === "ply") chunks = writePly(cloud, "binary_little_endian");
    else if (as === "ply-be") chunks = writePly(cloud, "binary_big_endian");
    else if (as === "ply-ascii") chunks = writePly(cloud, "ascii");
    else if (as === "xyz") chunks = writeXyz(cloud);
    else if (as === "csv") chunks = writeXyz(cloud, { separator: ",", header: true });
    else throw new UsageError(`--as must be ply, ply-ascii, ply-be, stl, stl-ascii, xyz or csv`);
  }
  const bytes = await writeChunksToFile(positionals[0], chunks);
  const out = { out: positionals[0], as, bytes, throatStationMm: shape.throatStationMm, lengthMm: shape.length };
  io.out(values.json ? JSON.stringify(out) : `wrote ${out.out} (${as}, ${bytes} bytes): invented intake port, ${f(shape.length, 1)} mm long`);
  return 0;
}

export async function run(args: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = args;
  const commands: Record<string, (a: string[], io: CliIo) => Promise<number>> = { analyze, compare, preview, generate };
  const cmd = command ? commands[command] : undefined;
  if (!cmd) {
    io.err(USAGE);
    return 2;
  }
  try {
    return await cmd(rest, io);
  } catch (err) {
    if (err instanceof UsageError || (err instanceof Error && "code" in err && String((err as { code: unknown }).code).startsWith("ERR_PARSE_ARGS"))) {
      io.err(`portolan cloud ${command}: ${err.message}`);
      io.err(USAGE);
      return 2;
    }
    if (err instanceof GeometryInputError) {
      io.err(`portolan cloud ${command}: ${err.message}`);
      return 1;
    }
    const e = err as NodeJS.ErrnoException;
    if (e && (e.code === "ENOENT" || e.code === "EISDIR" || e.code === "EACCES")) {
      io.err(`portolan cloud ${command}: cannot read ${e.path ?? "the file"} (${e.code})`);
      return 1;
    }
    throw err;
  }
}
