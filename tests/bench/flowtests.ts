/**
 * Flow-test records benchmark: the list page (a page of rows, each recomputed from its lift
 * table by the flow math) and the flow-sheet PDF, on a database of many invented tests.
 * Run with `npx tsx tests/bench/flowtests.ts` (exports `run()` for the bench dispatcher).
 * Inputs are generated in a temporary SQLite file that is removed afterwards.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { openDatabase } from "../../db/client";
import { migrateDatabase } from "../../db/migrate";
import { flowPoints, flowTests, headTypes, users } from "../../db/schema";
import { demoFlowCurve } from "../../lib/flow";
import { flowSheetPdf } from "../../lib/flowtests/pdf";
import { flowTestView, listFlowTestsWithFigures } from "../../lib/flowtests/read";
import { flowTestListQuerySchema } from "../../lib/flowtests/query";

const TESTS = 20_000;
const REPEATS = 7;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
function time(fn: () => void): number {
  const samples: number[] = [];
  for (let i = 0; i < REPEATS; i++) {
    const t0 = performance.now();
    fn();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

export async function run(): Promise<void> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "portolan-bench-flow-"));
  try {
    const db = openDatabase(path.join(dir, "bench.db"));
    migrateDatabase(db);
    const operatorId = db.insert(users).values({ email: "bench@t.invalid", name: "Bench", role: "porter" }).returning().get().id;
    const headTypeId = db
      .insert(headTypes)
      .values({ castingNumber: "BENCH-1", engineFamily: "Invented", cylinders: 8, valvesPerCylinder: 2, boreMm: 101.6, strokeMm: 88.4, intakeValveMm: 51.31, exhaustValveMm: 40.64 })
      .returning()
      .get().id;
    const t0 = performance.now();
    db.transaction((tx) => {
      for (let i = 0; i < TESTS; i++) {
        const port = i % 2 ? "exhaust" : "intake";
        const valve = port === "intake" ? 51.31 : 40.64;
        const id = tx
          .insert(flowTests)
          .values({ subject: "baseline", headTypeId, port, depressionInH2O: 28, tempC: 20, baroKpa: 101, valveDiameterMm: valve, operatorId, testedOn: `2025-${String((i % 12) + 1).padStart(2, "0")}-10`, notes: `bench ${i}` })
          .returning({ id: flowTests.id })
          .get().id;
        const pts = demoFlowCurve({ valveMm: valve, kind: i % 3 ? "ported" : "stock", port, seed: i });
        tx.insert(flowPoints).values(pts.map((p) => ({ flowTestId: id, liftMm: p.liftMm, flowCfm: p.flowCfm }))).run();
      }
    });
    console.log(`generated ${TESTS.toLocaleString()} tests in ${((performance.now() - t0) / 1000).toFixed(1)} s`);

    for (const [label, params] of [
      ["list, page of 25, newest first", { pageSize: "25", sort: "testedOn", dir: "desc" }],
      ["list, page of 100, by casting", { pageSize: "100", sort: "castingNumber" }],
      ["list, page of 100, by point count", { pageSize: "100", sort: "pointCount", dir: "desc" }],
      ["list, text filter 'bench 1999'", { pageSize: "25", q: "bench 1999" }],
    ] as const) {
      const query = flowTestListQuerySchema.parse(params);
      console.log(`${label.padEnd(36)} ${time(() => listFlowTestsWithFigures(db, query)).toFixed(1)} ms (median of ${REPEATS})`);
    }
    const view = flowTestView(db, 1)!;
    if (!view.computed.ok) throw new Error("bench test not computable");
    const result = view.computed.result;
    const pdfMs = time(() => {
      const doc = flowSheetPdf(view.test, result, { generatedAt: new Date(), generatedBy: "bench" });
      doc.resume();
    });
    console.log(`${"flow-sheet PDF (14 points), build".padEnd(36)} ${pdfMs.toFixed(1)} ms (median of ${REPEATS})`);
    console.log(`rss ${(process.memoryUsage().rss / 1e6).toFixed(0)} MB`);
    db.$client.close();
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) await run();
