/** Placeholder blocks shown while a page's data loads. */
export function PageSkeleton() {
  return (
    <div aria-busy="true" aria-live="polite" className="animate-pulse space-y-4">
      <div className="h-8 w-64 rounded bg-paper-deep" />
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
        {[0, 1, 2, 3].map((i) => (
          <div key={i} className="h-32 rounded-lg bg-paper-deep" />
        ))}
      </div>
      <span className="sr-only">Loading…</span>
    </div>
  );
}
