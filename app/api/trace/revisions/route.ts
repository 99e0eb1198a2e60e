import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { traceableRevisions } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";

/** GET /api/trace/revisions — every revision that was ever released, with how many cuts it made. */
export const GET = apiRoute(EVERYONE, async () => ({ revisions: traceableRevisions(db()) }));
