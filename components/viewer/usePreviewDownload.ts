"use client";

/**
 * Downloads and decodes one analysis' preview blob, with progress. Decoding runs once per blob;
 * leaving the page aborts the download.
 */
import { useEffect, useState } from "react";
import { downloadWithProgress, type Progress } from "./fetch-progress";

export type PreviewState<T> =
  | { phase: "loading"; progress: Progress }
  | { phase: "ready"; data: T }
  | { phase: "error"; message: string };

export function previewUrl(analysisId: number): string {
  return `/api/analyses/${analysisId}/preview`;
}

export function usePreviewDownload<T>(analysisId: number | null, decode: (bytes: Uint8Array) => T): PreviewState<T> {
  // Tagged with the analysis it belongs to, so a new id reads as "loading" without a reset render.
  const [tagged, setTagged] = useState<{ id: number | null; state: PreviewState<T> }>({ id: null, state: STARTING });
  useEffect(() => {
    if (analysisId === null) return;
    const abort = new AbortController();
    let last = 0;
    const setState = (state: PreviewState<T>) => setTagged({ id: analysisId, state });
    downloadWithProgress(
      previewUrl(analysisId),
      (progress) => {
        // A re-render per network chunk is wasteful; ten per second is plenty for a bar.
        const now = performance.now();
        if (now - last > 100 || progress.received === progress.total) {
          last = now;
          setState({ phase: "loading", progress });
        }
      },
      { signal: abort.signal },
    )
      .then(({ bytes }) => {
        if (abort.signal.aborted) return;
        try {
          setState({ phase: "ready", data: decode(bytes) });
        } catch (err) {
          setState({ phase: "error", message: err instanceof Error ? err.message : "The preview could not be read." });
        }
      })
      .catch((err: unknown) => {
        if (abort.signal.aborted) return;
        setState({ phase: "error", message: err instanceof Error ? err.message : "The preview could not be downloaded." });
      });
    return () => abort.abort();
    // `decode` is a module-level function at every call site; the blob is keyed by its analysis.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [analysisId]);
  return tagged.id === analysisId ? tagged.state : STARTING;
}

const STARTING = { phase: "loading", progress: { received: 0, total: null } } as const satisfies PreviewState<never>;
