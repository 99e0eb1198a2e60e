import Link from "next/link";
import { ProgramsTable } from "@/components/programs/ProgramTables";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { PROGRAM_EDITORS } from "@/lib/programs/programs";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Programs" };

export default async function ProgramsPage() {
  const actor = await requirePageRole(EVERYONE, "/programs");
  return (
    <>
      <PageHeader
        title="Programs"
        subtitle="One program per casting and port, with its revisions from draft to release."
        actions={
          <>
            <Link href="/programs/revisions" className={buttonClass("secondary")}>All revisions</Link>
            {hasRole(actor, PROGRAM_EDITORS) && <Link href="/programs/new" className={buttonClass("primary")}>New program</Link>}
          </>
        }
      />
      <ProgramsTable />
    </>
  );
}
