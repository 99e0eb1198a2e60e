import { notFound } from "next/navigation";
import { HeadTypeForm } from "@/components/library/HeadTypeForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getHeadType } from "@/db/queries/head-types";
import { HEAD_TYPE_EDITORS } from "@/lib/library/head-types";
import { requirePageRole } from "../../../../_server/session";

export default async function EditHeadTypePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(HEAD_TYPE_EDITORS, `/head-types/${id}/edit`);
  const ht = getHeadType(db(), Number(id));
  if (!ht) notFound();
  const initial = {
    castingNumber: ht.castingNumber,
    engineFamily: ht.engineFamily,
    cylinders: ht.cylinders,
    valvesPerCylinder: ht.valvesPerCylinder,
    boreMm: ht.boreMm,
    strokeMm: ht.strokeMm,
    intakeValveMm: ht.intakeValveMm,
    exhaustValveMm: ht.exhaustValveMm,
    intakeSeatIdMm: ht.intakeSeatIdMm,
    exhaustSeatIdMm: ht.exhaustSeatIdMm,
    notes: ht.notes,
  };
  return (
    <>
      <PageHeader title={`Edit casting ${ht.castingNumber}`} />
      <HeadTypeForm id={ht.id} initial={initial} />
    </>
  );
}
