import { NextResponse } from "next/server";
import { apiRoute, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { AppError } from "@/lib/errors";
import { importFlowTestCsv } from "@/lib/flowtests/import";
import { FLOW_RECORDERS } from "@/lib/flowtests/roles";
import { CSV_MAX_CHARS } from "@/lib/flowtests/schema";

/**
 * POST /api/flow-tests/import { csv, mapping?, test } — a flow test from a bench CSV. Nothing is
 * stored unless the whole file is valid; problems come back as fields `rows.<line>`.
 */
export const POST = apiRoute(FLOW_RECORDERS, async ({ req, actor }) => {
  // JSON escaping can double a CSV's size; anything beyond that is not a flow-bench file.
  const declared = Number(req.headers.get("content-length") ?? 0);
  if (declared > 2 * CSV_MAX_CHARS + 64 * 1024) throw new AppError("too_large", "The file is larger than a flow-bench CSV can be (1 MB).");
  return NextResponse.json(importFlowTestCsv(db(), actor, await jsonBody(req)), { status: 201 });
});
