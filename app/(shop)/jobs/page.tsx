import Link from "next/link";
import { JobsTable } from "@/components/jobs/JobsTable";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Jobs" };

export default async function JobsPage() {
  const actor = await requirePageRole(EVERYONE, "/jobs");
  return (
    <>
      <PageHeader
        title="Jobs"
        subtitle="Work orders: which customer, which casting, how many heads, and the released revision each port is cut with."
        actions={
          hasRole(actor, LEADS) ? (
            <Link href="/jobs/new" className={buttonClass("primary")}>
              Open a job
            </Link>
          ) : null
        }
      />
      <JobsTable />
    </>
  );
}
