import Link from "next/link";
import { PlatesTable } from "@/components/library/LibraryTables";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { PLATE_EDITORS } from "@/lib/library/plates";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Fixture plates" };

export default async function PlatesPage() {
  const actor = await requirePageRole(EVERYONE, "/plates");
  return (
    <>
      <PageHeader title="Fixture plates" subtitle="How each casting locates on the machine, and the envelope every toolpath is checked against." actions={hasRole(actor, PLATE_EDITORS) ? <Link href="/plates/new" className={buttonClass("primary")}>New plate</Link> : null} />
      <PlatesTable />
    </>
  );
}
