import { HeadTypesTable } from "@/components/library/HeadTypesTable";
import { PageHeader } from "@/components/ui/Card";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Head types" };

export default async function HeadTypesPage() {
  await requirePageRole(EVERYONE, "/head-types");
  return (
    <>
      <PageHeader title="Head types" subtitle="Castings the shop ports: bore, stroke and valve sizes." />
      <HeadTypesTable />
    </>
  );
}
