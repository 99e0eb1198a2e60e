import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { traceHead } from "@/lib/trace/lineage";

/** GET /api/trace/heads/:serial — master → scan → revision → file hash → flow tests → job → customer for one head. */
export const GET = apiRoute<{ serial: string }>(EVERYONE, async ({ params }) => {
  const lineage = traceHead(db(), decodeURIComponent(params.serial));
  if (!lineage) throw notFound("A head with that serial");
  return lineage;
});
