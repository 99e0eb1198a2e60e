/**
 * `portolan toolpath …`: analyse G-code programs (also for batch checks) and write sample programs.
 *
 *   toolpath analyze FILE [--machine M.json] [--plate P.json] [--block-delete]
 *                         [--preview-out FILE.bin] [--preview-max N] [--json]
 *   toolpath generate --lines N [--tools K] [--seed S] [--units mm|inch] [--port intake|exhaust] [--out FILE]
 *
 * Exit codes: 0 analysed and no violations; 1 input refused (unreadable, empty, binary, not
 * G-code, bad profile) or violations found; 2 usage error.
 */
import { createWriteStream } from "node:fs";
import { readFile, writeFile } from "node:fs/promises";
import { basename } from "node:path";
import { parseArgs } from "node:util";
import { analyzeToolpathFile, ToolpathInputError } from "../toolpath/analyze";
import { generatePortProgram } from "../toolpath/generate";
import { encodePreview } from "../toolpath/preview";
import { parseMachineProfile, parsePlateEnvelope } from "../toolpath/profile";
import { formatSummary } from "../toolpath/summary";
import type { AnalyzeOptions } from "../toolpath/types";
import type { CliIo } from "./io";

const USAGE = [
  "usage: portolan toolpath analyze FILE [--machine M.json] [--plate P.json] [--block-delete] [--preview-out F.bin] [--preview-max N] [--json]",
  "       portolan toolpath generate --lines N [--tools K] [--seed S] [--units mm|inch] [--port intake|exhaust] [--out FILE]",
].join("\n");

export async function run(args: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = args;
  if (command === "analyze") return analyze(rest, io);
  if (command === "generate") return generate(rest, io);
  io.err(USAGE);
  return 2;
}

async function analyze(args: string[], io: CliIo): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args,
      allowPositionals: true,
      options: {
        machine: { type: "string" },
        plate: { type: "string" },
        "block-delete": { type: "boolean", default: false },
        "preview-out": { type: "string" },
        "preview-max": { type: "string" },
        json: { type: "boolean", default: false },
      },
    });
  } catch (err) {
    io.err(`portolan toolpath analyze: ${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  const { values, positionals } = parsed;
  if (positionals.length !== 1) {
    io.err(USAGE);
    return 2;
  }
  const file = positionals[0];
  const json = values.json;
  const refuse = (problem: string, message: string): number => {
    if (json) io.out(JSON.stringify({ error: { problem, message } }));
    io.err(`portolan toolpath analyze: ${message}`);
    return 1;
  };

  const options: AnalyzeOptions = { blockDelete: values["block-delete"] };
  if (values["preview-max"] !== undefined) {
    const n = Number(values["preview-max"]);
    if (!Number.isInteger(n) || n < 16) {
      io.err("portolan toolpath analyze: --preview-max must be a whole number of at least 16");
      return 2;
    }
    options.previewMaxVertices = n;
  }
  try {
    if (values.machine) options.machine = parseMachineProfile(await readJson(values.machine));
    if (values.plate) options.plate = parsePlateEnvelope(await readJson(values.plate));
  } catch (err) {
    return refuse("bad-profile", (err as Error).message);
  }

  let analysis;
  try {
    analysis = await analyzeToolpathFile(file, options);
  } catch (err) {
    if (err instanceof ToolpathInputError) return refuse(err.problem, `${basename(file)}: ${err.message}`);
    throw err;
  }
  const { report, preview } = analysis;
  if (values["preview-out"]) await writeFile(values["preview-out"], encodePreview(preview));
  if (json) io.out(JSON.stringify(report, null, 2));
  else io.out(formatSummary(report, basename(file)));
  if (report.violations.length > 0) {
    io.err(`portolan toolpath analyze: ${report.violations.length} violation(s) in ${basename(file)}`);
    return 1;
  }
  return 0;
}

async function readJson(path: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(path, "utf8");
  } catch (err) {
    throw new Error(`cannot read ${path}: ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new Error(`${path} is not valid JSON`);
  }
}

async function generate(args: string[], io: CliIo): Promise<number> {
  let values;
  try {
    ({ values } = parseArgs({
      args,
      options: {
        lines: { type: "string" },
        tools: { type: "string", default: "3" },
        seed: { type: "string", default: "1" },
        units: { type: "string", default: "mm" },
        port: { type: "string", default: "intake" },
        out: { type: "string" },
      },
    }));
  } catch (err) {
    io.err(`portolan toolpath generate: ${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  const lines = Number(values.lines);
  const tools = Number(values.tools);
  const seed = Number(values.seed);
  if (!Number.isInteger(lines) || lines < 1 || !Number.isInteger(tools) || tools < 1 || tools > 9 || !Number.isInteger(seed)
    || (values.units !== "mm" && values.units !== "inch") || (values.port !== "intake" && values.port !== "exhaust")) {
    io.err(USAGE);
    return 2;
  }
  const chunks = generatePortProgram({ lines, tools, seed, units: values.units, port: values.port });
  if (!values.out) {
    for (const chunk of chunks) process.stdout.write(chunk);
    return 0;
  }
  const stream = createWriteStream(values.out);
  for (const chunk of chunks) {
    if (!stream.write(chunk)) await new Promise<void>((resolve) => stream.once("drain", () => resolve()));
  }
  await new Promise<void>((resolve, reject) => {
    stream.once("error", reject);
    stream.end(() => resolve());
  });
  io.err(`wrote ${values.out}`);
  return 0;
}
