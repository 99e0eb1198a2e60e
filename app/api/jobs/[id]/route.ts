import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { jobDetail } from "@/lib/jobs/detail";
import { updateJob } from "@/lib/jobs/jobs";

/** GET /api/jobs/:id — job, plan, ports with revision choices and flags, possible moves, heads, cuts. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const detail = jobDetail(db(), idParam(params.id));
  if (!detail) throw notFound("That job");
  return detail;
});

/** PATCH /api/jobs/:id { job fields } — lead, admin; open jobs only. */
export const PATCH = apiRoute<{ id: string }>(LEADS, async ({ req, actor, params }) => updateJob(db(), actor, idParam(params.id), await jsonBody(req)));
