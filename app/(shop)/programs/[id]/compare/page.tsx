import Link from "next/link";
import { notFound } from "next/navigation";
import { RevisionBadge } from "@/components/library/StageBadge";
import { formatDuration, formatSigned } from "@/components/programs/format";
import { SectionProfileChart } from "@/components/programs/SectionProfileChart";
import { Card, Caution, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatNumber } from "@/components/ui/format";
import { db } from "@/db/client";
import { revisionAnalyses } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { compareRevisions, type Delta, type PortReportLike, type ToolpathReportLike } from "@/lib/programs/compare";
import { requirePageRole } from "../../../../_server/session";
import { RevisionCharts } from "../../../view/revisions/compare/RevisionCharts";

export const metadata = { title: "Compare revisions" };

function Row({ label, d, fmt, unit = "" }: { label: string; d: Delta; fmt: (v: number | null) => string; unit?: string }) {
  const tone = d.diff == null || d.diff === 0 ? "" : d.diff > 0 ? "text-warn" : "text-ok";
  return (
    <tr className="border-b border-rule/60">
      <th scope="row" className="py-1.5 pr-4 text-left font-semibold text-ink-soft">{label}</th>
      <td className="font-mono">{fmt(d.a)}</td>
      <td className="font-mono">{fmt(d.b)}</td>
      <td className={`font-mono ${tone}`}>
        {d.diff == null ? "—" : `${formatSigned(d.diff, unit === "s" ? 0 : 1, unit)}${d.percent != null ? ` (${formatSigned(d.percent, 1, "%")})` : ""}`}
      </td>
    </tr>
  );
}

export default async function ComparePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ a?: string; b?: string }> }) {
  const { id } = await params;
  const sp = await searchParams;
  await requirePageRole(EVERYONE, `/programs/${id}/compare`);
  const a = revisionAnalyses(db(), Number(sp.a));
  const b = revisionAnalyses(db(), Number(sp.b));
  if (!a || !b || a.revision.program.id !== Number(id) || b.revision.program.id !== Number(id)) notFound();
  const cmp = compareRevisions({ toolpaths: a.toolpaths as ToolpathReportLike[], scan: a.scan as PortReportLike | null }, { toolpaths: b.toolpaths as ToolpathReportLike[], scan: b.scan as PortReportLike | null });
  const la = a.revision.revision.letter;
  const lb = b.revision.revision.letter;
  const n1 = (v: number | null) => formatNumber(v, 1);
  const n0 = (v: number | null) => formatNumber(v, 0);
  const head = (
    <thead>
      <tr className="border-b border-rule text-left text-ink-soft">
        <th />
        <th>Revision {la}</th>
        <th>Revision {lb}</th>
        <th>{lb} − {la}</th>
      </tr>
    </thead>
  );
  return (
    <>
      <PageHeader title={`${a.revision.program.name}: revision ${la} against ${lb}`} subtitle="Differences of the computed analyses, side by side." actions={<Link href={`/programs/${id}`} className="text-sm text-copper-deep underline">Back to the program</Link>} />
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap gap-4 text-sm">
          <span>{la}: <RevisionBadge state={a.revision.revision.state} /> {cmp.toolpathFiles.a} analysed toolpath file(s)</span>
          <span>{lb}: <RevisionBadge state={b.revision.revision.state} /> {cmp.toolpathFiles.b} analysed toolpath file(s)</span>
        </div>
        <Caution title="Estimates">
          <p>These are computed figures; prove every new revision with a first-article cut, a wall-thickness check near the water jackets and seats, and the flow bench. Guards closed, eye protection on.</p>
        </Caution>
        <Card title="Time and path">
          {cmp.toolpathFiles.a + cmp.toolpathFiles.b === 0 ? (
            <EmptyState title="Neither revision has an analysed toolpath yet." />
          ) : (
            <table className="w-full text-sm" data-testid="compare-times">
              {head}
              <tbody>
                <Row label="Cycle time" d={cmp.cycleTimeS} fmt={formatDuration} unit="s" />
                <Row label="Feed time" d={cmp.feedTimeS} fmt={formatDuration} unit="s" />
                <Row label="Rapid time" d={cmp.rapidTimeS} fmt={formatDuration} unit="s" />
                <Row label="Cutting length (mm)" d={cmp.feedLengthMm} fmt={n0} unit="mm" />
                <Row label="Rapid length (mm)" d={cmp.rapidLengthMm} fmt={n0} unit="mm" />
                <Row label="Tool changes" d={cmp.toolChanges} fmt={n0} />
                <Row label="Lines" d={cmp.lines} fmt={n0} />
                <Row label="Limits broken" d={cmp.violations} fmt={n0} />
              </tbody>
            </table>
          )}
        </Card>
        <div className="grid gap-4 lg:grid-cols-2">
          <Card title="Bounds (work coordinates)">
            <table className="w-full text-sm">
              <thead><tr className="border-b border-rule text-left text-ink-soft"><th>Axis</th><th>{la}</th><th>{lb}</th><th>Δ min / Δ max</th></tr></thead>
              <tbody>
                {cmp.axes.map((r) => (
                  <tr key={r.axis} className="border-b border-rule/60 font-mono">
                    <td className="font-semibold">{r.axis}</td>
                    <td>{r.a ? `${n1(r.a.min)} … ${n1(r.a.max)}` : "—"}</td>
                    <td>{r.b ? `${n1(r.b.min)} … ${n1(r.b.max)}` : "—"}</td>
                    <td>{formatSigned(r.minDiff, 2)} / {formatSigned(r.maxDiff, 2)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Card>
          <Card title="Tools">
            <table className="w-full text-sm">
              <thead><tr className="border-b border-rule text-left text-ink-soft"><th>Tool</th><th>Change</th><th>{la} cutting</th><th>{lb} cutting</th></tr></thead>
              <tbody>
                {cmp.tools.map((t) => (
                  <tr key={t.number} className="border-b border-rule/60">
                    <td className="font-mono font-semibold">T{t.number}</td>
                    <td>{{ added: "Added in B", removed: "Removed in B", changed: "Changed", same: "Same" }[t.change]}</td>
                    <td className="font-mono">{t.a ? formatDuration(t.a.feedTimeS) : "—"}</td>
                    <td className="font-mono">{t.b ? formatDuration(t.b.feedTimeS) : "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Card>
        </div>
        <Card title="Section profile (from the source scans)">
          {cmp.profile ? (
            <div className="flex flex-col gap-3">
              <table className="w-full text-sm">
                {head}
                <tbody>
                  <Row label="Smallest section (mm²)" d={cmp.profile.minAreaMm2} fmt={n0} unit="mm²" />
                  <Row label="…at station (mm)" d={cmp.profile.minStationMm} fmt={n1} unit="mm" />
                  <Row label="…% of valve" d={cmp.profile.minPercentOfValve} fmt={n1} />
                  <Row label="Volume (cc)" d={cmp.profile.volumeCc} fmt={n1} unit="cc" />
                  <Row label="Centerline (mm)" d={cmp.profile.lengthMm} fmt={n1} unit="mm" />
                </tbody>
              </table>
              <SectionProfileChart
                series={[
                  { name: `Revision ${la}`, points: cmp.profile.points.map((p) => ({ stationMm: p.stationMm, areaMm2: p.a })) },
                  { name: `Revision ${lb}`, points: cmp.profile.points.map((p) => ({ stationMm: p.stationMm, areaMm2: p.b })) },
                ]}
              />
            </div>
          ) : (
            <EmptyState title="No section profile to compare.">Both revisions need a source scan with an analysed point cloud.</EmptyState>
          )}
        </Card>
        <RevisionCharts a={a.revision.revision.id} b={b.revision.revision.id} parts={["bars", "flow"]} />
      </div>
    </>
  );
}
