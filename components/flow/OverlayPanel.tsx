"use client";

/**
 * A test's charts with other tests of the same casting and port laid over it, and its gain
 * against a chosen baseline. Everything is computed from series the server already sent.
 */
import { useMemo, useState } from "react";
import { compareFlowTests } from "@/lib/flow";
import type { FlowSeries } from "@/lib/flowtests/read";
import { SUBJECT_SHORT } from "@/lib/flowtests/words";
import { inputClass } from "../ui/Field";
import { CdChart } from "./CdChart";
import { FlowChart } from "./FlowChart";
import { GainTable } from "./GainTable";

export function OverlayPanel({ own, related }: { own: FlowSeries; related: FlowSeries[] }) {
  const firstBaseline = own.subject === "baseline" ? undefined : related.find((s) => s.subject === "baseline");
  const [shown, setShown] = useState<number[]>(firstBaseline ? [firstBaseline.id] : []);
  const [baselineId, setBaselineId] = useState<number | undefined>(firstBaseline?.id);

  const series = useMemo(() => [own, ...related.filter((s) => shown.includes(s.id))], [own, related, shown]);
  const baseline = related.find((s) => s.id === baselineId);
  const comparison = useMemo(() => (baseline ? compareFlowTests(baseline, own) : null), [baseline, own]);

  return (
    <div className="flex flex-col gap-5">
      {related.length > 0 && (
        <fieldset className="rounded-md border border-rule bg-paper px-3 py-2 print:hidden">
          <legend className="px-1 text-sm font-semibold text-ink">Lay other tests of this casting and port over this one</legend>
          <div className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
            {related.map((s) => (
              <label key={s.id} className="flex items-center gap-2">
                <input
                  type="checkbox"
                  className="h-4 w-4 accent-copper"
                  checked={shown.includes(s.id)}
                  onChange={() => setShown((now) => (now.includes(s.id) ? now.filter((x) => x !== s.id) : [...now, s.id]))}
                />
                <span>
                  <span className="font-semibold">{SUBJECT_SHORT[s.subject]}</span> {s.label}
                </span>
              </label>
            ))}
          </div>
        </fieldset>
      )}
      <div className="grid gap-6 xl:grid-cols-2 print:grid-cols-1">
        <FlowChart series={series} />
        <CdChart series={series} />
      </div>
      {related.length > 0 && (
        <section className="flex flex-col gap-2" aria-label="Gain against a baseline">
          <label className="flex flex-wrap items-center gap-2 text-sm print:hidden">
            <span className="font-semibold text-ink">Gain against</span>
            <select className={inputClass()} value={baselineId ?? ""} onChange={(e) => setBaselineId(e.target.value ? Number(e.target.value) : undefined)}>
              <option value="">no comparison</option>
              {related.map((s) => (
                <option key={s.id} value={s.id}>
                  {SUBJECT_SHORT[s.subject]} {s.label}
                </option>
              ))}
            </select>
          </label>
          {baseline && comparison && <GainTable comparison={comparison} baselineLabel={`#${baseline.id}`} candidateLabel={`#${own.id} (this test)`} />}
        </section>
      )}
    </div>
  );
}
