import { ScanForm } from "@/components/library/ScanForm";
import { Caution, PageHeader } from "@/components/ui/Card";
import { SCAN_EDITORS } from "@/lib/library/scans";
import { requirePageRole } from "../../../_server/session";
import { scanFormOptions } from "../options";

export const metadata = { title: "Record a scan" };

export default async function NewScanPage({ searchParams }: { searchParams: Promise<{ masterId?: string }> }) {
  await requirePageRole(SCAN_EDITORS, "/scans/new");
  const sp = await searchParams;
  const options = scanFormOptions();
  const master = options.masters.find((m) => m.id === Number(sp.masterId));
  const plate = master ? options.plates.find((p) => p.headTypeId === master.headTypeId) : undefined;
  return (
    <>
      <PageHeader title="Record a scan" subtitle="Record the run first; then upload its point cloud on the scan's page." />
      <div className="mb-4">
        <Caution title="At the machine">
          <p>Probe with the guards closed and the spindle locked; check the stylus calibration before each run. Follow the machine builder&apos;s instructions.</p>
        </Caution>
      </div>
      <ScanForm options={options} initial={master ? { masterId: master.id, plateId: plate?.id, machineId: options.machines[0]?.id } : undefined} />
    </>
  );
}
