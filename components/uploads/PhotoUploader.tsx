"use client";

/**
 * Photos (and setup-sheet PDFs) go through the upload service's React helper; our own button,
 * progress and messages. When the service reports back, the server has already copied the file
 * into our bucket with its SHA-256 (or said why it would not keep it).
 */
import { generateReactHelpers } from "@uploadthing/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { PortolanFileRouter } from "@/app/api/uploadthing/core";
import { Button } from "../ui/Button";

const { useUploadThing } = generateReactHelpers<PortolanFileRouter>();

type Kept = { ok: true; fileId: number } | { ok: false; message: string };

function useKeptUpload(endpoint: "photo" | "setupSheet") {
  const router = useRouter();
  const [progress, setProgress] = useState<number | null>(null);
  const helper = useUploadThing(endpoint, {
    onUploadProgress: (p) => setProgress(p),
    onClientUploadComplete: (files) => {
      setProgress(null);
      const results = files.map((f) => f.serverData as Kept);
      const refused = results.filter((r): r is { ok: false; message: string } => !r.ok);
      if (refused.length) refused.forEach((r) => toast.error(r.message));
      if (results.length > refused.length) toast.success(`${results.length - refused.length} file${results.length - refused.length === 1 ? "" : "s"} kept.`);
      router.refresh();
    },
    onUploadError: (err) => {
      setProgress(null);
      toast.error(err.message || "The upload failed.");
    },
  });
  return { ...helper, progress };
}

function Picker({ accept, multiple, busy, label, onPick, progress }: { accept: string; multiple: boolean; busy: boolean; label: string; onPick: (f: File[]) => void; progress: number | null }) {
  const [files, setFiles] = useState<File[]>([]);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm font-semibold">
          {label}
          <input type="file" accept={accept} multiple={multiple} disabled={busy} onChange={(e) => setFiles([...(e.target.files ?? [])])} className="text-sm font-normal" />
        </label>
        <Button variant="secondary" disabled={busy || files.length === 0} onClick={() => onPick(files)}>
          {busy ? "Uploading…" : "Upload"}
        </Button>
      </div>
      {progress !== null && (
        <div role="progressbar" aria-label="Photo upload progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={progress} className="h-2 max-w-sm overflow-hidden rounded bg-paper-deep">
          <div className="h-full bg-copper" style={{ width: `${progress}%` }} />
        </div>
      )}
    </div>
  );
}

export function PhotoUploader({ entity, entityId }: { entity: "master_head" | "fixture_plate" | "scan" | "revision"; entityId: number }) {
  const { startUpload, isUploading, progress } = useKeptUpload("photo");
  const [caption, setCaption] = useState("");
  return (
    <div className="flex flex-col gap-2" data-testid="photo-uploader">
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Caption (optional)
        <input className="min-h-10 rounded-md border border-rule bg-card px-3 font-normal" value={caption} onChange={(e) => setCaption(e.target.value)} maxLength={200} />
      </label>
      <Picker accept="image/png,image/jpeg,image/webp,image/gif" multiple busy={isUploading} label="Photos (PNG, JPEG, WebP; up to 16 MB each)" progress={progress} onPick={(files) => startUpload(files, { entity, entityId, caption: caption || undefined })} />
    </div>
  );
}

export function SetupSheetUploader({ revisionId }: { revisionId: number }) {
  const { startUpload, isUploading, progress } = useKeptUpload("setupSheet");
  return <Picker accept="application/pdf" multiple={false} busy={isUploading} label="Setup sheet (PDF, up to 32 MB)" progress={progress} onPick={(files) => startUpload(files, { revisionId })} />;
}
