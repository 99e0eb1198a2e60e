/** Server-side table queries: the same parameters for every list page and API. */
import { z } from "zod";

export const tableQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(5).max(200).default(25),
  sort: z.string().max(40).optional(),
  dir: z.enum(["asc", "desc"]).default("asc"),
  q: z.string().trim().max(200).optional(),
});

export type TableQuery = z.infer<typeof tableQuerySchema>;

export type Page<T> = { rows: T[]; total: number; page: number; pageSize: number; pageCount: number };

export function pageOf<T>(rows: T[], total: number, query: TableQuery): Page<T> {
  return { rows, total, page: query.page, pageSize: query.pageSize, pageCount: Math.max(1, Math.ceil(total / query.pageSize)) };
}

/** URLSearchParams or a Next `searchParams` object → a plain record for zod. */
export function paramsRecord(params: URLSearchParams | Record<string, string | string[] | undefined>): Record<string, string> {
  if (params instanceof URLSearchParams) return Object.fromEntries(params.entries());
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(params)) if (typeof v === "string") out[k] = v;
  else if (Array.isArray(v) && v[0] !== undefined) out[k] = v[0];
  return out;
}
