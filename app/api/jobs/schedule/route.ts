import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { shopSchedule } from "@/lib/jobs/detail";

/** GET /api/jobs/schedule — planned machine time of open jobs, per machine and per due week. */
export const GET = apiRoute(EVERYONE, async () => ({ machines: shopSchedule(db()) }));
