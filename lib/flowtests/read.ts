/**
 * Flow tests as the screens, the PDF and the API show them: stored values plus the computed
 * columns from the flow math. Reads only; the route or page in front checks the role.
 */
import type { Db } from "@/db/client";
import { getFlowTest, getFlowTests, listFlowTests, pointsOf, type FlowTestDetail, type FlowTestFilters, type FlowTestListRow } from "@/db/queries/flow-tests";
import type { FlowIssue, FlowTestResult } from "@/lib/flow";
import type { Page, TableQuery } from "../paging";
import { computeStored, type StoredFlowTest } from "./normalize";

export type FlowTestView = {
  test: FlowTestDetail;
  computed: { ok: true; result: FlowTestResult } | { ok: false; issues: FlowIssue[] };
};

/** What a chart needs of one test. */
export type FlowSeriesPoint = { liftMm: number; flowCfmAt28: number; ld: number; cdValve: number; cdCurtain: number };
export type FlowSeries = { id: number; label: string; subject: StoredFlowTest["subject"]; port: StoredFlowTest["port"]; testedOn: string; points: FlowSeriesPoint[] };

export type FlowTestListItem = FlowTestListRow & { peakFlowCfmAt28: number | null; peakFlowLiftMm: number | null };

export function viewOf(test: FlowTestDetail): FlowTestView {
  return { test, computed: computeStored(test, test.points) };
}

export function flowTestView(db: Db, id: number): FlowTestView | undefined {
  const test = getFlowTest(db, id);
  return test && viewOf(test);
}

const PORT_WORD = { intake: "intake", exhaust: "exhaust" } as const;

/** "#12 · M-4471-01 intake cyl 1 · 2025-03-02": short enough for a chart legend, unique by id. */
export function seriesLabel(test: Pick<FlowTestDetail, "id" | "subjectLabel" | "port" | "cylinder" | "testedOn">): string {
  const where = test.cylinder != null ? ` cyl ${test.cylinder}` : "";
  return `#${test.id} · ${test.subjectLabel} ${PORT_WORD[test.port]}${where} · ${test.testedOn}`;
}

export function seriesOf(test: FlowTestDetail, result?: FlowTestResult): FlowSeries | null {
  const computed = result ? { ok: true as const, result } : computeStored(test, test.points);
  if (!computed.ok) return null;
  return {
    id: test.id,
    label: seriesLabel(test),
    subject: test.subject,
    port: test.port,
    testedOn: test.testedOn,
    points: computed.result.points.map((p) => ({ liftMm: p.liftMm, flowCfmAt28: p.flowCfmAt28, ld: p.ld, cdValve: p.cdValve, cdCurtain: p.cdCurtain })),
  };
}

/** Series of several tests in the order asked (tests that cannot be computed are left out). */
export function flowSeries(db: Db, ids: number[]): FlowSeries[] {
  return getFlowTests(db, ids)
    .map((t) => seriesOf(t))
    .filter((s): s is FlowSeries => s !== null);
}

/** The list page with each row's corrected peak flow, computed like everywhere else. */
export function listFlowTestsWithFigures(db: Db, query: TableQuery & FlowTestFilters): Page<FlowTestListItem> {
  const page = listFlowTests(db, query);
  const points = pointsOf(
    db,
    page.rows.map((r) => r.id),
  );
  return {
    ...page,
    rows: page.rows.map((row) => {
      const computed = computeStored(row, points.get(row.id) ?? []);
      return {
        ...row,
        peakFlowCfmAt28: computed.ok ? computed.result.summary.peakFlowCfmAt28 : null,
        peakFlowLiftMm: computed.ok ? computed.result.summary.peakFlowLiftMm : null,
      };
    }),
  };
}
