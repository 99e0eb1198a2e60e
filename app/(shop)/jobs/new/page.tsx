import Link from "next/link";
import { JobForm } from "@/components/jobs/JobForm";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { jobFormOptions, nextJobNumber } from "@/db/queries/jobs";
import { LEADS } from "@/lib/auth/roles";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Open a job" };

export default async function NewJobPage({ searchParams }: { searchParams: Promise<{ customerId?: string }> }) {
  await requirePageRole(LEADS, "/jobs/new");
  const { customerId } = await searchParams;
  const options = { ...jobFormOptions(db()), nextNumber: nextJobNumber(db()) };
  return (
    <>
      <PageHeader title="Open a job" subtitle="The revisions are chosen on the job's page once it exists; only released revisions can be chosen." />
      {options.customers.length === 0 ? (
        <EmptyState title="There are no customers yet.">
          <Link href="/customers" className="text-copper underline">
            Add the customer first
          </Link>
          .
        </EmptyState>
      ) : (
        <Card className="max-w-3xl">
          <JobForm options={options} presetCustomerId={customerId ? Number(customerId) : undefined} />
        </Card>
      )}
    </>
  );
}
