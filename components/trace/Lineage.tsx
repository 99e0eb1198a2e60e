import Link from "next/link";
import type { RevisionLineage } from "@/db/queries/trace";
import { RevisionStateBadge, ShortHash } from "../jobs/badges";

/** Master → scan → revision → file, left to right; each step says what it is and where it came from. */
export function LineageChain({ lineage }: { lineage: RevisionLineage }) {
  const step = "flex min-w-40 flex-col gap-1 rounded-md border border-rule bg-card px-3 py-2 text-sm";
  const arrow = <span aria-hidden className="self-center text-copper">→</span>;
  return (
    <div className="flex flex-wrap items-stretch gap-2" data-testid={`lineage-${lineage.revision.id}`}>
      <div className={step}>
        <span className="text-xs font-bold uppercase tracking-wider text-ink-faint">Master head</span>
        {lineage.master ? (
          <>
            <span className="font-mono font-semibold">{lineage.master.label}</span>
            <span className="text-ink-soft">{lineage.master.porterName ? `ported by ${lineage.master.porterName}` : "porter not recorded"}</span>
          </>
        ) : (
          <span className="text-ink-faint">not linked</span>
        )}
      </div>
      {arrow}
      <div className={step}>
        <span className="text-xs font-bold uppercase tracking-wider text-ink-faint">Scan</span>
        {lineage.scan ? (
          <>
            <span>
              {lineage.scan.scannedOn} on plate <span className="font-mono">{lineage.scan.plateCode}</span>
            </span>
            <span className="text-ink-soft">
              {lineage.scan.machineName}; stylus {lineage.scan.stylusDiameterMm} mm, spacing {lineage.scan.pointSpacingMm} mm
            </span>
          </>
        ) : (
          <span className="text-ink-faint">no source scan recorded</span>
        )}
      </div>
      {arrow}
      <div className={step}>
        <span className="text-xs font-bold uppercase tracking-wider text-ink-faint">Revision</span>
        <Link href={`/trace/revision/${lineage.revision.id}`} className="font-semibold underline decoration-copper/50 underline-offset-2">
          {lineage.revision.label}
        </Link>
        <RevisionStateBadge state={lineage.revision.state} />
      </div>
      {arrow}
      <div className={step}>
        <span className="text-xs font-bold uppercase tracking-wider text-ink-faint">Toolpath file</span>
        <span className="break-all">{lineage.revision.toolpath?.originalName ?? "—"}</span>
        <ShortHash value={lineage.currentSha256} />
      </div>
    </div>
  );
}
