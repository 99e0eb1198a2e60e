import { apiRoute, idParam, jsonBody } from "@/app/_server/api";
import { db } from "@/db/client";
import { notFound } from "@/lib/errors";
import { flowTestView } from "@/lib/flowtests/read";
import { FLOW_EDITORS, FLOW_READERS } from "@/lib/flowtests/roles";
import { deleteFlowTest, updateFlowTest } from "@/lib/flowtests/write";

type P = { id: string };

/** GET /api/flow-tests/:id → { test (stored values, lift table), computed: { ok, result | issues } } — everyone reads. */
export const GET = apiRoute<P>(FLOW_READERS, async ({ params }) => {
  const view = flowTestView(db(), idParam(params.id));
  if (!view) throw notFound("That flow test");
  return view;
});

/** PUT /api/flow-tests/:id { whole record } — lead and admin; audited with before and after. */
export const PUT = apiRoute<P>(FLOW_EDITORS, async ({ req, actor, params }) => updateFlowTest(db(), actor, idParam(params.id), await jsonBody(req)));

/** DELETE /api/flow-tests/:id — lead and admin; audited with the deleted values. */
export const DELETE = apiRoute<P>(FLOW_EDITORS, async ({ actor, params }) => deleteFlowTest(db(), actor, idParam(params.id)));
