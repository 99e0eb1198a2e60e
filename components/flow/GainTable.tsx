/** Gain of one test against a baseline, lift by lift (compareFlowTests of the flow math). */
import type { FlowComparison } from "@/lib/flow";
import { fixed } from "@/lib/flowtests/words";

const signed = (v: number | null, digits: number) => (v == null ? "—" : `${v >= 0 ? "+" : ""}${v.toFixed(digits)}`);

export function GainTable({ comparison, baselineLabel, candidateLabel }: { comparison: FlowComparison; baselineLabel: string; candidateLabel: string }) {
  if (comparison.rows.length === 0) {
    return <p className="text-sm text-ink-soft">The two tests share no lift range, so they cannot be compared point by point.</p>;
  }
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-soft">
        Mean gain <strong className="font-mono text-ink">{signed(comparison.meanGainPercent, 1)} %</strong>, at the top common lift{" "}
        <strong className="font-mono text-ink">{signed(comparison.gainAtTopLiftPercent, 1)} %</strong>, peak flow{" "}
        <strong className="font-mono text-ink">{signed(comparison.peakFlowGainPercent, 1)} %</strong>. Both curves interpolated at the lifts of
        either test inside the range both cover.
      </p>
      <div className="overflow-x-auto rounded-md border border-rule">
        <table className="w-full border-collapse text-right text-sm" data-testid="gain-table">
          <thead className="bg-paper-deep text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-1">
                Lift mm
              </th>
              <th scope="col" className="px-2 py-1">
                {baselineLabel}
                <span className="block text-xs font-normal">cfm @ 28″</span>
              </th>
              <th scope="col" className="px-2 py-1">
                {candidateLabel}
                <span className="block text-xs font-normal">cfm @ 28″</span>
              </th>
              <th scope="col" className="px-2 py-1">
                Gain cfm
              </th>
              <th scope="col" className="px-2 py-1">
                Gain %
              </th>
            </tr>
          </thead>
          <tbody className="font-mono">
            {comparison.rows.map((r) => (
              <tr key={r.liftMm} className="border-t border-rule/60">
                <td className="px-2 py-0.5">{fixed(r.liftMm, 2)}</td>
                <td className="px-2 py-0.5">{fixed(r.baselineCfmAt28, 1)}</td>
                <td className="px-2 py-0.5">{fixed(r.candidateCfmAt28, 1)}</td>
                <td className="px-2 py-0.5">{signed(r.gainCfm, 1)}</td>
                <td className="px-2 py-0.5">{signed(r.gainPercent, 1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
