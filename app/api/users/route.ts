import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { ROLES } from "@/db/schema";
import { listUsers } from "@/db/queries/users";
import { ADMINS } from "@/lib/auth/roles";
import { paramsRecord, tableQuerySchema } from "@/lib/paging";
import { parseInput } from "@/lib/validation";

const querySchema = tableQuerySchema.extend({ role: z.enum(ROLES).optional() });

/** GET /api/users?page&pageSize&sort&dir&q&role — admin only. */
export const GET = apiRoute(ADMINS, async ({ req }) => {
  const query = parseInput(querySchema, paramsRecord(req.nextUrl.searchParams));
  return listUsers(db(), query);
});
