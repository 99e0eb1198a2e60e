/**
 * GET /api/machine/program?job=<number>&port=intake|exhaust with `Authorization: Bearer <machine token>`:
 * the released toolpath of the job's chosen revision, streamed from storage, with its SHA-256 in
 * `X-Content-SHA256`. 401 unknown or revoked token, 403 the job is planned on another machine,
 * 409 the revision is no longer released (or the job is not cutting), 404 no such job or port.
 * No session: the token is the caller's identity, and each fetch is an audit event.
 */
import { Readable } from "node:stream";
import type { NextRequest } from "next/server";
import { errorResponse } from "@/app/_server/api";
import { db } from "@/db/client";
import { deliverProgram } from "@/lib/delivery/program";
import { authenticateMachine } from "@/lib/delivery/tokens";
import { paramsRecord } from "@/lib/paging";
import { storage } from "@/lib/storage";

export const dynamic = "force-dynamic";

export async function GET(req: NextRequest): Promise<Response> {
  try {
    const caller = authenticateMachine(db(), req.headers.get("authorization"));
    const delivery = await deliverProgram(db(), storage(), caller, paramsRecord(req.nextUrl.searchParams));
    return new Response(Readable.toWeb(delivery.body) as ReadableStream<Uint8Array>, { status: 200, headers: delivery.headers });
  } catch (err) {
    const res = errorResponse(err);
    if (res.status === 401) res.headers.set("WWW-Authenticate", 'Bearer realm="portolan-machine"');
    return res;
  }
}
