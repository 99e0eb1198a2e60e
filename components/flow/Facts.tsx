/** Label/value pairs of the flow sheet (the same pairs the PDF prints). */
import type { SheetFact } from "@/lib/flowtests/sheet";

export function Facts({ items, testId }: { items: SheetFact[]; testId?: string }) {
  return (
    <dl className="grid grid-cols-[minmax(7rem,38%)_minmax(0,1fr)] gap-x-4 gap-y-1.5 text-sm" data-testid={testId}>
      {items.map((f) => (
        <div key={f.label} className="contents">
          <dt className="text-ink-soft">{f.label}</dt>
          <dd className="font-semibold text-ink">
            {f.value}
            {f.note && <span className="block text-xs font-normal text-ink-faint">{f.note}</span>}
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** Headline figures as tiles: the label small, the figure large, its note under it. */
export function FactTiles({ items, testId }: { items: SheetFact[]; testId?: string }) {
  return (
    <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-3" data-testid={testId}>
      {items.map((f) => (
        <div key={f.label} className="rounded-md border border-rule bg-paper px-3 py-2">
          <dt className="text-xs text-ink-soft">{f.label}</dt>
          <dd className="mt-0.5 font-mono text-lg font-semibold text-ink">{f.value}</dd>
          {f.note && <dd className="text-xs text-ink-faint">{f.note}</dd>}
        </div>
      ))}
    </dl>
  );
}
