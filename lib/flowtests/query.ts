/** Parameters of the flow-test list: the shared table parameters plus the links other screens filter by. */
import { z } from "zod";
import { FLOW_SUBJECTS, PORTS } from "@/db/enums";
import { tableQuerySchema } from "../paging";

const idParam = z.coerce.number().int().positive().optional();

export const flowTestListQuerySchema = tableQuerySchema.extend({
  headTypeId: idParam,
  masterId: idParam,
  revisionId: idParam,
  headId: idParam,
  subject: z.enum(FLOW_SUBJECTS).optional(),
  port: z.enum(PORTS).optional(),
});
export type FlowTestListQuery = z.infer<typeof flowTestListQuerySchema>;

/** How many tests one overlay or series request may ask for. */
export const MAX_SERIES = 12;

/** "3,5,8" → [3, 5, 8]: positive ids, duplicates dropped, order kept. */
export const idListSchema = z.string({ message: "Name the tests as ids=1,2,3." }).transform((text, ctx) => {
  const ids = [...new Set(text.split(",").map((p) => p.trim()).filter(Boolean).map(Number))];
  if (ids.length === 0 || ids.some((n) => !Number.isInteger(n) || n <= 0)) {
    ctx.addIssue({ code: "custom", message: "Name the tests by their numbers, as ids=1,2,3." });
    return z.NEVER;
  }
  if (ids.length > MAX_SERIES) {
    ctx.addIssue({ code: "custom", message: `At most ${MAX_SERIES} tests at once.` });
    return z.NEVER;
  }
  return ids;
});
