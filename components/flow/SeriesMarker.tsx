/** Marker shapes for chart points, drawn as small SVG paths (recharts passes cx/cy). */
import type { SeriesStyle } from "./palette";

export function SeriesMarker({ cx, cy, style, size = 3.5 }: { cx?: number; cy?: number; style: SeriesStyle; size?: number }) {
  if (cx == null || cy == null || !Number.isFinite(cx) || !Number.isFinite(cy)) return null;
  const s = size;
  const common = { fill: style.stroke, stroke: "#fffdf9", strokeWidth: 1 };
  switch (style.marker) {
    case "square":
      return <rect x={cx - s} y={cy - s} width={2 * s} height={2 * s} {...common} />;
    case "diamond":
      return <path d={`M${cx},${cy - s * 1.3}L${cx + s * 1.3},${cy}L${cx},${cy + s * 1.3}L${cx - s * 1.3},${cy}Z`} {...common} />;
    case "triangle":
      return <path d={`M${cx},${cy - s * 1.3}L${cx + s * 1.2},${cy + s}L${cx - s * 1.2},${cy + s}Z`} {...common} />;
    default:
      return <circle cx={cx} cy={cy} r={s} {...common} />;
  }
}

/** A legend swatch: a short line in the series' dash pattern with its marker. */
export function SeriesSwatch({ style }: { style: SeriesStyle }) {
  return (
    <svg width="34" height="12" aria-hidden className="shrink-0">
      <line x1="1" y1="6" x2="33" y2="6" stroke={style.stroke} strokeWidth="2" strokeDasharray={style.dash} />
      <SeriesMarker cx={17} cy={6} style={style} size={3} />
    </svg>
  );
}
