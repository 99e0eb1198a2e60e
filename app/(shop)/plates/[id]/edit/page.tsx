import { notFound } from "next/navigation";
import { PlateForm } from "@/components/library/PlateForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { getPlate } from "@/db/queries/library";
import { PLATE_EDITORS, workOffsetRows } from "@/lib/library/plates";
import { requirePageRole } from "../../../../_server/session";

export default async function EditPlatePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(PLATE_EDITORS, `/plates/${id}/edit`);
  const data = getPlate(db(), Number(id));
  if (!data) notFound();
  const p = data.plate;
  return (
    <>
      <PageHeader title={`Edit plate ${p.code}`} />
      <PlateForm
        id={p.id}
        headTypes={headTypeOptions(db())}
        initial={{
          code: p.code,
          headTypeId: p.headTypeId,
          datumDescription: p.datumDescription,
          workOffsets: workOffsetRows(p.workOffsets),
          portAxisAngles: { intake: p.portAxisAngles.intake ?? {}, exhaust: p.portAxisAngles.exhaust ?? {} },
          envelope: p.envelope,
          notes: p.notes,
        }}
      />
    </>
  );
}
