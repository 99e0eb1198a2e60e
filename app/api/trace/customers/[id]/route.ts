import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { getCustomer } from "@/db/queries/customers";
import { customerTrace } from "@/db/queries/trace";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";

/** GET /api/trace/customers/:id — the customer's heads and the revisions that cut them. */
export const GET = apiRoute<{ id: string }>(EVERYONE, async ({ params }) => {
  const id = idParam(params.id);
  const customer = getCustomer(db(), id);
  if (!customer) throw notFound("That customer");
  return { customer, rows: customerTrace(db(), id) };
});
