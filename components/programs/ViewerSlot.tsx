import Link from "next/link";
import { buttonClass } from "../ui/Button";
import { Card } from "../ui/Card";

/**
 * Where the 3D view is offered (toolpath, or point cloud with a section slider). The viewer's own
 * page reads GET /api/analyses/:id/preview (the engines' preview blobs) and GET /api/analyses/:id.
 */
export function ViewerSlot({ kind, analysisId, href }: { kind: "toolpath" | "cloud"; analysisId: number | null; href: string }) {
  return (
    <Card title={kind === "toolpath" ? "3D toolpath view" : "3D point-cloud view"}>
      <div data-viewer-slot={kind} data-analysis-id={analysisId ?? ""} className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-dashed border-rule bg-paper px-4 py-4 text-sm text-ink-soft">
        {analysisId ? (
          <>
            <span>{kind === "toolpath" ? "The decimated toolpath, tool by tool, with a line scrubber." : "The probe points coloured by station, with a section slider."}</span>
            <Link href={href} className={buttonClass("secondary")}>
              Open the 3D view
            </Link>
          </>
        ) : (
          <span>The 3D view is offered here once a file has been analysed.</span>
        )}
      </div>
    </Card>
  );
}
