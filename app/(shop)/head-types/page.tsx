import Link from "next/link";
import { HeadTypesTable } from "@/components/library/HeadTypesTable";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { HEAD_TYPE_EDITORS } from "@/lib/library/head-types";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Head types" };

export default async function HeadTypesPage() {
  const actor = await requirePageRole(EVERYONE, "/head-types");
  return (
    <>
      <PageHeader
        title="Head types"
        subtitle="Castings the shop ports: bore, stroke and valve sizes."
        actions={hasRole(actor, HEAD_TYPE_EDITORS) ? <Link href="/head-types/new" className={buttonClass("primary")}>New head type</Link> : null}
      />
      <HeadTypesTable />
    </>
  );
}
