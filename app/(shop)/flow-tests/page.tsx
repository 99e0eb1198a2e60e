import Link from "next/link";
import { FlowTestsTable, type FlowListFilters } from "@/components/flow/FlowTestsTable";
import { FlowConventions } from "@/components/flow/FlowConventions";
import { buttonClass } from "@/components/ui/Button";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { filterLabels } from "@/db/queries/flow-tests";
import { hasRole } from "@/lib/auth/guard";
import { paramsRecord } from "@/lib/paging";
import { flowTestListQuerySchema } from "@/lib/flowtests/query";
import { FLOW_READERS, FLOW_RECORDERS } from "@/lib/flowtests/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Flow tests" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function FlowTestsPage({ searchParams }: { searchParams: Search }) {
  const actor = await requirePageRole(FLOW_READERS, "/flow-tests");
  const parsed = flowTestListQuerySchema.safeParse(paramsRecord(await searchParams));
  // A malformed link shows the whole list rather than an error page.
  const query = parsed.success ? parsed.data : flowTestListQuerySchema.parse({});
  const filters: FlowListFilters = {};
  for (const key of ["headTypeId", "masterId", "revisionId", "headId", "subject", "port"] as const) {
    if (query[key] !== undefined) filters[key] = String(query[key]);
  }
  const about = filterLabels(db(), query);
  const newHref = `/flow-tests/new${query.headTypeId || query.masterId || query.revisionId || query.headId ? `?${new URLSearchParams(filters as Record<string, string>).toString()}` : ""}`;
  return (
    <>
      <PageHeader
        title={about.length ? `Flow tests of ${about.join(", ")}` : "Flow tests"}
        subtitle="Flow-bench results of stock baselines, masters, first cuts of program revisions and production heads. Corrected to 28 inH₂O and standard air."
        actions={
          <>
            {about.length > 0 && (
              <Link href="/flow-tests" className={buttonClass("quiet")}>
                Show all tests
              </Link>
            )}
            {hasRole(actor, FLOW_RECORDERS) && (
              <Link href={newHref} className={buttonClass("primary")} data-testid="record-flow-test">
                Record a flow test
              </Link>
            )}
          </>
        }
      />
      <div className="flex flex-col gap-5">
        <FlowTestsTable filters={filters} />
        <FlowConventions compact />
      </div>
    </>
  );
}
