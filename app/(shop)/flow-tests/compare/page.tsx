import Link from "next/link";
import { CompareView } from "@/components/flow/CompareView";
import { FlowCaution, FlowConventions } from "@/components/flow/FlowConventions";
import { buttonClass } from "@/components/ui/Button";
import { EmptyState, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { idListSchema } from "@/lib/flowtests/query";
import { flowSeries } from "@/lib/flowtests/read";
import { FLOW_READERS } from "@/lib/flowtests/roles";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Flow tests overlaid" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function CompareFlowTestsPage({ searchParams }: { searchParams: Search }) {
  await requirePageRole(FLOW_READERS, "/flow-tests/compare");
  const raw = (await searchParams).ids;
  const parsed = idListSchema.safeParse(Array.isArray(raw) ? raw.join(",") : (raw ?? ""));
  const series = parsed.success ? flowSeries(db(), parsed.data) : [];
  return (
    <>
      <PageHeader
        title="Flow tests overlaid"
        subtitle="Corrected to 28 inH₂O and standard air, so tests from different days and depressions line up."
        actions={
          <Link href="/flow-tests" className={buttonClass("quiet")}>
            Back to the list
          </Link>
        }
      />
      {series.length === 0 ? (
        <EmptyState title={parsed.success ? "None of those tests exist." : "No tests named."}>
          {parsed.success ? null : parsed.error.issues[0]?.message} Pick tests in the list and choose “Overlay picked tests”.
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-5">
          <CompareView series={series} />
          <FlowConventions compact />
          <FlowCaution />
        </div>
      )}
    </>
  );
}
