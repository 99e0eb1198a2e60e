import { HeadsTable } from "@/components/jobs/HeadsTable";
import { PageHeader } from "@/components/ui/Card";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Heads" };

export default async function HeadsPage() {
  await requirePageRole(EVERYONE, "/heads");
  return (
    <>
      <PageHeader title="Heads" subtitle="Every production head by serial: whose it is, which job, how far it got, and how often it was cut." />
      <HeadsTable />
    </>
  );
}
