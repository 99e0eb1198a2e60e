import { Card } from "../ui/Card";

/**
 * Where the 3D view goes (toolpath or point cloud with a section slider). The viewer reads
 * GET /api/analyses/:id/preview — the engines' preview blobs — and the JSON report from
 * GET /api/analyses/:id; until it lands this slot says what it will show.
 */
export function ViewerSlot({ kind, analysisId }: { kind: "toolpath" | "cloud"; analysisId: number | null }) {
  return (
    <Card title={kind === "toolpath" ? "3D toolpath view" : "3D point-cloud view"}>
      <div data-viewer-slot={kind} data-analysis-id={analysisId ?? ""} className="flex h-40 items-center justify-center rounded-md border border-dashed border-rule bg-paper text-center text-sm text-ink-faint">
        {analysisId
          ? `The ${kind === "toolpath" ? "toolpath" : "point-cloud"} preview of analysis ${analysisId} is stored and ready for the 3D viewer.`
          : "The 3D view appears here once a file has been analysed."}
      </div>
    </Card>
  );
}
