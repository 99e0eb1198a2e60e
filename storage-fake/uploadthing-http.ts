/** Small HTTP helpers of the uploadthing stand-in: JSON in and out, and CORS for the browser. */
import type { IncomingMessage, ServerResponse } from "node:http";

const MAX_JSON_BYTES = 1 << 20;

export async function readText(req: IncomingMessage, limit = MAX_JSON_BYTES): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > limit) throw new HttpError(413, "request body too large");
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

export async function readJson<T>(req: IncomingMessage): Promise<T> {
  const text = await readText(req);
  try {
    return JSON.parse(text || "{}") as T;
  } catch {
    throw new HttpError(400, "body is not JSON");
  }
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

/**
 * Presigned URLs are the authorization for browser requests, so any origin may call; the SDK
 * reads `x-ut-range-start` from HEAD to resume, hence the exposed header.
 */
export function setCors(req: IncomingMessage, res: ServerResponse): void {
  res.setHeader("Access-Control-Allow-Origin", req.headers.origin ?? "*");
  res.setHeader("Vary", "Origin");
  res.setHeader("Access-Control-Expose-Headers", "x-ut-range-start");
}

export function answerPreflight(req: IncomingMessage, res: ServerResponse): void {
  setCors(req, res);
  res.setHeader("Access-Control-Allow-Methods", "GET, HEAD, PUT, POST, OPTIONS");
  const asked = req.headers["access-control-request-headers"];
  if (asked) res.setHeader("Access-Control-Allow-Headers", asked);
  res.setHeader("Access-Control-Max-Age", "600");
  res.writeHead(204).end();
}

export function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { "content-type": "application/json", "content-length": Buffer.byteLength(text) }).end(text);
}
