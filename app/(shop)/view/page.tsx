import Link from "next/link";
import { ComparePicker } from "@/components/viewer/ComparePicker";
import { AnalysisBadge, RevisionBadge } from "@/components/library/StageBadge";
import { formatDuration } from "@/components/programs/format";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";
import { viewerIndex } from "./_data/reads";

export const metadata = { title: "3D views" };


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
              <ComparePicker
                action="/view/scans/compare"
                noun={{ one: "Scan", many: "scans" }}
                options={analysedScans.map((s) => ({ value: s.id, label: `S-${s.id} ${s.masterLabel} ${s.port}` }))}
                defaultA={analysedScans[1]?.id ?? analysedScans[0]?.id}
                defaultB={analysedScans[0]?.id}
              />
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
              <ComparePicker
                action="/view/revisions/compare"
                noun={{ one: "Revision", many: "revisions" }}
                options={revisions.map((r) => ({ value: r.id, label: `${r.programName} ${r.letter}` }))}
                defaultA={analysedRevisions[1]?.id ?? analysedRevisions[0]?.id}
                defaultB={analysedRevisions[0]?.id}
              />
            </div>
          )}
        </Card>
      </div>
    </>
  );
}
