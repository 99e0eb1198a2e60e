import { z } from "zod";
import { apiRoute } from "@/app/_server/api";
import { db } from "@/db/client";
import { revisionAnalyses } from "@/db/queries/programs";
import { EVERYONE } from "@/lib/auth/roles";
import { notFound } from "@/lib/errors";
import { paramsRecord } from "@/lib/paging";
import { compareRevisions, type PortReportLike, type ToolpathReportLike } from "@/lib/programs/compare";
import { parseInput } from "@/lib/validation";

const querySchema = z.object({ a: z.coerce.number().int().positive(), b: z.coerce.number().int().positive() });

/** GET /api/revisions/compare?a=<id>&b=<id> → { a, b, comparison } (B − A). */
export const GET = apiRoute(EVERYONE, async ({ req }) => {
  const q = parseInput(querySchema, paramsRecord(req.nextUrl.searchParams));
  const a = revisionAnalyses(db(), q.a);
  const b = revisionAnalyses(db(), q.b);
  if (!a || !b) throw notFound("That revision");
  const side = (x: NonNullable<typeof a>) => ({ toolpaths: x.toolpaths as ToolpathReportLike[], scan: x.scan as PortReportLike | null });
  const label = (x: NonNullable<typeof a>) => ({ id: x.revision.revision.id, letter: x.revision.revision.letter, state: x.revision.revision.state, program: x.revision.program.name });
  return { a: label(a), b: label(b), comparison: compareRevisions(side(a), side(b)) };
});
