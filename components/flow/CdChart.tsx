"use client";

/** Flow coefficient against L/D for one or several tests, on the valve-head or the curtain area. */
import { useState } from "react";
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { niceTicks } from "@/lib/flowtests/axis";
import { fixed } from "@/lib/flowtests/words";
import { styleFor } from "./palette";
import { SeriesMarker } from "./SeriesMarker";
import { AXIS_TEXT, GRID_STROKE, TOOLTIP_STYLE } from "../charts/chart-style";
import { SeriesLegend } from "./SeriesLegend";

export type CdChartSeries = { label: string; points: Array<{ ld: number; cdValve: number; cdCurtain: number }> };

const BASIS = {
  cdValve: { label: "valve-head area π·D²/4", short: "Cd on valve area" },
  cdCurtain: { label: "curtain area π·D·L", short: "Cd on curtain area" },
} as const;

export function CdChart({ series, height = 260 }: { series: CdChartSeries[]; height?: number }) {
  const [basis, setBasis] = useState<keyof typeof BASIS>("cdValve");
  const drawn = series.filter((s) => s.points.length > 0);
  if (drawn.length === 0) return null;
  const xTicks = niceTicks(Math.max(0.25, ...drawn.flatMap((s) => s.points.map((p) => p.ld))), 6);
  const yTicks = niceTicks(Math.max(...drawn.flatMap((s) => s.points.map((p) => p[basis]))), 5);
  return (
    <figure className="flex flex-col gap-2" data-testid="cd-chart">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <figcaption className="text-sm font-semibold text-ink">
          Flow coefficient against L/D <span className="font-normal text-ink-soft">— on the {BASIS[basis].label}</span>
        </figcaption>
        <div role="radiogroup" aria-label="Reference area" className="flex gap-1 text-xs print:hidden">
          {(Object.keys(BASIS) as Array<keyof typeof BASIS>).map((key) => (
            <button
              key={key}
              type="button"
              role="radio"
              aria-checked={basis === key}
              onClick={() => setBasis(key)}
              className={`rounded border px-2 py-1 ${basis === key ? "border-copper bg-copper-wash font-semibold text-copper-deep" : "border-rule bg-card text-ink-soft"}`}
            >
              {BASIS[key].short}
            </button>
          ))}
        </div>
      </div>
      {drawn.length > 1 && (
        <SeriesLegend labels={drawn.map((s) => s.label)} />
      )}
      <div style={{ height }} className="w-full print:h-56">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 20, right: 16, bottom: 22, left: 4 }}>
            <CartesianGrid stroke={GRID_STROKE} strokeDasharray="2 2" />
            <XAxis
              type="number"
              dataKey="ld"
              domain={[0, xTicks[xTicks.length - 1]]}
              ticks={xTicks}
              tick={AXIS_TEXT}
              tickFormatter={(v: number) => fixed(v, 2)}
              label={{ value: "L/D (lift over valve diameter)", position: "insideBottom", offset: -12, ...AXIS_TEXT }}
              allowDuplicatedCategory={false}
            />
            <YAxis type="number" dataKey={basis} domain={[0, yTicks[yTicks.length - 1]]} ticks={yTicks} width={44} tick={AXIS_TEXT} tickFormatter={(v: number) => fixed(v, 2)} />
            {/* At L/D 0.25 the curtain area equals the valve-head area. */}
            <ReferenceLine x={0.25} stroke="#8a8379" strokeDasharray="3 3" label={{ value: "L/D 0.25", fontSize: 10, fill: "#8a8379", position: "top" }} />
            <Tooltip
              formatter={(value) => [fixed(Number(value), 3)]}
              labelFormatter={(label) => `L/D ${fixed(Number(label), 3)}`}
              contentStyle={TOOLTIP_STYLE}
            />
            {drawn.map((s, i) => {
              const style = styleFor(i);
              return (
                <Line
                  key={`${s.label}-${i}-${basis}`}
                  data={s.points}
                  dataKey={basis}
                  name={s.label}
                  stroke={style.stroke}
                  strokeWidth={2}
                  strokeDasharray={style.dash}
                  dot={(props: { cx?: number; cy?: number; index?: number }) => <SeriesMarker key={`${i}-${props.index}`} cx={props.cx} cy={props.cy} style={style} />}
                  isAnimationActive={false}
                  type="monotone"
                />
              );
            })}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
