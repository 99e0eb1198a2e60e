import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { jobFormOptions, nextJobNumber } from "@/db/queries/jobs";
import { EVERYONE } from "@/lib/auth/roles";

/** GET /api/jobs/options — customers, head types, machines and the next free job number, for the job form. */
export const GET = apiRoute(EVERYONE, async () => ({ ...jobFormOptions(db()), nextNumber: nextJobNumber(db()) }));
