import Image from "next/image";
import type { AttachmentRow } from "@/db/queries/library";
import { EmptyState } from "../ui/Card";

/** Photos of a record; each opens full size. Served through the checksum-verified download. */
export function Gallery({ photos }: { photos: AttachmentRow[] }) {
  if (photos.length === 0) return <EmptyState title="No photos yet." />;
  return (
    <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" data-testid="gallery">
      {photos.map((p) => (
        <li key={p.id} className="overflow-hidden rounded-md border border-rule bg-card">
          <a href={`/api/files/${p.fileId}?inline=1`} target="_blank" rel="noreferrer">
            <Image src={`/api/files/${p.fileId}?inline=1`} alt={p.caption || p.name} width={320} height={240} unoptimized className="h-40 w-full object-cover" />
          </a>
          <p className="truncate px-2 py-1 text-xs text-ink-soft" title={p.caption || p.name}>
            {p.caption || p.name}
          </p>
        </li>
      ))}
    </ul>
  );
}
