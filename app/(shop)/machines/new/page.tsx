import { MachineForm } from "@/components/library/MachineForm";
import { PageHeader } from "@/components/ui/Card";
import { MACHINE_EDITORS } from "@/lib/library/machines";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "New machine" };

export default async function NewMachinePage() {
  await requirePageRole(MACHINE_EDITORS, "/machines/new");
  return (
    <>
      <PageHeader title="New machine" subtitle="Take the limits and rates from the machine builder's documentation." />
      <MachineForm />
    </>
  );
}
