/** Label/value pairs of the flow sheet (the same pairs the PDF prints). */
import type { SheetFact } from "@/lib/flowtests/sheet";

export function Facts({ items, testId }: { items: SheetFact[]; testId?: string }) {
  return (
    <dl className="grid grid-cols-[minmax(8rem,auto)_1fr] gap-x-4 gap-y-1.5 text-sm" data-testid={testId}>
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
