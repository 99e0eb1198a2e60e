/**
 * `portolan program …`: the program library from the command line.
 *   list [--json]                              programs with their released and latest revisions
 *   compare --a <revisionId> --b <revisionId> [--json]   analysis differences (B − A)
 *   analyse --analysis-id <id> [--json]        run one queued analysis now, in this process
 *   fetch --job N --port intake|exhaust --out FILE [--url U] [--token T] [--json]
 *                                              download a job's program with a machine token (program-fetch.ts)
 * Exit codes: 0 ok, 1 refused (unknown revision, analysis failed), 2 usage.
 */
import { parseArgs } from "node:util";
import { db } from "@/db/client";
import { listPrograms, revisionAnalyses } from "@/db/queries/programs";
import { runAnalysis } from "../analysis/runner";
import { storage } from "../storage";
import { compareRevisions, type PortReportLike, type ToolpathReportLike } from "../programs/compare";
import type { CliIo } from "./io";

const USAGE =
  "usage: portolan program list [--json] | compare --a <revisionId> --b <revisionId> [--json] | analyse --analysis-id <id> [--json] | fetch --job N --port intake|exhaust --out FILE [--url U] [--token T] [--json]";

export async function run(args: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = args;
  // The cell computer's download (machine token, checksum-verified): lib/cli/program-fetch.ts.
  if (command === "fetch") return (await import("./program-fetch")).runFetch(rest, io);
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({ args: rest, options: { a: { type: "string" }, b: { type: "string" }, "analysis-id": { type: "string" }, json: { type: "boolean", default: false } } }));
  } catch (err) {
    io.err(`${(err as Error).message}\n${USAGE}`);
    return 2;
  }
  if (command === "list") {
    const page = listPrograms(db(), { page: 1, pageSize: 200, dir: "asc", sort: "castingNumber" });
    if (values.json) io.out(JSON.stringify(page.rows));
    else for (const p of page.rows) io.out(`${p.castingNumber}\t${p.port}\t${p.name}\treleased ${p.releasedLetter ?? "none"}\tlatest ${p.latestLetter ?? "-"} (${p.latestState ?? "-"})`);
    return 0;
  }
  if (command === "compare") {
    const a = revisionAnalyses(db(), Number(values.a));
    const b = revisionAnalyses(db(), Number(values.b));
    if (!values.a || !values.b) {
      io.err(USAGE);
      return 2;
    }
    if (!a || !b) {
      io.err("no such revision");
      return 1;
    }
    const cmp = compareRevisions({ toolpaths: a.toolpaths as ToolpathReportLike[], scan: a.scan as PortReportLike | null }, { toolpaths: b.toolpaths as ToolpathReportLike[], scan: b.scan as PortReportLike | null });
    if (values.json) io.out(JSON.stringify(cmp));
    else {
      const s = (d: { a: number | null; b: number | null; diff: number | null }) => `${d.a?.toFixed(1) ?? "-"} → ${d.b?.toFixed(1) ?? "-"} (${d.diff === null ? "-" : (d.diff >= 0 ? "+" : "") + d.diff.toFixed(1)})`;
      io.out(`cycle time s   ${s(cmp.cycleTimeS)}`);
      io.out(`cutting mm     ${s(cmp.feedLengthMm)}`);
      io.out(`tool changes   ${s(cmp.toolChanges)}`);
      for (const t of cmp.tools) io.out(`T${t.number}: ${t.change}`);
      if (cmp.profile) io.out(`smallest section mm² ${s(cmp.profile.minAreaMm2)}; volume cc ${s(cmp.profile.volumeCc)}`);
    }
    return 0;
  }
  if (command === "analyse") {
    const id = Number(values["analysis-id"]);
    if (!Number.isInteger(id) || id <= 0) {
      io.err(USAGE);
      return 2;
    }
    const outcome = await runAnalysis(db(), storage(), id);
    if (values.json) io.out(JSON.stringify(outcome));
    else io.out(outcome.state === "done" ? `analysis ${id} done` : `analysis ${id} failed: ${outcome.error}`);
    return outcome.state === "done" ? 0 : 1;
  }
  io.err(USAGE);
  return 2;
}
