import Image from "next/image";
import type { AttachmentRow } from "@/db/queries/library";
import { EmptyState } from "../ui/Card";
import { RemoveButton } from "./RemoveButton";

/**
 * Photos of a record; each opens full size. Served through the checksum-verified download.
 * `removableFrom`: the record's name in words, when the viewer may take photos off it.
 */
export function Gallery({ photos, removableFrom }: { photos: AttachmentRow[]; removableFrom?: string }) {
  if (photos.length === 0) return <EmptyState title="No photos yet." />;
  return (
    <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" data-testid="gallery">
      {photos.map((p) => (
        <li key={p.id} className="overflow-hidden rounded-md border border-rule bg-card">
          <a href={`/api/files/${p.fileId}?inline=1`} target="_blank" rel="noreferrer">
            <Image src={`/api/files/${p.fileId}?inline=1`} alt={p.caption || p.name} width={320} height={240} unoptimized className="h-40 w-full object-cover" />
          </a>
          <div className="flex items-center gap-1 px-2 py-1">
            <p className="min-w-0 flex-1 truncate text-xs text-ink-soft" title={p.caption || p.name}>
              {p.caption || p.name}
            </p>
            {removableFrom && <RemoveButton url={`/api/attachments/${p.id}`} name={p.caption || p.name} from={removableFrom} />}
          </div>
        </li>
      ))}
    </ul>
  );
}
