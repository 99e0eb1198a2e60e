import { notFound } from "next/navigation";
import { ScanForm } from "@/components/library/ScanForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getScan } from "@/db/queries/scans";
import { SCAN_EDITORS } from "@/lib/library/scans";
import { requirePageRole } from "../../../../_server/session";
import { scanFormOptions } from "../../options";

export default async function EditScanPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(SCAN_EDITORS, `/scans/${id}/edit`);
  const data = getScan(db(), Number(id));
  if (!data) notFound();
  const s = data.scan;
  const options = scanFormOptions();
  // The scan's own master stays choosable even if it has moved on.
  if (!options.masters.some((m) => m.id === s.masterId)) options.masters.push({ id: data.master.id, label: data.master.label, headTypeId: data.master.headTypeId, stage: data.master.stage, castingNumber: data.headType.castingNumber });
  return (
    <>
      <PageHeader title={`Edit scan S-${s.id}`} />
      <ScanForm
        id={s.id}
        options={options}
        initial={{ masterId: s.masterId, plateId: s.plateId, machineId: s.machineId, port: s.port, operatorId: s.operatorId, stylusDiameterMm: s.stylusDiameterMm, pointSpacingMm: s.pointSpacingMm, scannedOn: s.scannedOn, notes: s.notes }}
      />
    </>
  );
}
