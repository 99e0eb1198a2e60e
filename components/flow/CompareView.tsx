"use client";

/**
 * Several tests side by side: overlaid curves, each test's gain against a chosen baseline, and
 * the exhaust/intake ratio when an intake and an exhaust test are both in the set.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import { RATIO_GUIDELINE, compareFlowTests, exhaustIntakeRatio } from "@/lib/flow";
import type { FlowSeries } from "@/lib/flowtests/read";
import { PORT_WORDS, SUBJECT_SHORT, fixed } from "@/lib/flowtests/words";
import { Badge } from "../ui/Badge";
import { inputClass } from "../ui/Field";
import { CdChart } from "./CdChart";
import { FlowChart } from "./FlowChart";
import { GainTable } from "./GainTable";

export function CompareView({ series }: { series: FlowSeries[] }) {
  const [baselineId, setBaselineId] = useState<number>((series.find((s) => s.subject === "baseline") ?? series[0]).id);
  const baseline = series.find((s) => s.id === baselineId)!;
  const others = series.filter((s) => s.id !== baselineId);
  const intake = series.find((s) => s.port === "intake");
  const exhaust = series.find((s) => s.port === "exhaust");
  const ratio = useMemo(() => (intake && exhaust ? exhaustIntakeRatio(exhaust, intake) : null), [intake, exhaust]);

  return (
    <div className="flex flex-col gap-6">
      <ul className="flex flex-col gap-1 text-sm">
        {series.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center gap-2">
            <Badge>{SUBJECT_SHORT[s.subject]}</Badge>
            <Badge>{PORT_WORDS[s.port]}</Badge>
            <Link href={`/flow-tests/${s.id}`} className="text-copper underline underline-offset-2">
              {s.label}
            </Link>
            <span className="font-mono text-ink-soft">peak {fixed(Math.max(...s.points.map((p) => p.flowCfmAt28)), 1)} cfm</span>
          </li>
        ))}
      </ul>
      <div className="grid gap-6 xl:grid-cols-2">
        <FlowChart series={series} />
        <CdChart series={series} />
      </div>

      {others.length > 0 && (
        <section className="flex flex-col gap-3" aria-label="Gains">
          <label className="flex flex-wrap items-center gap-2 text-sm">
            <span className="font-semibold">Gains against</span>
            <select className={inputClass()} value={baselineId} onChange={(e) => setBaselineId(Number(e.target.value))}>
              {series.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.label}
                </option>
              ))}
            </select>
          </label>
          {others.map((s) => (
            <div key={s.id} className="flex flex-col gap-1">
              <h3 className="text-sm font-semibold">
                {s.label} against {baseline.label}
                {s.port !== baseline.port && <span className="ml-2 font-normal text-warn">(different ports: a gain here means little)</span>}
              </h3>
              <GainTable comparison={compareFlowTests(baseline, s)} baselineLabel={`#${baseline.id}`} candidateLabel={`#${s.id}`} />
            </div>
          ))}
        </section>
      )}

      {ratio && intake && exhaust && (
        <section className="flex flex-col gap-2" aria-label="Exhaust to intake ratio">
          <h3 className="text-sm font-semibold">
            Exhaust #{exhaust.id} over intake #{intake.id} at equal lift
          </h3>
          <p className="text-sm text-ink-soft">
            Mean ratio <strong className="font-mono text-ink">{ratio.meanRatio == null ? "—" : `${fixed(ratio.meanRatio * 100, 1)} %`}</strong>
            {ratio.withinGuideline == null ? "" : ratio.withinGuideline ? " — inside " : " — outside "}
            the usual {RATIO_GUIDELINE.low * 100}–{RATIO_GUIDELINE.high * 100} % band. {RATIO_GUIDELINE.label}.
          </p>
          <div className="overflow-x-auto rounded-md border border-rule">
            <table className="w-full border-collapse text-right font-mono text-sm">
              <thead className="bg-paper-deep font-sans text-ink-soft">
                <tr>
                  <th scope="col" className="px-2 py-1">
                    Lift mm
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Intake cfm @ 28″
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Exhaust cfm @ 28″
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Ratio %
                  </th>
                </tr>
              </thead>
              <tbody>
                {ratio.rows.map((r) => (
                  <tr key={r.liftMm} className="border-t border-rule/60">
                    <td className="px-2 py-0.5">{fixed(r.liftMm, 2)}</td>
                    <td className="px-2 py-0.5">{fixed(r.intakeCfmAt28, 1)}</td>
                    <td className="px-2 py-0.5">{fixed(r.exhaustCfmAt28, 1)}</td>
                    <td className="px-2 py-0.5">{r.ratio == null ? "—" : fixed(r.ratio * 100, 1)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      )}
    </div>
  );
}
