import Link from "next/link";
import { MastersTable } from "@/components/library/LibraryTables";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { MASTER_EDITORS } from "@/lib/library/masters";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Master heads" };

export default async function MastersPage() {
  const actor = await requirePageRole(EVERYONE, "/masters");
  return (
    <>
      <PageHeader
        title="Master heads"
        subtitle="Hand-ported masters, their notes and readings, and where each stands in the handoff."
        actions={hasRole(actor, MASTER_EDITORS) ? <Link href="/masters/new" className={buttonClass("primary")}>Register a master</Link> : null}
      />
      <MastersTable />
    </>
  );
}
