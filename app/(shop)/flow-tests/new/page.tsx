import { FlowTestForm } from "@/components/flow/FlowTestForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { linkedHeadType } from "@/db/queries/flow-tests";
import { paramsRecord } from "@/lib/paging";
import { flowTestListQuerySchema } from "@/lib/flowtests/query";
import { FLOW_RECORDERS } from "@/lib/flowtests/roles";
import type { FlowTestRecordInput } from "@/lib/flowtests/schema";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Record a flow test" };

type Search = Promise<Record<string, string | string[] | undefined>>;

/** Today in the server's calendar (the shop's), as YYYY-MM-DD. */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

export default async function NewFlowTestPage({ searchParams }: { searchParams: Search }) {
  await requirePageRole(FLOW_RECORDERS, "/flow-tests/new");
  // Other screens link here with ?masterId=, ?revisionId=, ?headId= or ?headTypeId= to pre-fill.
  const parsed = flowTestListQuerySchema.safeParse(paramsRecord(await searchParams));
  const q = parsed.success ? parsed.data : flowTestListQuerySchema.parse({});
  const linked = linkedHeadType(db(), q);
  const subject = q.revisionId ? "revision" : q.masterId ? "master" : q.headId ? "head" : "baseline";
  const initial: FlowTestRecordInput = {
    headTypeId: (linked?.headTypeId ?? q.headTypeId) as number,
    subject,
    masterId: q.masterId,
    revisionId: q.revisionId,
    headId: q.headId,
    port: linked?.port ?? q.port ?? "intake",
    testedOn: today(),
    depression: 28,
    depressionUnit: "inH2O",
    ambient: { temperatureUnit: "C", pressureUnit: "kPa" },
    valveDiameter: undefined as unknown as number,
    lengthUnit: "mm",
    areaUnit: "mm2",
    entryRadius: false,
    exhaustPipe: false,
    notes: "",
    liftUnit: "mm",
    flowUnit: "cfm",
    points: [],
  };
  return (
    <>
      <PageHeader title="Record a flow test" subtitle="What was on the bench, the bench and the air, the valve, and the lift table — typed or from the bench's CSV." />
      <FlowTestForm mode="create" initial={initial} />
    </>
  );
}
