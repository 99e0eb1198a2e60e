import { notFound } from "next/navigation";
import { RevisionForm } from "@/components/programs/RevisionForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getProgram } from "@/db/queries/programs";
import { REVISION_EDITORS } from "@/lib/programs/revisions";
import { requirePageRole } from "../../../../../_server/session";
import { revisionFormOptions } from "../../revision-options";

export const metadata = { title: "New revision" };

export default async function NewRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(REVISION_EDITORS, `/programs/${id}/revisions/new`);
  const data = getProgram(db(), Number(id));
  if (!data) notFound();
  const options = revisionFormOptions(data.program);
  return (
    <>
      <PageHeader title={`New revision of ${data.program.name}`} subtitle="It starts as a draft; upload its toolpath on the next page." />
      <RevisionForm programId={data.program.id} options={options} initial={{ sourceScanId: options.scans.at(-1)?.id }} />
    </>
  );
}
