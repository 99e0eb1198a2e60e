import { describe, expect, it } from "vitest";
import { downloadWithProgress, DownloadError, progressFraction, progressText, type Progress } from "@/components/viewer/fetch-progress";

function streamOf(chunks: Uint8Array[]): ReadableStream<Uint8Array> {
  let i = 0;
  return new ReadableStream({
    pull(controller) {
      if (i < chunks.length) controller.enqueue(chunks[i++]);
      else controller.close();
    },
  });
}

const chunks = [Uint8Array.from([1, 2, 3]), Uint8Array.from([4, 5]), Uint8Array.from([6, 7, 8, 9])];
const fakeFetch = (res: () => Response) => (async () => res()) as unknown as typeof fetch;

describe("preview download with progress", () => {
  it("reports rising byte counts against Content-Length and returns the bytes and format", async () => {
    const seen: Progress[] = [];
    const r = await downloadWithProgress("/x", (p) => seen.push(p), {
      fetchImpl: fakeFetch(() => new Response(streamOf(chunks), { headers: { "content-length": "9", "x-preview-format": "PTPC" } })),
    });
    expect([...r.bytes]).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(r.format).toBe("PTPC");
    expect(seen.map((p) => p.received)).toEqual([0, 3, 5, 9]);
    expect(seen.every((p) => p.total === 9)).toBe(true);
    expect(progressFraction(seen.at(-1)!)).toBe(1);
  });

  it("joins the chunks when no length is announced, or a wrong one", async () => {
    const r = await downloadWithProgress("/x", () => {}, { fetchImpl: fakeFetch(() => new Response(streamOf(chunks))) });
    expect([...r.bytes]).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const longer = await downloadWithProgress("/x", () => {}, { fetchImpl: fakeFetch(() => new Response(streamOf(chunks), { headers: { "content-length": "4" } })) });
    expect([...longer.bytes]).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });

  it("refuses a download that stops short of its length", async () => {
    await expect(
      downloadWithProgress("/x", () => {}, { fetchImpl: fakeFetch(() => new Response(streamOf(chunks), { headers: { "content-length": "12" } })) }),
    ).rejects.toThrow(/stopped after 9 of 12/);
  });

  it("passes on the API's error message and status", async () => {
    const err = await downloadWithProgress("/x", () => {}, {
      fetchImpl: fakeFetch(() => new Response(JSON.stringify({ error: { code: "not_found", message: "This analysis has no preview (yet)." } }), { status: 404 })),
    }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(DownloadError);
    expect((err as DownloadError).message).toBe("This analysis has no preview (yet).");
    expect((err as DownloadError).status).toBe(404);
  });

  it("words the progress", () => {
    expect(progressText({ received: 1.5 * 1024 * 1024, total: 3 * 1024 * 1024 })).toBe("1.5 of 3.0 MB (50 %)");
    expect(progressText({ received: 1024 * 1024, total: null })).toBe("1.0 MB");
    expect(progressFraction({ received: 5, total: null })).toBeNull();
  });
});
