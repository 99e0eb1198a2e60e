import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { customerHeads, getCustomer } from "@/db/queries/customers";
import { EVERYONE, LEADS } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { updateCustomer } from "@/lib/jobs/customers";

/** GET /api/customers/:id — the customer with their heads (jobs via /api/jobs?customerId=). */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const customer = getCustomer(db(), id);
  if (!customer) throw notFound("That customer");
  return { ...customer, heads: customerHeads(db(), id) };
});

/** PATCH /api/customers/:id { any customer field } — lead, admin. */
export const PATCH = apiRoute<{ id: string }>(LEADS, async ({ req, actor, params }) => updateCustomer(db(), actor, idParam(params.id), await jsonBody(req)));
