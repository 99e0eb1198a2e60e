"use client";

/**
 * Area difference per station between two profiles (B − A): bars up where B has more room, down
 * where it has less; the largest gain and loss are said in words above the chart.
 */
import { Bar, BarChart, CartesianGrid, Cell, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { formatNumber } from "../ui/format";
import { extremes, profileDifference, type AreaPoint } from "./chart-data";
import { AXIS_TEXT, GRID_STROKE, TOOLTIP_STYLE } from "./chart-style";


const signed = (v: number, digits: number) => `${v > 0 ? "+" : v < 0 ? "−" : "±"}${formatNumber(Math.abs(v), digits)}`;

export function AreaDifferenceChart({ a, b, labelA, labelB, stepMm = 2, height = 220 }: { a: AreaPoint[]; b: AreaPoint[]; labelA: string; labelB: string; stepMm?: number; height?: number }) {
  const points = profileDifference(a, b, stepMm).filter((p) => p.diff !== null);
  if (points.length === 0) {
    return <p className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-ink-soft">The two profiles share no stations to compare.</p>;
  }
  const { gain, loss } = extremes(points);
  return (
    <figure className="flex flex-col gap-2" data-testid="area-difference-chart">
      <figcaption className="text-sm font-semibold text-ink">
        Area change per station, {labelB} − {labelA} <span className="font-normal text-ink-soft">— mm²; up: more room in {labelB}</span>
      </figcaption>
      <p className="text-xs text-ink-soft" data-testid="area-difference-words">
        {gain ? <>Largest gain {signed(gain.diff!, 0)} mm² ({signed(gain.percent ?? 0, 1)} %) at {formatNumber(gain.stationMm, 1)} mm. </> : "No station gained area. "}
        {loss ? <>Largest loss {signed(loss.diff!, 0)} mm² ({signed(loss.percent ?? 0, 1)} %) at {formatNumber(loss.stationMm, 1)} mm.</> : "No station lost area."}
      </p>
      <div style={{ height }} className="w-full">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={points} margin={{ top: 8, right: 18, bottom: 22, left: 6 }}>
            <CartesianGrid stroke={GRID_STROKE} strokeDasharray="2 2" />
            <XAxis dataKey="stationMm" tick={AXIS_TEXT} tickFormatter={(v: number) => v.toFixed(0)} label={{ value: "station, mm", position: "insideBottom", offset: -12, ...AXIS_TEXT }} />
            <YAxis width={56} tick={AXIS_TEXT} tickFormatter={(v: number) => v.toFixed(0)} label={{ value: "B − A, mm²", angle: -90, position: "insideLeft", offset: 4, ...AXIS_TEXT }} />
            <Tooltip
              formatter={(value) => [`${signed(Number(value), 1)} mm²`, `${labelB} − ${labelA}`]}
              labelFormatter={(label) => `station ${formatNumber(Number(label), 1)} mm`}
              contentStyle={TOOLTIP_STYLE}
            />
            <ReferenceLine y={0} stroke="#33312e" />
            <Bar dataKey="diff" isAnimationActive={false}>
              {points.map((p) => (
                <Cell key={p.stationMm} fill={p.diff! >= 0 ? "#b0592d" : "#2f5d8a"} />
              ))}
            </Bar>
          </BarChart>
        </ResponsiveContainer>
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-ink-soft">Numbers behind the chart</summary>
        <div className="mt-2 max-h-72 overflow-auto rounded-md border border-rule">
          <table className="w-full border-collapse text-right font-mono text-xs">
            <thead className="sticky top-0 bg-paper-deep text-ink-soft">
              <tr>
                <th scope="col" className="px-2 py-1">Station mm</th>
                <th scope="col" className="px-2 py-1 font-sans">{labelA} mm²</th>
                <th scope="col" className="px-2 py-1 font-sans">{labelB} mm²</th>
                <th scope="col" className="px-2 py-1 font-sans">Change mm²</th>
                <th scope="col" className="px-2 py-1 font-sans">Change %</th>
              </tr>
            </thead>
            <tbody>
              {points.map((p) => (
                <tr key={p.stationMm} className="border-t border-rule/60">
                  <td className="px-2 py-0.5">{formatNumber(p.stationMm, 1)}</td>
                  <td className="px-2 py-0.5">{formatNumber(p.a, 0)}</td>
                  <td className="px-2 py-0.5">{formatNumber(p.b, 0)}</td>
                  <td className="px-2 py-0.5">{signed(p.diff!, 1)}</td>
                  <td className="px-2 py-0.5">{p.percent === null ? "—" : signed(p.percent, 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
