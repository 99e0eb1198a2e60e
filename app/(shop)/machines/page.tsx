import Link from "next/link";
import { MachinesTable } from "@/components/library/LibraryTables";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { MACHINE_EDITORS } from "@/lib/library/machines";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Machines" };

export default async function MachinesPage() {
  const actor = await requirePageRole(EVERYONE, "/machines");
  return (
    <>
      <PageHeader title="Machines" subtitle="Each CNC machine's axes, travel, rates and limits — the profile every toolpath is checked against." actions={hasRole(actor, MACHINE_EDITORS) ? <Link href="/machines/new" className={buttonClass("primary")}>New machine</Link> : null} />
      <MachinesTable />
    </>
  );
}
