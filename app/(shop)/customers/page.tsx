import { CustomerForm } from "@/components/jobs/CustomerForm";
import { CustomersTable } from "@/components/jobs/CustomersTable";
import { Card, PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Customers" };

export default async function CustomersPage() {
  const actor = await requirePageRole(EVERYONE, "/customers");
  const canEdit = hasRole(actor, LEADS);
  return (
    <>
      <PageHeader title="Customers" subtitle="Who the shop ports heads for: contacts, their jobs and the heads they sent." />
      <div className={canEdit ? "grid gap-6 xl:grid-cols-[1fr_22rem]" : ""}>
        <CustomersTable />
        {canEdit && (
          <Card title="Add a customer">
            <CustomerForm />
          </Card>
        )}
      </div>
    </>
  );
}
