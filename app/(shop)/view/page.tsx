import Link from "next/link";
import { AnalysisBadge, RevisionBadge } from "@/components/library/StageBadge";
import { formatDuration } from "@/components/programs/format";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";
import { viewerIndex } from "./_data/reads";

export const metadata = { title: "3D views" };

const SELECT = "min-h-10 rounded-md border border-rule bg-card px-2 text-sm";

export default async function ViewIndexPage() {
  await requirePageRole(EVERYONE, "/view");
  const { scans, revisions } = viewerIndex(db());
  const analysedScans = scans.filter((s) => s.analysisState === "done");
  const analysedRevisions = revisions.filter((r) => r.cycleTimeS !== null);
  return (
    <>
      <PageHeader title="3D views" subtitle="Toolpaths, digitized ports with their sections, and comparisons — drawn from the stored analyses." />
      <div className="grid gap-4 xl:grid-cols-2">
        <Card title="Digitized ports">
          {scans.length === 0 ? (
            <EmptyState title="No scans yet.">Record a digitizing run and upload its point cloud; its analysis makes the view.</EmptyState>
          ) : (
            <div className="flex flex-col gap-4">
              <table className="w-full text-left text-sm" data-testid="view-scans">
                <thead>
                  <tr className="border-b border-rule text-ink-soft">
                    <th className="py-1 font-semibold">Scan</th>
                    <th className="font-semibold">Master · port</th>
                    <th className="font-semibold">Scanned</th>
                    <th className="font-semibold">Analysis</th>
                  </tr>
                </thead>
                <tbody>
                  {scans.map((s) => (
                    <tr key={s.id} className="border-b border-rule/50">
                      <td className="py-1.5">
                        {s.analysisState === "done" ? (
                          <Link href={`/view/scans/${s.id}`} className="font-mono font-semibold text-copper-deep hover:underline">
                            S-{s.id}
                          </Link>
                        ) : (
                          <span className="font-mono">S-{s.id}</span>
                        )}
                      </td>
                      <td>
                        {s.masterLabel} · {s.port}
                      </td>
                      <td className="font-mono">{formatDate(s.scannedOn)}</td>
                      <td>
                        <AnalysisBadge state={s.analysisState as "queued" | "running" | "done" | "failed" | null} />
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <form action="/view/scans/compare" className="flex flex-wrap items-end gap-2" aria-label="Compare two scans">
                <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
                  Scan A
                  <select name="a" className={SELECT} required defaultValue={analysedScans[1]?.id ?? analysedScans[0]?.id}>
                    {analysedScans.map((s) => (
                      <option key={s.id} value={s.id}>
                        S-{s.id} {s.masterLabel} {s.port}
                      </option>
                    ))}
                  </select>
                </label>
                <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
                  Scan B
                  <select name="b" className={SELECT} required defaultValue={analysedScans[0]?.id}>
                    {analysedScans.map((s) => (
                      <option key={s.id} value={s.id}>
                        S-{s.id} {s.masterLabel} {s.port}
                      </option>
                    ))}
                  </select>
                </label>
                <button type="submit" className={buttonClass("secondary")} disabled={analysedScans.length < 2}>
                  Compare the scans
                </button>
              </form>
            </div>
          )}
        </Card>
        <Card title="Program revisions">
          {revisions.length === 0 ? (
            <EmptyState title="No revisions yet.">Create a program revision and upload its toolpath.</EmptyState>
          ) : (
            <div className="flex flex-col gap-4">
              <table className="w-full text-left text-sm" data-testid="view-revisions">
                <thead>
                  <tr className="border-b border-rule text-ink-soft">
                    <th className="py-1 font-semibold">Program · revision</th>
                    <th className="font-semibold">State</th>
                    <th className="font-semibold">Cycle time</th>
                  </tr>
                </thead>
                <tbody>
                  {revisions.map((r) => (
                    <tr key={r.id} className="border-b border-rule/50">
                      <td className="py-1.5">
                        {r.cycleTimeS !== null ? (
                          <Link href={`/view/revisions/${r.id}`} className="font-semibold text-copper-deep hover:underline">
                            {r.programName} {r.letter}
                          </Link>
                        ) : (
                          <span>
                            {r.programName} {r.letter}
                          </span>
                        )}
                        <span className="text-ink-soft"> · {r.castingNumber}</span>
                      </td>
                      <td>
                        <RevisionBadge state={r.state} />
                      </td>
                      <td className="font-mono">{r.cycleTimeS !== null ? formatDuration(r.cycleTimeS) : "not analysed"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <form action="/view/revisions/compare" className="flex flex-wrap items-end gap-2" aria-label="Compare two revisions">
                <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
                  Revision A
                  <select name="a" className={SELECT} required defaultValue={analysedRevisions[1]?.id ?? analysedRevisions[0]?.id}>
                    {revisions.map((r) => (
                      <option key={r.id} value={r.id}>
                        {r.programName} {r.letter}
                      </option>
                    ))}
                  </select>
                </label>
                <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
                  Revision B
                  <select name="b" className={SELECT} required defaultValue={analysedRevisions[0]?.id}>
                    {revisions.map((r) => (
                      <option key={r.id} value={r.id}>
                        {r.programName} {r.letter}
                      </option>
                    ))}
                  </select>
                </label>
                <button type="submit" className={buttonClass("secondary")} disabled={revisions.length < 2}>
                  Compare the revisions
                </button>
              </form>
            </div>
          )}
        </Card>
      </div>
    </>
  );
}
