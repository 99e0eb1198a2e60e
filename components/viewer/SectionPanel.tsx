"use client";

/**
 * The section slider and the section it is on, in 2D: the outline drawn to one scale for the whole
 * port (so a narrowing shows), with its area, equivalent diameter and percent of valve in text,
 * and a button to jump to the smallest section.
 */
import { Badge } from "../ui/Badge";
import { Button } from "../ui/Button";
import { formatNumber } from "../ui/format";
import { outlinePath, percentOfValve, scaleBarMm, svgViewBox, type SectionLike } from "./sections";

export function SectionPanel({
  sections,
  index,
  minIndex,
  extent,
  valveDiameterMm,
  onChange,
}: {
  sections: SectionLike[];
  index: number;
  minIndex: number;
  extent: number;
  valveDiameterMm: number | null;
  onChange: (index: number) => void;
}) {
  const s = sections[index];
  if (!s) return <p className="text-sm text-ink-soft">This analysis has no sections.</p>;
  const pov = percentOfValve(s.equivalentDiameterMm, valveDiameterMm);
  const isMin = index === minIndex;
  const bar = scaleBarMm(extent);
  const min = sections[minIndex];
  const valueText = `station ${formatNumber(s.stationMm, 1)} mm, area ${formatNumber(s.areaMm2, 0)} square millimetres${isMin ? ", the smallest section" : ""}`;
  return (
    <section className="flex flex-col gap-3" aria-label="Section along the port" data-testid="section-panel">
      <div className="flex flex-col gap-1.5">
        <label htmlFor="section-slider" className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
          Section along the port
        </label>
        <input
          id="section-slider"
          type="range"
          min={0}
          max={sections.length - 1}
          step={1}
          value={index}
          onChange={(e) => onChange(Number(e.target.value))}
          aria-valuetext={valueText}
          className="h-9 w-full accent-copper"
          data-testid="section-slider"
        />
        <div className="flex flex-wrap items-center justify-between gap-2">
          <span className="font-mono text-xs text-ink-soft">
            {index + 1} of {sections.length} · station <span data-testid="section-station">{formatNumber(s.stationMm, 1)}</span> mm
          </span>
          <Button variant="secondary" className="min-h-9 px-3 text-xs" disabled={minIndex < 0 || isMin} onClick={() => onChange(minIndex)} data-testid="jump-to-min">
            Jump to the smallest section
          </Button>
        </div>
      </div>
      <figure className="flex flex-col items-center gap-1">
        <svg viewBox={svgViewBox(extent)} className="aspect-square w-full max-w-64 rounded border border-rule bg-card" role="img" aria-label={`Outline of the section at ${formatNumber(s.stationMm, 1)} mm`}>
          {min && !isMin && <path d={outlinePath(min.outline)} fill="none" stroke="#9b2c2c" strokeWidth={1.5} strokeDasharray="6 4" vectorEffect="non-scaling-stroke" />}
          <path d={outlinePath(s.outline)} fill="#f5e4d8" stroke="#b0592d" strokeWidth={2} vectorEffect="non-scaling-stroke" data-testid="section-outline" />
          <line x1={-extent * 0.05} y1={0} x2={extent * 0.05} y2={0} stroke="#33312e" strokeWidth={1} vectorEffect="non-scaling-stroke" />
          <line x1={0} y1={-extent * 0.05} x2={0} y2={extent * 0.05} stroke="#33312e" strokeWidth={1} vectorEffect="non-scaling-stroke" />
          <line x1={-extent} y1={extent * 1.02} x2={-extent + bar} y2={extent * 1.02} stroke="#33312e" strokeWidth={3} vectorEffect="non-scaling-stroke" />
        </svg>
        <figcaption className="text-center text-xs text-ink-soft">
          Scale bar {bar} mm · cross at the centerline{min && !isMin ? " · dashed red: the smallest section" : ""}
        </figcaption>
      </figure>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm" data-testid="section-figures">
        <div>
          <dt className="text-xs uppercase text-ink-faint">Area</dt>
          <dd className="font-mono text-lg font-bold">
            <span data-testid="section-area">{formatNumber(s.areaMm2, 0)}</span> mm²
          </dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Equivalent diameter</dt>
          <dd className="font-mono">{formatNumber(s.equivalentDiameterMm, 2)} mm</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Percent of valve</dt>
          <dd className="font-mono">{pov === null ? "— (no valve size)" : `${formatNumber(pov, 1)} %`}</dd>
        </div>
        <div>
          <dt className="text-xs uppercase text-ink-faint">Outline</dt>
          <dd>{s.complete === false ? <Badge tone="warn">Partly interpolated</Badge> : <Badge tone="ok">Complete</Badge>}</dd>
        </div>
      </dl>
      {isMin && (
        <p className="text-sm" data-testid="at-min">
          <Badge tone="copper">Smallest section</Badge> <span className="text-ink-soft">of the complete sections in this scan.</span>
        </p>
      )}
    </section>
  );
}
