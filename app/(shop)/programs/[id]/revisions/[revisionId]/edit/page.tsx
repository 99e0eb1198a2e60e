import { notFound } from "next/navigation";
import { RevisionForm } from "@/components/programs/RevisionForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getRevision } from "@/db/queries/programs";
import { REVISION_EDITORS } from "@/lib/programs/revisions";
import { requirePageRole } from "../../../../../../_server/session";
import { revisionFormOptions } from "../../../revision-options";

export default async function EditRevisionPage({ params }: { params: Promise<{ id: string; revisionId: string }> }) {
  const { id, revisionId } = await params;
  await requirePageRole(REVISION_EDITORS, `/programs/${id}/revisions/${revisionId}/edit`);
  const data = getRevision(db(), Number(revisionId));
  if (!data || data.program.id !== Number(id)) notFound();
  const r = data.revision;
  const options = revisionFormOptions(data.program);
  options.revisions = options.revisions.filter((o) => o.id !== r.id);
  return (
    <>
      <PageHeader title={`Edit draft ${r.letter} of ${data.program.name}`} />
      <RevisionForm programId={data.program.id} id={r.id} options={options} initial={{ parentId: r.parentId, sourceScanId: r.sourceScanId, plateId: r.plateId, machineId: r.machineId, changeNote: r.changeNote }} />
    </>
  );
}
