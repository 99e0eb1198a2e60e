/**
 * The lift table with every computed column, as the math gives it. A plain component (no hooks),
 * so the test page renders it on the server and it prints as it is.
 */
import type { FlowPointResult } from "@/lib/flow";
import { fixed } from "@/lib/flowtests/words";

type Column = { key: string; title: string; unit?: string; hint: string; value: (p: FlowPointResult) => string; when?: "seat" | "section" };

const COLUMNS: Column[] = [
  { key: "liftMm", title: "Lift", unit: "mm", hint: "valve lift", value: (p) => fixed(p.liftMm, 2) },
  { key: "liftIn", title: "Lift", unit: "in", hint: "valve lift", value: (p) => fixed(p.liftIn, 3) },
  { key: "ld", title: "L/D", hint: "lift over valve diameter", value: (p) => fixed(p.ld, 3) },
  { key: "dep", title: "Depression", unit: "inH₂O", hint: "as measured at this point", value: (p) => fixed(p.depressionInH2O, 1) },
  { key: "flow", title: "Flow as tested", unit: "cfm", hint: "at the test depression, test air", value: (p) => fixed(p.flowCfm, 1) },
  { key: "flow28", title: "Flow @ 28″", unit: "cfm", hint: "moved to 28 inH₂O and standard air", value: (p) => fixed(p.flowCfmAt28, 1) },
  { key: "ls28", title: "Flow @ 28″", unit: "L/s", hint: "moved to 28 inH₂O and standard air", value: (p) => fixed(p.flowLsAt28, 1) },
  { key: "cdc", title: "Cd curtain", hint: "flow coefficient on π·D·L", value: (p) => fixed(p.cdCurtain, 3) },
  { key: "cdv", title: "Cd valve", hint: "flow coefficient on π·D²/4", value: (p) => fixed(p.cdValve, 3) },
  { key: "cds", title: "Cd seat", hint: "flow coefficient on the inner-seat area", value: (p) => fixed(p.cdSeat, 3), when: "seat" },
  { key: "v", title: "Ideal velocity", unit: "m/s", hint: "√(2ΔP/ρ) at this point", value: (p) => fixed(p.idealVelocityMs, 1) },
  { key: "vs", title: "Section velocity", unit: "m/s", hint: "mean Q/A at the minimum section", value: (p) => fixed(p.sectionVelocityMs, 1), when: "section" },
  { key: "psi", title: "Per in² valve", unit: "cfm", hint: "corrected flow per square inch of valve-head area", value: (p) => fixed(p.cfmPerSqInValve, 1) },
];

export function ComputedTable({ points, caption = "Lift table and computed columns" }: { points: FlowPointResult[]; caption?: string }) {
  const hasSeat = points.some((p) => p.cdSeat !== null);
  const hasSection = points.some((p) => p.sectionVelocityMs !== null);
  const columns = COLUMNS.filter((c) => (c.when === "seat" ? hasSeat : c.when === "section" ? hasSection : true));
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-card print:overflow-visible print:border-0">
      <table className="w-full border-collapse text-right text-sm print:text-[9pt]" data-testid="computed-table">
        <caption className="px-3 pt-2 text-left text-xs text-ink-soft">{caption}</caption>
        <thead className="bg-paper-deep text-ink-soft">
          <tr>
            {columns.map((c) => (
              <th key={c.key} scope="col" title={c.hint} className="border-b border-rule px-2 py-1.5 align-bottom font-semibold">
                {c.title}
                {c.unit && <span className="block text-xs font-normal">{c.unit}</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="font-mono">
          {points.map((p) => (
            <tr key={p.liftMm} className="border-b border-rule/60 last:border-0 odd:bg-card even:bg-paper">
              {columns.map((c) => (
                <td key={c.key} className={`px-2 py-1 ${c.key === "flow28" ? "font-semibold text-ink" : ""}`}>
                  {c.value(p)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
