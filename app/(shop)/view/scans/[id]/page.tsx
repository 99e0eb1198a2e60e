import Link from "next/link";
import { notFound } from "next/navigation";
import { AnalysisView } from "@/components/programs/AnalysisView";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { CloudView } from "@/components/viewer/CloudView";
import type { GeometryResultLite } from "@/components/viewer/types";
import { ViewerCaution } from "@/components/viewer/ViewerCaution";
import { db } from "@/db/client";
import { scanOptions } from "@/db/queries/scans";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../../../_server/session";
import { pickAnalysed, scanView } from "../../_data/reads";

export const metadata = { title: "Scan in 3D" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function ScanCloudPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Search }) {
  const { id } = await params;
  await requirePageRole(EVERYONE, `/view/scans/${id}`);
  const view = Number.isInteger(Number(id)) ? scanView(db(), Number(id)) : null;
  if (!view) notFound();
  const { scan, master, headType, plateCode } = view.data;
  const fileParam = Number((await searchParams).file);
  const file = pickAnalysed(view.clouds, Number.isInteger(fileParam) && fileParam > 0 ? fileParam : undefined);
  const analysis = file?.analysis ?? null;
  const label = `S-${scan.id} ${master.label} ${scan.port}`;
  // Other scans of the same casting and port, to compare with.
  const others = scanOptions(db(), { headTypeId: headType.id, port: scan.port }).filter((o) => o.id !== scan.id);
  return (
    <>
      <PageHeader
        title={`Scan S-${scan.id} in 3D`}
        subtitle={`${scan.port === "intake" ? "Intake" : "Exhaust"} port of master ${master.label} · casting ${headType.castingNumber} · plate ${plateCode} · scanned ${formatDate(scan.scannedOn)}${file ? ` · ${file.name}` : ""}`}
        actions={
          <>
            <Link href={`/scans/${scan.id}`} className={buttonClass("quiet")}>
              The scan
            </Link>
            {others.map((o) => (
              <Link key={o.id} href={`/view/scans/compare?a=${o.id}&b=${scan.id}`} className={buttonClass("secondary")}>
                Compare with S-{o.id}
              </Link>
            ))}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        {!file || !analysis ? (
          <EmptyState title="No point cloud to draw yet.">Upload a point cloud on the scan&apos;s page; its analysis makes the preview and the sections this view shows.</EmptyState>
        ) : analysis.state !== "done" || !analysis.previewFileId ? (
          <Card title="The analysis is not finished">
            <div className="flex flex-col gap-2">
              <AnalysisView initial={analysis} canRerun={false} />
              <p className="text-sm text-ink-soft">The 3D view appears when the analysis is done: reload this page then.</p>
            </div>
          </Card>
        ) : (
          <CloudView analysisId={analysis.id} result={analysis.result as GeometryResultLite} label={label} />
        )}
        <ViewerCaution />
      </div>
    </>
  );
}
