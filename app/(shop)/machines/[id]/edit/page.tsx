import { notFound } from "next/navigation";
import { MachineForm } from "@/components/library/MachineForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getMachine } from "@/db/queries/library";
import { MACHINE_EDITORS } from "@/lib/library/machines";
import { requirePageRole } from "../../../../_server/session";

export default async function EditMachinePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(MACHINE_EDITORS, `/machines/${id}/edit`);
  const m = getMachine(db(), Number(id));
  if (!m) notFound();
  return (
    <>
      <PageHeader title={`Edit ${m.name}`} />
      <MachineForm
        id={m.id}
        initial={{
          name: m.name,
          description: m.description,
          axes: m.axes,
          limits: {
            travelMm: m.limits.travelMm as { X: { min: number; max: number }; Y: { min: number; max: number }; Z: { min: number; max: number } },
            rotaryDeg: m.limits.rotaryDeg,
            rapidPerMin: m.limits.rapidPerMin as { X: number; Y: number; Z: number },
          },
          maxFeedMmMin: m.maxFeedMmMin,
          maxSpindleRpm: m.maxSpindleRpm,
          toolChangeS: m.toolChangeS,
          active: m.active,
          notes: m.notes,
        }}
      />
    </>
  );
}
