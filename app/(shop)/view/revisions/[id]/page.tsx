import Link from "next/link";
import { notFound } from "next/navigation";
import { AnalysisView } from "@/components/programs/AnalysisView";
import { RevisionBadge } from "@/components/library/StageBadge";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { ToolpathView } from "@/components/viewer/ToolpathView";
import type { ToolpathResultLite } from "@/components/viewer/types";
import { ViewerCaution } from "@/components/viewer/ViewerCaution";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../../../_server/session";
import { pickAnalysed, revisionView } from "../../_data/reads";

export const metadata = { title: "Toolpath in 3D" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function RevisionToolpathPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Search }) {
  const { id } = await params;
  await requirePageRole(EVERYONE, `/view/revisions/${id}`);
  const view = Number.isInteger(Number(id)) ? revisionView(db(), Number(id)) : null;
  if (!view) notFound();
  const { data, toolpaths, setup, setupFromScan } = view;
  const { revision: r, program, headType } = data;
  const fileParam = Number((await searchParams).file);
  const file = pickAnalysed(toolpaths, Number.isInteger(fileParam) && fileParam > 0 ? fileParam : undefined);
  const analysis = file?.analysis ?? null;
  return (
    <>
      <PageHeader
        title={`${program.name} — revision ${r.letter} in 3D`}
        subtitle={`${program.port === "intake" ? "Intake" : "Exhaust"} · casting ${headType.castingNumber}${file ? ` · ${file.name}` : ""}`}
        actions={
          <>
            <Link href={`/programs/${program.id}/revisions/${r.id}`} className={buttonClass("quiet")}>
              The revision
            </Link>
            {r.parentId && (
              <Link href={`/view/revisions/compare?a=${r.parentId}&b=${r.id}`} className={buttonClass("secondary")}>
                Compare with revision {data.parentLetter}
              </Link>
            )}
            {data.source && (
              <Link href={`/view/scans/${data.source.id}`} className={buttonClass("secondary")}>
                Source scan in 3D
              </Link>
            )}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <RevisionBadge state={r.state} />
          {setupFromScan && <span className="text-ink-soft">Plate and machine boxes are those of the source scan (the revision names none; its analysis did not check against them).</span>}
        </div>
        {toolpaths.length > 1 && (
          <nav aria-label="Toolpath files" className="flex flex-wrap gap-2 text-sm">
            {toolpaths.map((f) => (
              <Link key={f.id} href={`/view/revisions/${r.id}?file=${f.id}`} aria-current={f.id === file?.id ? "page" : undefined} className={buttonClass(f.id === file?.id ? "primary" : "secondary", "min-h-9 px-3 text-xs")}>
                {f.name}
              </Link>
            ))}
          </nav>
        )}
        {!file || !analysis ? (
          <EmptyState title="No toolpath to draw yet.">Upload a G-code file on the revision&apos;s page; its analysis makes the preview this view draws.</EmptyState>
        ) : analysis.state !== "done" || !analysis.previewFileId ? (
          <Card title="The analysis is not finished">
            <div className="flex flex-col gap-2">
              <AnalysisView initial={analysis} canRerun={false} />
              <p className="text-sm text-ink-soft">The 3D view appears when the analysis is done: reload this page then.</p>
            </div>
          </Card>
        ) : (
          <ToolpathView analysisId={analysis.id} result={analysis.result as ToolpathResultLite} setup={setup} fileName={file.name} />
        )}
        <ViewerCaution />
      </div>
    </>
  );
}
