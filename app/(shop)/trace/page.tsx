import Link from "next/link";
import { RevisionPicker, SerialPicker } from "@/components/trace/TracePicker";
import { Card, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { customerOptions } from "@/db/queries/customers";
import { traceableRevisions } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Trace and recall" };

export default async function TracePage() {
  await requirePageRole(EVERYONE, "/trace");
  const revisions = traceableRevisions(db());
  const customers = customerOptions(db());
  return (
    <>
      <PageHeader title="Trace and recall" subtitle="Which heads were cut with which revision, with which file, for whom — from any end of the chain." />
      <div className="grid gap-4 lg:grid-cols-3">
        <Card title="By revision">
          <p className="mb-3 text-sm text-ink-soft">Every job, head and customer a revision touched, with a recall list to download.</p>
          <RevisionPicker revisions={revisions} />
        </Card>
        <Card title="By head serial">
          <p className="mb-3 text-sm text-ink-soft">Master → scan → revision → file hash → flow tests → job → customer, on one page.</p>
          <SerialPicker />
        </Card>
        <Card title="By customer">
          <p className="mb-3 text-sm text-ink-soft">A customer&apos;s heads and the revisions that cut them.</p>
          {customers.length === 0 ? (
            <p className="text-sm text-ink-faint">No customers yet.</p>
          ) : (
            <ul className="flex max-h-64 flex-col gap-1 overflow-y-auto text-sm">
              {customers.map((c) => (
                <li key={c.id}>
                  <Link href={`/trace/customer/${c.id}`} className="underline decoration-copper/50 underline-offset-2">
                    {c.name}
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
    </>
  );
}
