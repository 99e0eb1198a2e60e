"use client";

/**
 * Section area along the port, one line per scan or revision (dash pattern and marker differ, not
 * only the colour), the smallest section of each marked, the valve head area and the throat
 * guideline as reference lines, and optionally the station the section slider is on.
 * The numbers behind it are in a table below (text alternative, and what people copy from).
 */
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { SeriesLegend } from "../flow/SeriesLegend";
import { styleFor } from "../flow/palette";
import { formatNumber } from "../ui/format";
import { mergeOnStations, valveReferenceAreas, type AreaSeries } from "./chart-data";
import { AXIS_TEXT, GRID_STROKE, TOOLTIP_STYLE } from "./chart-style";


export function SectionAreaChart({
  series,
  valveDiameterMm,
  guideline,
  selectedStationMm,
  height = 260,
  title = "Section area along the port",
}: {
  series: AreaSeries[];
  valveDiameterMm?: number | null;
  guideline?: { lowPercent: number; highPercent: number } | null;
  selectedStationMm?: number | null;
  height?: number;
  title?: string;
}) {
  const drawn = series.filter((s) => s.sections.length > 0);
  if (drawn.length === 0) {
    return <p className="rounded-md border border-dashed border-rule px-4 py-6 text-center text-sm text-ink-soft">No sections to chart: the scan has no analysed profile yet.</p>;
  }
  const rows = mergeOnStations(drawn);
  const refs = valveReferenceAreas(valveDiameterMm, guideline);
  return (
    <figure className="flex flex-col gap-2" data-testid="section-area-chart">
      <figcaption className="text-sm font-semibold text-ink">
        {title} <span className="font-normal text-ink-soft">— mm² against distance from the port entry along the centerline, mm</span>
      </figcaption>
      <SeriesLegend
        labels={drawn.map((s) => (
          <>
            {s.label}
            {s.min && (
              <span>
                (smallest {formatNumber(s.min.areaMm2, 0)} mm² at {formatNumber(s.min.stationMm, 1)} mm)
              </span>
            )}
          </>
        ))}
      >
        {refs.length > 0 && <li>Grey lines: {refs.map((r) => r.label).join(", ")}{refs.some((r) => r.kind === "guideline") ? " (throat guideline, common practice)" : ""}</li>}
      </SeriesLegend>
      <div style={{ height }} className="w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={rows} margin={{ top: 10, right: 18, bottom: 22, left: 6 }}>
            <CartesianGrid stroke={GRID_STROKE} strokeDasharray="2 2" />
            <XAxis type="number" dataKey="stationMm" domain={["dataMin", "dataMax"]} tick={AXIS_TEXT} tickFormatter={(v: number) => v.toFixed(0)} label={{ value: "station, mm", position: "insideBottom", offset: -12, ...AXIS_TEXT }} />
            <YAxis type="number" width={56} tick={AXIS_TEXT} tickFormatter={(v: number) => v.toFixed(0)} domain={["auto", "auto"]} label={{ value: "area, mm²", angle: -90, position: "insideLeft", offset: 4, ...AXIS_TEXT }} />
            <Tooltip
              formatter={(value, name) => [typeof value === "number" ? `${formatNumber(value, 0)} mm²` : "—", drawn[Number(String(name).slice(1))]?.label ?? String(name)]}
              labelFormatter={(label) => `station ${formatNumber(Number(label), 1)} mm`}
              contentStyle={TOOLTIP_STYLE}
            />
            {refs.map((r) => (
              <ReferenceLine key={r.label} y={r.areaMm2} stroke="#8a8379" strokeDasharray={r.kind === "valve" ? undefined : "5 4"} ifOverflow="extendDomain" label={{ value: r.label, position: "insideTopRight", fontSize: 10, fill: "#57524b" }} />
            ))}
            {selectedStationMm != null && <ReferenceLine x={selectedStationMm} stroke="#b0592d" strokeWidth={1.5} label={{ value: "slider", position: "insideTopLeft", fontSize: 10, fill: "#8e4320" }} />}
            {drawn.map((s, i) => {
              const style = styleFor(i);
              return <Line key={i} dataKey={`s${i}`} name={`s${i}`} stroke={style.stroke} strokeWidth={2} strokeDasharray={style.dash} dot={false} connectNulls isAnimationActive={false} type="monotone" />;
            })}
            {drawn.map((s, i) =>
              s.min ? <ReferenceDot key={`min-${i}`} x={Math.round(s.min.stationMm * 1000) / 1000} y={s.min.areaMm2} r={5} fill="#fffdf9" stroke={styleFor(i).stroke} strokeWidth={2} label={{ value: "smallest", position: "bottom", fontSize: 10, fill: "#23211f" }} /> : null,
            )}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-ink-soft">Numbers behind the chart</summary>
        <div className="mt-2 max-h-72 overflow-auto rounded-md border border-rule">
          <table className="w-full border-collapse text-right font-mono text-xs">
            <thead className="sticky top-0 bg-paper-deep text-ink-soft">
              <tr>
                <th scope="col" className="px-2 py-1">Station mm</th>
                {drawn.map((s, i) => (
                  <th key={i} scope="col" className="px-2 py-1 font-sans">{s.label} mm²</th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.stationMm} className="border-t border-rule/60">
                  <td className="px-2 py-0.5">{formatNumber(r.stationMm, 1)}</td>
                  {drawn.map((_, i) => (
                    <td key={i} className="px-2 py-0.5">{formatNumber(r[`s${i}`], 0)}</td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
