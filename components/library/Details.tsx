/** A record's fields as a dense definition grid; empty values read as a dash. */
export function Details({ items, columns = 3 }: { items: Array<[string, React.ReactNode]>; columns?: 2 | 3 | 4 }) {
  const cols = { 2: "sm:grid-cols-2", 3: "sm:grid-cols-2 lg:grid-cols-3", 4: "sm:grid-cols-2 lg:grid-cols-4" }[columns];
  return (
    <dl className={`grid gap-x-6 gap-y-3 text-sm ${cols}`}>
      {items.map(([label, value]) => (
        <div key={label} className="min-w-0">
          <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">{label}</dt>
          <dd className="mt-0.5 break-words text-ink">{value === null || value === undefined || value === "" ? "—" : value}</dd>
        </div>
      ))}
    </dl>
  );
}

export function mm(v: number | null | undefined, digits = 2): string {
  return v == null || !Number.isFinite(v) ? "—" : `${v.toFixed(digits)} mm`;
}
