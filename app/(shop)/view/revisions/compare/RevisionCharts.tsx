/**
 * The charts of a revision comparison, loaded by revision ids on the server: cycle time, path
 * lengths and tools side by side, the source scans' section profiles overlaid with their
 * difference, and the flow curves of each revision's flow tests overlaid. Used by the comparison
 * page here and embeddable in any other server page.
 */
import { AreaDifferenceChart } from "@/components/charts/AreaDifferenceChart";
import { RevisionFigures, ToolsSideBySide } from "@/components/charts/RevisionFigures";
import { SectionAreaChart } from "@/components/charts/SectionAreaChart";
import { FlowChart } from "@/components/flow/FlowChart";
import { Card, EmptyState } from "@/components/ui/Card";
import { guidelineOf } from "@/components/viewer/results";
import type { GeometryResultLite } from "@/components/viewer/types";
import { db } from "@/db/client";
import { revisionAnalyses } from "@/db/queries/programs";
import { compareRevisions, type PortReportLike, type ToolpathReportLike } from "@/lib/programs/compare";
import { revisionFlowSeries } from "../../_data/reads";

export type ChartPart = "figures" | "bars" | "profile" | "flow";

/**
 * `parts` picks what to show (all by default): "figures" = bars, figure table and tools; "bars" =
 * the paired bars alone (for a page that already tabulates the figures); "profile"; "flow".
 */
export function RevisionCharts({ a, b, parts = ["figures", "profile", "flow"] }: { a: number; b: number; parts?: ChartPart[] }) {
  const ra = revisionAnalyses(db(), a);
  const rb = revisionAnalyses(db(), b);
  if (!ra || !rb) return <EmptyState title="One of these revisions does not exist." />;
  const sameProgram = ra.revision.program.id === rb.revision.program.id;
  const nameOf = (r: typeof ra) => (sameProgram ? `Revision ${r.revision.revision.letter}` : `${r.revision.program.name} ${r.revision.revision.letter}`);
  const la = nameOf(ra);
  const lb = nameOf(rb);
  const cmp = compareRevisions(
    { toolpaths: ra.toolpaths as ToolpathReportLike[], scan: ra.scan as PortReportLike | null },
    { toolpaths: rb.toolpaths as ToolpathReportLike[], scan: rb.scan as PortReportLike | null },
  );
  const scanA = ra.scan as GeometryResultLite | null;
  const scanB = rb.scan as GeometryResultLite | null;
  const profile = (s: GeometryResultLite) => s.sections.map((x) => ({ stationMm: x.stationMm, areaMm2: x.areaMm2 }));
  const sameScan = ra.revision.revision.sourceScanId !== null && ra.revision.revision.sourceScanId === rb.revision.revision.sourceScanId;
  const flow = [...revisionFlowSeries(db(), a, ra.revision.revision.letter), ...revisionFlowSeries(db(), b, rb.revision.revision.letter)];
  return (
    <div className="flex flex-col gap-4" data-testid="revision-charts">
      {(parts.includes("figures") || parts.includes("bars")) && (
        <Card title={parts.includes("figures") ? "Cycle time, paths and tools" : "Cycle time and paths"}>
          {cmp.toolpathFiles.a + cmp.toolpathFiles.b === 0 ? (
            <EmptyState title="Neither revision has an analysed toolpath yet." />
          ) : (
            <div className="flex flex-col gap-5">
              <RevisionFigures comparison={cmp} labelA={la} labelB={lb} barsOnly={!parts.includes("figures")} />
              {parts.includes("figures") && <ToolsSideBySide comparison={cmp} labelA={la} labelB={lb} />}
            </div>
          )}
        </Card>
      )}
      {parts.includes("profile") && <Card title="Section profiles of the source scans">
        {scanA || scanB ? (
          <div className="flex flex-col gap-5">
            {sameScan && <p className="text-sm text-ink-soft">Both revisions were made from the same scan, so their profiles are the same line.</p>}
            <SectionAreaChart
              series={[
                ...(scanA ? [{ label: la, sections: profile(scanA), min: scanA.minSection }] : []),
                ...(scanB ? [{ label: lb, sections: profile(scanB), min: scanB.minSection }] : []),
              ]}
              valveDiameterMm={scanA?.valveDiameterMm ?? scanB?.valveDiameterMm}
              guideline={scanA ? guidelineOf(scanA) : scanB ? guidelineOf(scanB) : null}
            />
            {scanA && scanB && !sameScan && <AreaDifferenceChart a={profile(scanA)} b={profile(scanB)} labelA={la} labelB={lb} stepMm={scanA.stepMm} />}
          </div>
        ) : (
          <EmptyState title="No section profile to show.">A revision shows one when its source scan has an analysed point cloud.</EmptyState>
        )}
      </Card>}
      {parts.includes("flow") && <Card title="Flow curves of each revision's flow tests">
        {flow.length === 0 ? (
          <EmptyState title="No flow tests are recorded against these revisions yet.">Record a first-cut flow test and link it to the revision.</EmptyState>
        ) : (
          <FlowChart series={flow} title="Flow against lift, by revision" />
        )}
      </Card>}
    </div>
  );
}
