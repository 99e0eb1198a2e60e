"use client";

/** Section area along the port (station from the entry), one line per scan or revision. */
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { GRID_STROKE } from "../charts/chart-style";

const COLOURS = ["#b0592d", "#33312e", "#2f6b3f", "#8a5a00"];

export function SectionProfileChart({ series }: { series: Array<{ name: string; points: Array<{ stationMm: number; areaMm2: number | null }> }> }) {
  const stations = [...new Set(series.flatMap((s) => s.points.map((p) => p.stationMm)))].sort((a, b) => a - b);
  const data = stations.map((st) => {
    const row: Record<string, number | null> = { stationMm: st };
    for (const s of series) row[s.name] = s.points.find((p) => p.stationMm === st)?.areaMm2 ?? null;
    return row;
  });
  if (data.length === 0) return <p className="text-sm text-ink-soft">No sections to draw.</p>;
  return (
    <figure className="h-64 w-full" aria-label="Section area along the port">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={data} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
          <CartesianGrid stroke={GRID_STROKE} strokeDasharray="3 3" />
          <XAxis dataKey="stationMm" type="number" domain={["dataMin", "dataMax"]} tickFormatter={(v: number) => v.toFixed(0)} label={{ value: "Station along the port (mm)", position: "insideBottom", offset: -8, fontSize: 12 }} />
          <YAxis tickFormatter={(v: number) => v.toFixed(0)} label={{ value: "Area mm²", angle: -90, position: "insideLeft", fontSize: 12 }} />
          <Tooltip formatter={(v) => (typeof v === "number" ? `${v.toFixed(0)} mm²` : String(v))} labelFormatter={(l) => `Station ${Number(l).toFixed(1)} mm`} />
          <Legend verticalAlign="top" height={28} />
          {series.map((s, i) => (
            <Line key={s.name} type="monotone" dataKey={s.name} stroke={COLOURS[i % COLOURS.length]} dot={false} strokeWidth={2} connectNulls isAnimationActive={false} />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}
