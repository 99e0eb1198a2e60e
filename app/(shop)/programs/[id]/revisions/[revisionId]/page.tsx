import Link from "next/link";
import { notFound } from "next/navigation";
import { Details } from "@/components/library/Details";
import { RevisionBadge } from "@/components/library/StageBadge";
import { FileList } from "@/components/programs/FileList";
import { RevisionActions } from "@/components/programs/RevisionActions";
import { ViewerSlot } from "@/components/programs/ViewerSlot";
import { SetupSheetUploader } from "@/components/uploads/PhotoUploader";
import { UploadThenRefresh } from "@/components/uploads/UploadThenRefresh";
import { buttonClass } from "@/components/ui/Button";
import { Card, Caution, PageHeader } from "@/components/ui/Card";
import { formatDateTime } from "@/components/ui/format";
import { db } from "@/db/client";
import { getRevision } from "@/db/queries/programs";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { REVISION_EDITORS } from "@/lib/programs/revisions";
import { isEditable, REVISION_STATE_LABEL } from "@/lib/programs/states";
import { requirePageRole } from "../../../../../_server/session";

export default async function RevisionPage({ params }: { params: Promise<{ id: string; revisionId: string }> }) {
  const { id, revisionId } = await params;
  const actor = await requirePageRole(EVERYONE, `/programs/${id}/revisions/${revisionId}`);
  const data = getRevision(db(), Number(revisionId));
  if (!data || data.program.id !== Number(id)) notFound();
  kickAnalyses(db());
  const { revision: r, program, headType, source, files, moves, flowTestCount } = data;
  const toolpaths = files.filter((f) => f.role === "toolpath");
  const sheets = files.filter((f) => f.role === "setup_sheet");
  const editable = isEditable(r.state);
  const canUpload = editable && hasRole(actor, MACHINISTS);
  const canRemove = editable && hasRole(actor, REVISION_EDITORS);
  const analysed = toolpaths.find((f) => f.analysis?.state === "done");
  return (
    <>
      <PageHeader
        title={`${program.name} — revision ${r.letter}`}
        subtitle={`${program.port === "intake" ? "Intake" : "Exhaust"} · casting ${headType.castingNumber}`}
        actions={
          <>
            <Link href={`/programs/${program.id}`} className={buttonClass("quiet")}>All revisions</Link>
            {editable && hasRole(actor, REVISION_EDITORS) && <Link href={`/programs/${program.id}/revisions/${r.id}/edit`} className={buttonClass("secondary")}>Edit draft</Link>}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <Card title="State">
          <div className="flex flex-col gap-3" id="sign">
            <div className="flex flex-wrap items-center gap-3 text-sm">
              <span data-testid="revision-state"><RevisionBadge state={r.state} /></span>
              {r.state === "released" && <span>Released by {data.releasedByName} on {formatDateTime(r.releasedAt)}</span>}
              {r.endReason && <span className="text-ink-soft">— {r.endReason}</span>}
            </div>
            {r.releaseSignature && (
              <p className="break-all font-mono text-xs text-ink-faint" data-testid="release-signature">Signature {r.releaseSignature}</p>
            )}
            {r.releaseOverrideReason && <p className="text-sm">Released without a flow test: {r.releaseOverrideReason}</p>}
            <RevisionActions revisionId={r.id} letter={r.letter} state={r.state} role={actor.role} flowTestCount={flowTestCount} />
          </div>
        </Card>
        <Card title="Revision">
          <Details
            columns={4}
            items={[
              ["Parent", r.parentId ? <Link key="p" href={`/programs/${program.id}/revisions/${r.parentId}`} className="font-mono text-copper-deep hover:underline">{data.parentLetter}</Link> : "none"],
              ["Source scan", source ? <Link key="s" href={`/scans/${source.id}`} className="font-mono text-copper-deep hover:underline">S-{source.id} ({source.masterLabel})</Link> : "none"],
              ["Plate", data.plateCode],
              ["Machine", data.machineName],
              ["Created by", data.createdByName],
              ["Created", formatDateTime(r.createdAt)],
              ["Flow tests linked", flowTestCount],
              ["State", REVISION_STATE_LABEL[r.state]],
            ]}
          />
          <p className="mt-3 whitespace-pre-wrap text-sm"><span className="font-semibold">Change: </span>{r.changeNote}</p>
        </Card>
        <Caution title="Safety and estimates">
          <p>Every new revision gets a first-article check before production: measure the cut port and check wall thickness near the water jackets and the valve seats.</p>
          <p>Run programs with the guards closed and eye protection on; follow the machine builder&apos;s instructions and local codes.</p>
          <p>Cycle times, bounds and checks below are computed estimates; the machine, the bench and the inspection decide.</p>
        </Caution>
        <Card title="Toolpaths and analysis">
          <div className="flex flex-col gap-4">
            <FileList files={toolpaths} canRerun={hasRole(actor, MACHINISTS)} emptyTitle="No toolpath uploaded yet." removableFrom={canRemove ? r.id : undefined} />
            {canUpload && <UploadThenRefresh kind="toolpath" target={{ revisionId: r.id }} label="Upload a toolpath (G-code)" />}
            {!editable && <p className="text-xs text-ink-faint">The files of a revision are fixed once it leaves draft.</p>}
            {toolpaths.length > 1 && <p className="text-xs text-ink-soft">Cuts and machine delivery use the first toolpath uploaded; remove the others from the draft if they are not meant to be run.</p>}
          </div>
        </Card>
        <ViewerSlot kind="toolpath" analysisId={analysed?.analysis?.id ?? null} href={`/view/revisions/${r.id}`} />
        <Card title="Setup sheet">
          <div className="flex flex-col gap-3">
            <FileList files={sheets} canRerun={false} emptyTitle="No setup sheet." removableFrom={canRemove ? r.id : undefined} />
            {canUpload && <SetupSheetUploader revisionId={r.id} />}
          </div>
        </Card>
        <Card title="Moves">
          <ol className="flex flex-col gap-1 text-sm" data-testid="moves">
            {moves.map((m) => (
              <li key={m.id}>
                <span className="font-mono text-xs text-ink-faint">{formatDateTime(m.at)}</span> · {m.fromState ? `${REVISION_STATE_LABEL[m.fromState as keyof typeof REVISION_STATE_LABEL]} → ` : ""}
                <strong>{REVISION_STATE_LABEL[m.toState as keyof typeof REVISION_STATE_LABEL]}</strong> by {m.byName ?? "—"}
                {m.note && <span className="text-ink-soft"> — {m.note}</span>}
              </li>
            ))}
          </ol>
        </Card>
      </div>
    </>
  );
}
