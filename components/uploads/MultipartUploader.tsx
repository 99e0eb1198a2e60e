"use client";

/**
 * Large files (toolpaths, point clouds, up to 2 GB) go from the browser straight to the bucket:
 * the app opens a multipart upload and hands out presigned part URLs; parts go up three at a
 * time with XMLHttpRequest (for progress), each retried a few times; Cancel aborts them and the
 * upload; Try again starts clean. The app server never carries the bytes.
 */
import { useRef, useState } from "react";
import { checkDeclared, formatBytes, KIND_RULES } from "@/lib/uploads/limits";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";

type Target = { revisionId: number } | { scanId: number };
type Started = { fileId: number; partSizeBytes: number; partCount: number; parts: Array<{ partNumber: number; url: string }> };
export type Completed = { file: { id: number; originalName: string; sha256: string; sizeBytes: number }; analysisId: number };

type Phase =
  | { name: "idle" }
  | { name: "sending"; sent: number; total: number; startedAt: number; rate: number }
  | { name: "checking" }
  | { name: "done"; result: Completed }
  | { name: "failed"; message: string }
  | { name: "cancelled" };

const PARALLEL = 3;
const PART_TRIES = 4;

class Cancelled extends Error {}

function putPart(url: string, body: Blob, onProgress: (loaded: number) => void, register: (x: XMLHttpRequest) => void): Promise<string> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    register(xhr);
    xhr.open("PUT", url);
    xhr.upload.onprogress = (e) => onProgress(e.loaded);
    xhr.onload = () => {
      const etag = xhr.getResponseHeader("ETag");
      if (xhr.status >= 200 && xhr.status < 300 && etag) resolve(etag);
      else reject(new Error(xhr.status >= 200 && xhr.status < 300 ? "storage did not expose the part's ETag (check the bucket's CORS rule)" : `storage answered ${xhr.status}`));
    };
    xhr.onerror = () => reject(new Error("the network dropped the part"));
    xhr.onabort = () => reject(new Cancelled("cancelled"));
    xhr.send(body);
  });
}

export function MultipartUploader({
  kind,
  target,
  label,
  onDone,
}: {
  kind: "toolpath" | "point_cloud";
  target: Target;
  label: string;
  onDone?: (r: Completed) => void;
}) {
  const rule = KIND_RULES[kind];
  const [file, setFile] = useState<File | null>(null);
  const [phase, setPhase] = useState<Phase>({ name: "idle" });
  const inFlight = useRef(new Set<XMLHttpRequest>());
  const session = useRef<{ fileId: number; cancelled: boolean } | null>(null);

  async function run(f: File) {
    const early = checkDeclared(kind, f.name, f.size);
    if (early) {
      setPhase({ name: "failed", message: early });
      return;
    }
    const s = { fileId: 0, cancelled: false };
    session.current = s;
    const total = f.size;
    setPhase({ name: "sending", sent: 0, total, startedAt: Date.now(), rate: 0 });
    try {
      const started = await fetchJson<Started>("/api/uploads", { method: "POST", body: JSON.stringify({ kind, fileName: f.name, sizeBytes: f.size, contentType: f.type || undefined, ...target }) });
      s.fileId = started.fileId;
      const urls = new Map(started.parts.map((p) => [p.partNumber, p.url]));
      const loaded = new Map<number, number>();
      const report = () => {
        const sent = [...loaded.values()].reduce((a, b) => a + b, 0);
        const now = Date.now();
        setPhase((p) => (p.name === "sending" ? { ...p, sent, rate: sent / Math.max(0.5, (now - p.startedAt) / 1000) } : p));
      };
      const etags: Array<{ partNumber: number; etag: string }> = [];
      let next = 1;
      const urlFor = async (n: number) => {
        if (!urls.has(n)) {
          const batch = Array.from({ length: Math.min(64, started.partCount - n + 1) }, (_, i) => n + i);
          const more = await fetchJson<{ parts: Array<{ partNumber: number; url: string }> }>(`/api/uploads/${started.fileId}/parts`, { method: "POST", body: JSON.stringify({ partNumbers: batch }) });
          for (const p of more.parts) urls.set(p.partNumber, p.url);
        }
        return urls.get(n)!;
      };
      const worker = async () => {
        while (next <= started.partCount) {
          const n = next++;
          const begin = (n - 1) * started.partSizeBytes;
          const blob = f.slice(begin, Math.min(f.size, begin + started.partSizeBytes));
          for (let attempt = 1; ; attempt++) {
            if (s.cancelled) throw new Cancelled("cancelled");
            try {
              const etag = await putPart(await urlFor(n), blob, (x) => ((loaded.set(n, x), report())), (xhr) => inFlight.current.add(xhr));
              loaded.set(n, blob.size);
              report();
              etags.push({ partNumber: n, etag });
              break;
            } catch (err) {
              if (err instanceof Cancelled || attempt >= PART_TRIES) throw err;
              loaded.set(n, 0);
              await new Promise((r) => setTimeout(r, 500 * attempt));
            }
          }
        }
      };
      await Promise.all(Array.from({ length: Math.min(PARALLEL, started.partCount) }, worker));
      setPhase({ name: "checking" });
      const result = await fetchJson<Completed>(`/api/uploads/${started.fileId}/complete`, { method: "POST", body: JSON.stringify({ parts: etags }) });
      session.current = null;
      setPhase({ name: "done", result });
      onDone?.(result);
    } catch (err) {
      inFlight.current.forEach((x) => x.abort());
      inFlight.current.clear();
      if (err instanceof Cancelled || s.cancelled) {
        setPhase({ name: "cancelled" });
        return;
      }
      // A refusal at completion already removed the upload; otherwise leave nothing half-made.
      if (s.fileId && !(err instanceof ApiError && err.status === 415)) await fetch(`/api/uploads/${s.fileId}`, { method: "DELETE" }).catch(() => undefined);
      session.current = null;
      setPhase({ name: "failed", message: err instanceof Error ? err.message : "The upload failed." });
    }
  }

  async function cancel() {
    const s = session.current;
    if (!s) return;
    s.cancelled = true;
    inFlight.current.forEach((x) => x.abort());
    inFlight.current.clear();
    if (s.fileId) await fetch(`/api/uploads/${s.fileId}`, { method: "DELETE" }).catch(() => undefined);
    session.current = null;
    setPhase({ name: "cancelled" });
  }

  const busy = phase.name === "sending" || phase.name === "checking";
  const fraction = phase.name === "sending" ? (phase.total ? phase.sent / phase.total : 0) : phase.name === "checking" || phase.name === "done" ? 1 : 0;
  const rate = phase.name === "sending" ? phase.rate : 0;

  return (
    <div className="flex flex-col gap-3 rounded-lg border border-dashed border-rule bg-paper p-4" data-testid={`uploader-${kind}`}>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        {label}
        <input
          type="file"
          accept={rule.extensions.map((e) => `.${e}`).join(",")}
          disabled={busy}
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            setPhase({ name: "idle" });
          }}
          className="text-sm font-normal"
        />
      </label>
      <p className="text-xs text-ink-faint">
        {rule.expected}; up to {formatBytes(rule.maxBytes)}. The file goes straight to storage and is checked when it arrives.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="primary" disabled={!file || busy} onClick={() => file && run(file)}>
          {phase.name === "failed" || phase.name === "cancelled" ? "Try again" : "Upload"}
        </Button>
        {busy && (
          <Button variant="danger" onClick={cancel}>
            Cancel upload
          </Button>
        )}
      </div>
      {phase.name !== "idle" && (
        <div className="flex flex-col gap-1" aria-live="polite">
          <div role="progressbar" aria-label="Upload progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(fraction * 100)} data-testid="upload-progress" className="h-3 overflow-hidden rounded bg-paper-deep">
            <div className="h-full bg-copper transition-[width]" style={{ width: `${(fraction * 100).toFixed(1)}%` }} />
          </div>
          <p className="text-sm text-ink-soft" data-testid="upload-status">
            {phase.name === "sending" && `Sending ${formatBytes(phase.sent)} of ${formatBytes(phase.total)} (${Math.round(fraction * 100)} %), ${formatBytes(Math.round(rate))}/s`}
            {phase.name === "checking" && "All parts sent. Checking the file (SHA-256 and content)…"}
            {phase.name === "done" && `Stored “${phase.result.file.originalName}”, SHA-256 ${phase.result.file.sha256.slice(0, 12)}…; analysis queued.`}
            {phase.name === "cancelled" && "Upload cancelled; nothing was kept."}
          </p>
          {phase.name === "failed" && (
            <p role="alert" className="text-sm text-bad">
              {phase.message}
            </p>
          )}
        </div>
      )}
    </div>
  );
}
