/** Query-string shapes of the list APIs (server-side sort, filter and paging plus each list's own filters). */
import { z } from "zod";
import { CUT_OUTCOMES, JOB_STATES } from "@/db/enums";
import { tableQuerySchema } from "../paging";
import { HEAD_STATES } from "./words";

const optionalId = z.coerce.number().int().positive().optional();
const flag = z
  .enum(["1", "true", "0", "false"])
  .transform((v) => v === "1" || v === "true")
  .optional();

export const jobListQuerySchema = tableQuerySchema.extend({
  state: z.union([z.enum(JOB_STATES), z.literal("open")]).optional(),
  customerId: optionalId,
  revisionId: optionalId,
  flagged: flag,
});

export const headListQuerySchema = tableQuerySchema.extend({
  jobId: optionalId,
  customerId: optionalId,
  state: z.enum(HEAD_STATES).optional(),
});

export const cutListQuerySchema = tableQuerySchema.extend({
  jobId: optionalId,
  headId: optionalId,
  revisionId: optionalId,
  machineId: optionalId,
  outcome: z.enum(CUT_OUTCOMES).optional(),
});
