import Link from "next/link";
import { notFound } from "next/navigation";
import { CustomerForm } from "@/components/jobs/CustomerForm";
import { HeadsTable } from "@/components/jobs/HeadsTable";
import { JobsTable } from "@/components/jobs/JobsTable";
import { Card, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getCustomer } from "@/db/queries/customers";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Customer" };

export default async function CustomerPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/customers/${id}`);
  const customer = Number.isInteger(Number(id)) ? getCustomer(db(), Number(id)) : null;
  if (!customer) notFound();
  const canEdit = hasRole(actor, LEADS);
  return (
    <>
      <PageHeader
        title={customer.name}
        subtitle={[customer.contactName, customer.email, customer.phone].filter(Boolean).join(" · ") || "No contact details yet."}
        actions={
          <Link href={`/trace/customer/${customer.id}`} className="text-sm font-semibold text-copper underline">
            Trace this customer&apos;s heads
          </Link>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <section aria-labelledby="customer-jobs">
            <h2 id="customer-jobs" className="mb-2 text-sm font-bold uppercase tracking-wider text-ink-soft">
              Jobs
            </h2>
            <JobsTable customerId={customer.id} defaultState="" />
          </section>
          <section aria-labelledby="customer-heads">
            <h2 id="customer-heads" className="mb-2 text-sm font-bold uppercase tracking-wider text-ink-soft">
              Heads
            </h2>
            <HeadsTable customerId={customer.id} />
          </section>
        </div>
        <div className="flex flex-col gap-4">
          <Card title="Details">
            <dl className="grid grid-cols-[7rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Address</dt>
              <dd className="whitespace-pre-line">{customer.address || "—"}</dd>
              <dt className="text-ink-soft">Notes</dt>
              <dd className="whitespace-pre-line">{customer.notes || "—"}</dd>
            </dl>
          </Card>
          {canEdit && (
            <Card title="Edit">
              <CustomerForm customer={customer} />
            </Card>
          )}
        </div>
      </div>
    </>
  );
}
