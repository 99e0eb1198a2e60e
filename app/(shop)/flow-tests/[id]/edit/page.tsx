import { notFound } from "next/navigation";
import { FlowTestForm } from "@/components/flow/FlowTestForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getFlowTest } from "@/db/queries/flow-tests";
import { storedToRecordInput } from "@/lib/flowtests/normalize";
import { FLOW_EDITORS } from "@/lib/flowtests/roles";
import { requirePageRole } from "../../../../_server/session";

export const metadata = { title: "Change a flow test" };

export default async function EditFlowTestPage({ params }: { params: Promise<{ id: string }> }) {
  const { id: raw } = await params;
  await requirePageRole(FLOW_EDITORS, `/flow-tests/${raw}/edit`);
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const test = getFlowTest(db(), id);
  if (!test) notFound();
  return (
    <>
      <PageHeader
        title={`Change flow test #${id}`}
        subtitle="Values are shown in the stored units (mm, cfm at the test depression, inH₂O, °C, kPa). The change is recorded in the audit trail with the values before and after."
      />
      <FlowTestForm mode="edit" id={id} initial={storedToRecordInput(test, test.points)} />
    </>
  );
}
