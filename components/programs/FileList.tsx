import type { FileView } from "@/db/queries/files";
import { Badge } from "../ui/Badge";
import { EmptyState } from "../ui/Card";
import { formatDateTime } from "../ui/format";
import { AnalysisView } from "./AnalysisView";
import { formatBytes } from "./format";
import { RemoveButton } from "../uploads/RemoveButton";

const ROLE_WORD: Record<string, string> = { toolpath: "Toolpath", setup_sheet: "Setup sheet", point_cloud: "Point cloud" };

/**
 * A record's files: name, size, SHA-256, verified download, and each one's analysis.
 * `removableFrom`: the draft revision whose files the viewer may take off.
 */
export function FileList({
  files,
  canRerun,
  emptyTitle,
  removableFrom,
}: {
  files: Array<FileView & { role?: string }>;
  canRerun: boolean;
  emptyTitle: string;
  removableFrom?: number;
}) {
  if (files.length === 0) return <EmptyState title={emptyTitle} />;
  return (
    <ul className="flex flex-col gap-4" data-testid="file-list">
      {files.map((f) => (
        <li key={f.id} className="rounded-md border border-rule bg-card p-3">
          <div className="flex flex-wrap items-center gap-3 text-sm">
            <Badge>{ROLE_WORD[f.role ?? f.kind] ?? f.kind}</Badge>
            {f.state === "stored" ? (
              <a href={`/api/files/${f.id}`} className="font-semibold text-copper-deep hover:underline" data-testid="file-name">
                {f.name}
              </a>
            ) : (
              <span className="font-semibold">{f.name}</span>
            )}
            <span className="text-ink-soft">{formatBytes(f.sizeBytes)}</span>
            {f.state === "uploading" && <Badge tone="warn">Upload not finished</Badge>}
            <span className="text-xs text-ink-faint">{formatDateTime(f.createdAt)}</span>
            {removableFrom !== undefined && (
              <span className="ml-auto">
                <RemoveButton url={`/api/revisions/${removableFrom}/files/${f.id}`} name={f.name} from="revision" />
              </span>
            )}
          </div>
          {f.sha256 && (
            <p className="mt-1 break-all font-mono text-xs text-ink-faint" title="SHA-256, checked on every download">
              SHA-256 {f.sha256}
            </p>
          )}
          {f.analysis && (
            <div className="mt-3">
              <AnalysisView initial={f.analysis} canRerun={canRerun} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
