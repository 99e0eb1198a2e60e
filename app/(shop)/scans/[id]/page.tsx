import Link from "next/link";
import { notFound } from "next/navigation";
import { Details, mm } from "@/components/library/Details";
import { ViewerSlot } from "@/components/programs/ViewerSlot";
import { FileList } from "@/components/programs/FileList";
import { Gallery } from "@/components/uploads/Gallery";
import { PhotoUploader } from "@/components/uploads/PhotoUploader";
import { UploadThenRefresh } from "@/components/uploads/UploadThenRefresh";
import { buttonClass } from "@/components/ui/Button";
import { Card, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { db } from "@/db/client";
import { getScan } from "@/db/queries/scans";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { SCAN_EDITORS } from "@/lib/library/scans";
import { PHOTO_ROLES } from "@/lib/uploads/service";
import { requirePageRole } from "../../../_server/session";

export default async function ScanPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/scans/${id}`);
  const data = getScan(db(), Number(id));
  if (!data) notFound();
  kickAnalyses(db());
  const { scan, master, headType, plateCode, machineName, operatorName, files, photos } = data;
  const latest = files.filter((f) => f.analysis?.state === "done").at(-1);
  return (
    <>
      <PageHeader
        title={`Scan S-${scan.id}`}
        subtitle={`${scan.port === "intake" ? "Intake" : "Exhaust"} port of master ${master.label} (casting ${headType.castingNumber})`}
        actions={hasRole(actor, SCAN_EDITORS) ? <Link href={`/scans/${scan.id}/edit`} className={buttonClass("secondary")}>Edit</Link> : null}
      />
      <div className="flex flex-col gap-4">
        <Card title="Digitizing run">
          <Details
            columns={4}
            items={[
              ["Master", <Link key="m" href={`/masters/${master.id}`} className="font-mono text-copper-deep hover:underline">{master.label}</Link>],
              ["Plate", <span key="p" className="font-mono">{plateCode}</span>],
              ["Machine", machineName],
              ["Operator", operatorName],
              ["Stylus diameter", mm(scan.stylusDiameterMm)],
              ["Point spacing", mm(scan.pointSpacingMm)],
              ["Scanned on", formatDate(scan.scannedOn)],
              ["Valve head", mm(scan.port === "intake" ? headType.intakeValveMm : headType.exhaustValveMm)],
            ]}
          />
          {scan.notes && <p className="mt-3 whitespace-pre-wrap text-sm">{scan.notes}</p>}
        </Card>
        <Card title="Point clouds and geometry">
          <div className="flex flex-col gap-4">
            <FileList files={files} canRerun={hasRole(actor, MACHINISTS)} emptyTitle="No point cloud uploaded yet." />
            {hasRole(actor, MACHINISTS) && <UploadThenRefresh kind="point_cloud" target={{ scanId: scan.id }} label="Upload a point cloud (PLY, STL, XYZ or CSV)" />}
          </div>
        </Card>
        <ViewerSlot kind="cloud" analysisId={latest?.analysis?.id ?? null} href={`/view/scans/${scan.id}`} />
        <Card title="Photos">
          <div className="flex flex-col gap-4">
            <Gallery photos={photos} removableFrom={hasRole(actor, PHOTO_ROLES.scan) ? "scan" : undefined} />
            {hasRole(actor, PHOTO_ROLES.scan) && <PhotoUploader entity="scan" entityId={scan.id} />}
          </div>
        </Card>
      </div>
    </>
  );
}
