/**
 * Downloads a preview blob and reports how far it got: Content-Length gives the total, a reader
 * loop counts the bytes. With a known length the chunks go straight into one buffer (no second
 * copy of a 3 MB preview); without one they are joined at the end.
 */

export type Progress = { received: number; total: number | null };

export type Download = { bytes: Uint8Array; format: string | null };

export class DownloadError extends Error {
  constructor(
    message: string,
    readonly status: number,
  ) {
    super(message);
    this.name = "DownloadError";
  }
}

/** The API's `{ error: { message } }` when there is one, else the status line. */
async function messageOf(res: Response): Promise<string> {
  try {
    const body = (await res.json()) as { error?: { message?: string } };
    if (body?.error?.message) return body.error.message;
  } catch {
    // not JSON: fall through
  }
  return `The server answered ${res.status} ${res.statusText}`.trim();
}

export async function downloadWithProgress(
  url: string,
  onProgress: (p: Progress) => void,
  options: { signal?: AbortSignal; fetchImpl?: typeof fetch } = {},
): Promise<Download> {
  const res = await (options.fetchImpl ?? fetch)(url, { signal: options.signal, credentials: "same-origin" });
  if (!res.ok) throw new DownloadError(await messageOf(res), res.status);
  const header = res.headers.get("content-length");
  const total = header !== null && /^\d+$/.test(header) ? Number(header) : null;
  const format = res.headers.get("x-preview-format");
  onProgress({ received: 0, total });
  if (!res.body) {
    const bytes = new Uint8Array(await res.arrayBuffer());
    onProgress({ received: bytes.length, total: total ?? bytes.length });
    return { bytes, format };
  }
  const reader = res.body.getReader();
  let received = 0;
  let buffer = total !== null ? new Uint8Array(total) : null;
  const chunks: Uint8Array[] = [];
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    if (buffer && received + value.length <= buffer.length) buffer.set(value, received);
    else {
      // Longer than announced: keep everything, join at the end.
      if (buffer) chunks.push(buffer.subarray(0, received));
      buffer = null;
      chunks.push(value);
    }
    received += value.length;
    onProgress({ received, total });
  }
  if (buffer) {
    if (received !== buffer.length) throw new DownloadError(`The download stopped after ${received} of ${buffer.length} bytes.`, 0);
    return { bytes: buffer, format };
  }
  const bytes = new Uint8Array(received);
  let o = 0;
  for (const c of chunks) {
    bytes.set(c, o);
    o += c.length;
  }
  return { bytes, format };
}

/** "1.2 of 3.4 MB (35 %)" or "1.2 MB" when the total is unknown. */
export function progressText(p: Progress): string {
  const mb = (n: number) => (n / (1024 * 1024)).toFixed(1);
  if (p.total === null || p.total === 0) return `${mb(p.received)} MB`;
  return `${mb(p.received)} of ${mb(p.total)} MB (${Math.floor((100 * p.received) / p.total)} %)`;
}

export function progressFraction(p: Progress): number | null {
  return p.total ? Math.min(1, p.received / p.total) : null;
}
