/** The bar shown while a preview downloads (or a slow step runs), with the numbers in words. */
import { progressFraction, progressText, type Progress } from "./fetch-progress";

export function LoadProgress({ label, progress, fraction, detail }: { label: string; progress?: Progress; fraction?: number | null; detail?: string }) {
  const f = fraction !== undefined ? fraction : progress ? progressFraction(progress) : null;
  const pct = f === null ? undefined : Math.round(f * 100);
  return (
    <div className="flex w-full max-w-md flex-col gap-2 rounded-md border border-rule bg-card px-4 py-3 text-sm" data-testid="viewer-progress">
      <div className="flex items-center justify-between gap-3">
        <span className="font-semibold text-ink">{label}</span>
        <span className="font-mono text-xs text-ink-soft">{detail ?? (progress ? progressText(progress) : pct !== undefined ? `${pct} %` : "")}</span>
      </div>
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-2 overflow-hidden rounded bg-paper-deep">
        {pct === undefined ? <div className="h-full w-1/3 animate-pulse bg-graphite/60" /> : <div className="h-full bg-graphite transition-[width]" style={{ width: `${pct}%` }} />}
      </div>
    </div>
  );
}

/** What a view shows when its preview is missing or broken: the reason, in words. */
export function ViewerProblem({ children }: { children: React.ReactNode }) {
  return (
    <p role="alert" className="rounded-md border border-bad/30 bg-bad-wash px-4 py-3 text-sm text-bad" data-testid="viewer-error">
      {children}
    </p>
  );
}
