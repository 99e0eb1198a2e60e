import Link from "next/link";
import { ScansTable } from "@/components/library/LibraryTables";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { SCAN_EDITORS } from "@/lib/library/scans";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Scans" };

export default async function ScansPage() {
  const actor = await requirePageRole(EVERYONE, "/scans");
  return (
    <>
      <PageHeader title="Scans" subtitle="Digitizing runs of the masters: probe, spacing, point clouds and the port geometry computed from them." actions={hasRole(actor, SCAN_EDITORS) ? <Link href="/scans/new" className={buttonClass("primary")}>Record a scan</Link> : null} />
      <ScansTable />
    </>
  );
}
