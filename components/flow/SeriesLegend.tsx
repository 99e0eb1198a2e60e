/** The key to overlaid curves: each series' line-and-marker swatch beside its label. */
import type { ReactNode } from "react";
import { SeriesSwatch } from "./SeriesMarker";
import { styleFor } from "./palette";

/** `children`: further items (`<li>`) after the series, such as what reference lines mean. */
export function SeriesLegend({ labels, children }: { labels: ReactNode[]; children?: ReactNode }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Series">
      {labels.map((label, i) => (
        <li key={i} className="flex items-center gap-1.5">
          <SeriesSwatch style={styleFor(i)} />
          {label}
        </li>
      ))}
      {children}
    </ul>
  );
}
