import { Readable } from "node:stream";
import { apiRoute, idParam } from "@/app/_server/api";
import { db } from "@/db/client";
import { AppError, notFound } from "@/lib/errors";
import { flowSheetPdf } from "@/lib/flowtests/pdf";
import { flowTestView } from "@/lib/flowtests/read";
import { FLOW_READERS } from "@/lib/flowtests/roles";

/** GET /api/flow-tests/:id/pdf[?download=1] — the flow sheet as a PDF, streamed as it is written. */
export const GET = apiRoute<{ id: string }>(FLOW_READERS, async ({ req, actor, params }) => {
  const id = idParam(params.id);
  const view = flowTestView(db(), id);
  if (!view) throw notFound("That flow test");
  if (!view.computed.ok) throw new AppError("conflict", `This test cannot be computed: ${view.computed.issues.map((i) => i.message).join("; ")}`);
  const doc = flowSheetPdf(view.test, view.computed.result, { generatedAt: new Date(), generatedBy: actor.name });
  const disposition = req.nextUrl.searchParams.get("download") ? "attachment" : "inline";
  return new Response(Readable.toWeb(doc as unknown as Readable) as ReadableStream<Uint8Array>, {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `${disposition}; filename="flow-test-${id}.pdf"`,
      "cache-control": "private, no-store",
    },
  });
});
