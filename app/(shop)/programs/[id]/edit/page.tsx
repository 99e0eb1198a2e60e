import { notFound } from "next/navigation";
import { ProgramForm } from "@/components/programs/ProgramForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { getProgram } from "@/db/queries/programs";
import { PROGRAM_EDITORS } from "@/lib/programs/programs";
import { requirePageRole } from "../../../../_server/session";

export default async function EditProgramPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(PROGRAM_EDITORS, `/programs/${id}/edit`);
  const data = getProgram(db(), Number(id));
  if (!data) notFound();
  const p = data.program;
  return (
    <>
      <PageHeader title={`Edit ${p.name}`} subtitle="Casting and port are fixed once a program exists." />
      <ProgramForm id={p.id} headTypes={headTypeOptions(db()).filter((h) => h.id === p.headTypeId)} initial={{ headTypeId: p.headTypeId, port: p.port, name: p.name, notes: p.notes }} />
    </>
  );
}
