import { notFound } from "next/navigation";
import { MasterForm } from "@/components/library/MasterForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { getMaster, peopleOptions } from "@/db/queries/library";
import { MASTER_EDITORS } from "@/lib/library/masters";
import { requirePageRole } from "../../../../_server/session";

export default async function EditMasterPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(MASTER_EDITORS, `/masters/${id}/edit`);
  const data = getMaster(db(), Number(id));
  if (!data) notFound();
  const m = data.master;
  return (
    <>
      <PageHeader title={`Edit master ${m.label}`} />
      <MasterForm
        id={m.id}
        headTypes={headTypeOptions(db())}
        porters={peopleOptions(db(), "porter")}
        initial={{
          label: m.label,
          headTypeId: m.headTypeId,
          porterId: m.porterId,
          startedOn: m.startedOn,
          finishedOn: m.finishedOn,
          handPortNotes: m.handPortNotes,
          measurements: { intake: m.measurements.intake ?? {}, exhaust: m.measurements.exhaust ?? {} },
          notes: m.notes,
        }}
      />
    </>
  );
}
