/** The auditor's filters on the audit log, and its CSV export columns. */
import { z } from "zod";
import type { AuditRow } from "@/db/queries/audit";
import { tableQuerySchema } from "../paging";
import type { CsvColumn } from "./csv";

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: "Use a date like 2026-12-04." });

export const auditFilterSchema = z
  .object({
    q: z.string().trim().max(200).optional(),
    entity: z.string().trim().max(40).optional(),
    entityId: z.string().trim().max(40).optional(),
    actor: z.string().trim().max(200).optional(),
    action: z.string().trim().max(60).optional(),
    from: day.optional(),
    to: day.optional(),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { path: ["to"], message: "The end date is before the start date." });

export const auditListQuerySchema = tableQuerySchema.and(auditFilterSchema);

const json = (v: unknown) => (v == null ? "" : JSON.stringify(v));

export const AUDIT_CSV_COLUMNS: CsvColumn<AuditRow>[] = [
  { header: "id", value: (r) => r.id },
  { header: "at_utc", value: (r) => new Date(r.at).toISOString() },
  { header: "actor", value: (r) => r.actorEmail },
  { header: "actor_id", value: (r) => r.actorId },
  { header: "action", value: (r) => r.action },
  { header: "entity", value: (r) => r.entity },
  { header: "entity_id", value: (r) => r.entityId },
  { header: "before", value: (r) => json(r.before) },
  { header: "after", value: (r) => json(r.after) },
  { header: "prev_hash", value: (r) => r.prevHash },
  { header: "hash", value: (r) => r.hash },
];
