/**
 * Serves one route handler over real HTTP on a free port, so the CLI's client (plain `fetch`)
 * talks to the app's code exactly as a cell computer would, streaming included.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { Readable } from "node:stream";
import type { ReadableStream as WebReadableStream } from "node:stream/web";
import { NextRequest } from "next/server";

export type Served = { url: string; stop(): Promise<void> };

export async function serveRoute(handler: (req: NextRequest) => Promise<Response>): Promise<Served> {
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const headers = new Headers();
    for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
    handler(new NextRequest(url, { method: req.method, headers }))
      .then((out) => {
        res.writeHead(out.status, Object.fromEntries(out.headers.entries()));
        if (!out.body) return res.end();
        const body = Readable.fromWeb(out.body as unknown as WebReadableStream<Uint8Array>);
        // A stream that fails half-way must reach the client as a broken connection, not a clean end.
        body.on("error", () => res.destroy());
        body.pipe(res);
      })
      .catch(() => {
        res.statusCode = 500;
        res.end();
      });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

/** A server that answers every request with the given status, headers and body. */
export async function serveFixed(status: number, headers: Record<string, string>, body: string | Buffer): Promise<Served> {
  return serveRoute(async () => new Response(new Uint8Array(Buffer.from(body)), { status, headers }));
}
