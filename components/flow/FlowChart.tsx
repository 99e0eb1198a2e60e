"use client";

/**
 * Flow against lift for one or several tests, overlaid (corrected flow at 28 inH₂O, standard air).
 * Reusable: give it series of `{ label, points: { liftMm, flowCfmAt28 }[] }`. The numbers are also
 * in a table under the chart (a text alternative, and what a person copies from).
 */
import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { niceTicks } from "@/lib/flowtests/axis";
import { fixed } from "@/lib/flowtests/words";
import { styleFor } from "./palette";
import { SeriesMarker } from "./SeriesMarker";
import { AXIS_TEXT, GRID_STROKE, TOOLTIP_STYLE } from "../charts/chart-style";
import { SeriesLegend } from "./SeriesLegend";

export type FlowChartSeries = { label: string; points: Array<{ liftMm: number; flowCfmAt28: number }> };

export function FlowChart({
  series,
  height = 300,
  title = "Flow against lift",
  showTable = true,
}: {
  series: FlowChartSeries[];
  height?: number;
  title?: string;
  showTable?: boolean;
}) {
  const drawn = series.filter((s) => s.points.length > 0);
  if (drawn.length === 0) {
    return <p className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-ink-soft">No lift points to chart yet.</p>;
  }
  const xTicks = niceTicks(Math.max(...drawn.flatMap((s) => s.points.map((p) => p.liftMm))));
  const yTicks = niceTicks(Math.max(...drawn.flatMap((s) => s.points.map((p) => p.flowCfmAt28))));
  return (
    <figure className="flex flex-col gap-2" data-testid="flow-chart">
      <figcaption className="text-sm font-semibold text-ink">
        {title} <span className="font-normal text-ink-soft">— cfm at 28 inH₂O, standard air, against valve lift in mm</span>
      </figcaption>
      <SeriesLegend labels={drawn.map((s) => s.label)} />
      <div style={{ height }} className="w-full print:h-64">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 8, right: 16, bottom: 22, left: 4 }}>
            <CartesianGrid stroke={GRID_STROKE} strokeDasharray="2 2" />
            <XAxis
              type="number"
              dataKey="liftMm"
              domain={[0, xTicks[xTicks.length - 1]]}
              ticks={xTicks}
              tick={AXIS_TEXT}
              label={{ value: "lift, mm", position: "insideBottom", offset: -12, ...AXIS_TEXT }}
              allowDuplicatedCategory={false}
            />
            <YAxis
              type="number"
              dataKey="flowCfmAt28"
              domain={[0, yTicks[yTicks.length - 1]]}
              ticks={yTicks}
              width={48}
              tick={AXIS_TEXT}
              label={{ value: "cfm @ 28″", angle: -90, position: "insideLeft", offset: 8, ...AXIS_TEXT }}
            />
            <Tooltip
              formatter={(value) => [`${fixed(Number(value), 1)} cfm`]}
              labelFormatter={(label) => `lift ${fixed(Number(label), 2)} mm`}
              contentStyle={TOOLTIP_STYLE}
            />
            {drawn.map((s, i) => {
              const style = styleFor(i);
              return (
                <Line
                  key={`${s.label}-${i}`}
                  data={s.points}
                  dataKey="flowCfmAt28"
                  name={s.label}
                  stroke={style.stroke}
                  strokeWidth={2}
                  strokeDasharray={style.dash}
                  dot={(props: { cx?: number; cy?: number; index?: number }) => <SeriesMarker key={`${i}-${props.index}`} cx={props.cx} cy={props.cy} style={style} />}
                  activeDot={{ r: 5 }}
                  isAnimationActive={false}
                  type="monotone"
                />
              );
            })}
          </LineChart>
        </ResponsiveContainer>
      </div>
      {showTable && <SeriesTable series={drawn} />}
    </figure>
  );
}

/** The chart's numbers as a table: lift down the side, one column per series. */
function SeriesTable({ series }: { series: FlowChartSeries[] }) {
  const lifts = [...new Set(series.flatMap((s) => s.points.map((p) => Math.round(p.liftMm * 1000) / 1000)))].sort((a, b) => a - b);
  const lookup = series.map((s) => new Map(s.points.map((p) => [Math.round(p.liftMm * 1000) / 1000, p.flowCfmAt28])));
  return (
    <details className="text-sm print:hidden">
      <summary className="cursor-pointer text-ink-soft">Numbers behind the chart</summary>
      <div className="mt-2 overflow-x-auto rounded-md border border-rule">
        <table className="w-full border-collapse text-right font-mono text-xs">
          <thead className="bg-paper-deep text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-1">
                Lift mm
              </th>
              {series.map((s, i) => (
                <th key={i} scope="col" className="px-2 py-1 font-sans">
                  {s.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {lifts.map((lift) => (
              <tr key={lift} className="border-t border-rule/60">
                <th scope="row" className="px-2 py-0.5 font-normal">
                  {fixed(lift, 2)}
                </th>
                {lookup.map((m, i) => (
                  <td key={i} className="px-2 py-0.5">
                    {fixed(m.get(lift), 1)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
