import Link from "next/link";
import { notFound } from "next/navigation";
import { ComputedTable } from "@/components/flow/ComputedTable";
import { FactTiles, Facts } from "@/components/flow/Facts";
import { FlowCaution, FlowConventions } from "@/components/flow/FlowConventions";
import { FlowSheetActions } from "@/components/flow/FlowSheetActions";
import { OverlayPanel } from "@/components/flow/OverlayPanel";
import { Badge } from "@/components/ui/Badge";
import { Card, Caution, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { relatedFlowTests } from "@/db/queries/flow-tests";
import { hasRole } from "@/lib/auth/guard";
import { seriesOf, flowTestView, type FlowSeries } from "@/lib/flowtests/read";
import { FLOW_EDITORS, FLOW_READERS } from "@/lib/flowtests/roles";
import { flowSheet } from "@/lib/flowtests/sheet";
import { PORT_WORDS, SUBJECT_WORDS } from "@/lib/flowtests/words";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Flow test" };

export default async function FlowTestPage({ params }: { params: Promise<{ id: string }> }) {
  const { id: raw } = await params;
  const actor = await requirePageRole(FLOW_READERS, `/flow-tests/${raw}`);
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const view = flowTestView(db(), id);
  if (!view) notFound();
  const test = view.test;
  const canEdit = hasRole(actor, FLOW_EDITORS);

  if (!view.computed.ok) {
    return (
      <>
        <PageHeader title={`Flow test #${id}`} subtitle={`${test.castingNumber ?? ""} · ${test.subjectLabel} · ${test.testedOn}`} actions={<FlowSheetActions id={id} canEdit={canEdit} />} />
        <Caution title="This test cannot be computed">
          {view.computed.issues.map((i) => (
            <p key={`${i.path}-${i.message}`}>{i.message}</p>
          ))}
          {canEdit && <p>Edit the test to correct it.</p>}
        </Caution>
      </>
    );
  }

  const result = view.computed.result;
  const sheet = flowSheet(test, result);
  const own = seriesOf(test, result)!;
  const related = relatedFlowTests(db(), test)
    .map((t) => seriesOf(t))
    .filter((s): s is FlowSeries => s !== null);
  const subjectHref = test.masterId
    ? `/masters/${test.masterId}`
    : test.revisionId && test.programId
      ? `/programs/${test.programId}/revisions/${test.revisionId}`
      : test.headId
        ? `/heads/${test.headId}`
        : null;
  const linkFilter = test.masterId ? `masterId=${test.masterId}` : test.revisionId ? `revisionId=${test.revisionId}` : test.headId ? `headId=${test.headId}` : null;

  return (
    <article className="flex flex-col gap-5" data-testid="flow-sheet">
      {/* Paper: A4 with narrow margins; the navigation and controls carry print:hidden / no-print. */}
      <style>{"@page { size: A4; margin: 12mm; }"}</style>
      <PageHeader title={sheet.title} subtitle={sheet.subtitle} actions={<FlowSheetActions id={id} canEdit={canEdit} />} />
      <div className="-mt-2 flex flex-wrap items-center gap-2">
        <Badge tone="copper">{SUBJECT_WORDS[test.subject]}</Badge>
        <Badge>{PORT_WORDS[test.port]}</Badge>
        {test.entryRadius && <Badge>Entry radius</Badge>}
        {test.exhaustPipe && <Badge>Exhaust pipe</Badge>}
        {linkFilter && (
          <Link href={`/flow-tests?${linkFilter}`} className="text-sm text-copper underline underline-offset-2 print:hidden">
            All tests of {test.subjectLabel}
          </Link>
        )}
        {subjectHref && (
          <Link href={subjectHref} className="text-sm text-copper underline underline-offset-2 print:hidden">
            Open {test.subjectLabel}
          </Link>
        )}
      </div>

      <div className="grid gap-4 lg:grid-cols-2 print:grid-cols-2 print:gap-2">
        <Card title="What was tested">
          <Facts items={sheet.tested} />
        </Card>
        <Card title="Bench, air and valve">
          <Facts items={sheet.bench} />
        </Card>
      </div>
      <Card title="Results, corrected to 28 inH₂O and standard air">
        <FactTiles items={sheet.summary} testId="flow-summary" />
      </Card>

      {sheet.warnings.length > 0 && (
        <Caution title="Check these">
          {sheet.warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
        </Caution>
      )}

      <Card title="Charts" className="print:break-inside-avoid">
        <OverlayPanel own={own} related={related} />
      </Card>

      <ComputedTable points={result.points} />

      {sheet.estimates.length > 0 && (
        <Card title="Estimates (common practice)">
          <Facts items={sheet.estimates} />
        </Card>
      )}
      {test.notes && (
        <Card title="Notes">
          <p className="whitespace-pre-wrap text-sm">{test.notes}</p>
        </Card>
      )}
      <FlowConventions />
      <FlowCaution />
    </article>
  );
}
