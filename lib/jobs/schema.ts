/**
 * Shapes of every input of customers, jobs, heads and cuts, shared by the React forms
 * (react-hook-form + zodResolver) and the verbs, so the browser shows the server's messages.
 */
import { z } from "zod";
import { CUT_OUTCOMES, HEAD_SOURCES, JOB_STATES, PORTS } from "@/db/enums";

const text = (max: number, label = "This") => z.string().trim().max(max, { message: `${label} is too long (at most ${max} characters).` });
const id = (what: string) => z.number({ message: `Choose ${what}.` }).int().positive({ message: `Choose ${what}.` });
const optionalId = (what: string) => id(what).nullable().optional();

const calendarDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: "Use a date like 2026-12-04." })
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), {
    message: "That date does not exist.",
  });

// ─── Customers ──────────────────────────────────────────────────────────────

const customerFields = {
  name: z.string().trim().min(2, { message: "Enter the customer's name." }).max(120, { message: "Use at most 120 characters." }),
  contactName: text(120, "The contact name"),
  email: z
    .string()
    .trim()
    .toLowerCase()
    .max(200)
    .refine((v) => v === "" || z.email().safeParse(v).success, { message: "Enter a valid e-mail address, or leave it empty." }),
  phone: text(40, "The phone number"),
  address: text(400, "The address"),
  notes: text(4000, "The note"),
};

export const customerSchema = z.object({
  ...customerFields,
  contactName: customerFields.contactName.default(""),
  email: customerFields.email.default(""),
  phone: customerFields.phone.default(""),
  address: customerFields.address.default(""),
  notes: customerFields.notes.default(""),
});
export type CustomerInput = z.input<typeof customerSchema>;
export type Customer = z.output<typeof customerSchema>;

// No defaults here: a field left out of a change stays as it is.
export const customerUpdateSchema = z
  .object(customerFields)
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Nothing to change." });

// ─── Jobs ───────────────────────────────────────────────────────────────────

export const JOB_NUMBER_PATTERN = /^[A-Z0-9][A-Z0-9-]{1,23}$/;

const jobFields = {
  number: z
    .string()
    .trim()
    .toUpperCase()
    .regex(JOB_NUMBER_PATTERN, { message: "Use 2–24 letters, digits or dashes, e.g. J-2026-031." }),
  customerId: id("a customer"),
  headTypeId: id("a head type"),
  quantity: z.number({ message: "Enter how many heads." }).int({ message: "Whole heads only." }).min(1, { message: "At least one head." }).max(500, { message: "At most 500 heads per job." }),
  cutIntake: z.boolean(),
  cutExhaust: z.boolean(),
  machineId: optionalId("a machine"),
  dueOn: calendarDate.nullable().optional(),
  setupMinutes: z.number({ message: "Enter the setup time in minutes." }).min(0, { message: "Setup cannot be negative." }).max(24 * 60, { message: "At most 24 hours of setup." }),
  portsPerHead: z.number().int({ message: "Whole ports only." }).min(1, { message: "At least one port." }).max(32, { message: "At most 32 ports of a kind per head." }).nullable().optional(),
  notes: text(4000, "The note"),
};

export const jobCreateSchema = z
  .object({
    ...jobFields,
    number: jobFields.number.optional(),
    cutIntake: jobFields.cutIntake.default(true),
    cutExhaust: jobFields.cutExhaust.default(true),
    setupMinutes: jobFields.setupMinutes.default(60),
    notes: jobFields.notes.default(""),
  })
  .refine((v) => v.cutIntake || v.cutExhaust, { path: ["cutIntake"], message: "Cut at least one of the ports." });
export type JobCreateInput = z.input<typeof jobCreateSchema>;

export const jobUpdateSchema = z
  .object(jobFields)
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Nothing to change." });
export type JobUpdateInput = z.input<typeof jobUpdateSchema>;

export const chooseRevisionSchema = z.object({
  port: z.enum(PORTS, { message: "Choose intake or exhaust." }),
  /** null clears the choice. */
  revisionId: id("a revision").nullable(),
});
export type ChooseRevisionInput = z.input<typeof chooseRevisionSchema>;

export const moveJobSchema = z.object({
  to: z.enum(JOB_STATES, { message: "Choose where the job goes." }),
  note: text(1000, "The note").default(""),
});
export type MoveJobInput = z.input<typeof moveJobSchema>;

// ─── Heads ──────────────────────────────────────────────────────────────────

const serial = z
  .string()
  .trim()
  .min(1, { message: "Enter the head's serial or casting mark." })
  .max(40, { message: "Use at most 40 characters." })
  .regex(/^[\w./# -]+$/, { message: "Letters, digits, spaces and . / # - _ only." });

export const headSchema = z
  .object({
    jobId: optionalId("a job"),
    headTypeId: optionalId("a head type"),
    serial,
    castingNumber: text(40, "The casting number").optional(),
    source: z.enum(HEAD_SOURCES, { message: "Say whether this is the customer's core or shop stock." }),
    incomingNotes: text(4000, "The inspection note").default(""),
  })
  .refine((v) => v.jobId != null || v.headTypeId != null, { path: ["headTypeId"], message: "Choose the head type (or a job)." });
export type HeadInput = z.input<typeof headSchema>;

export const headUpdateSchema = z
  .object({ serial, castingNumber: text(40, "The casting number").min(1), source: z.enum(HEAD_SOURCES), incomingNotes: text(4000, "The inspection note") })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Nothing to change." });
export type HeadUpdateInput = z.input<typeof headUpdateSchema>;

// ─── Cuts ───────────────────────────────────────────────────────────────────

const when = z.number({ message: "Enter a time." }).int().positive();

const outcomeRules = <T extends { outcome?: string; reason?: string | null; startedAt?: number; endedAt?: number | null }>(v: T, ctx: z.RefinementCtx) => {
  if (v.outcome && v.outcome !== "good" && !v.reason?.trim()) {
    ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the cut is not good (e.g. broke into a water jacket, core shift)." });
  }
  if (v.startedAt != null && v.endedAt != null && v.endedAt < v.startedAt) {
    ctx.addIssue({ code: "custom", path: ["endedAt"], message: "The end is before the start." });
  }
};

export const cutSchema = z
  .object({
    headId: id("a head"),
    port: z.enum(PORTS, { message: "Choose intake or exhaust." }),
    cylinder: z.number().int().min(1).max(16).nullable().optional(),
    /** When sent, must equal the job's chosen revision: a guard against a stale form. */
    revisionId: optionalId("a revision"),
    machineId: optionalId("a machine"),
    startedAt: when,
    endedAt: when.nullable().optional(),
    outcome: z.enum(CUT_OUTCOMES, { message: "Choose good, rework or scrap." }),
    reason: text(1000, "The reason").nullable().optional(),
    notes: text(4000, "The note").default(""),
    flowTestId: optionalId("a flow test"),
  })
  .superRefine(outcomeRules);
export type CutInput = z.input<typeof cutSchema>;

export const cutUpdateSchema = z
  .object({
    endedAt: when.nullable(),
    outcome: z.enum(CUT_OUTCOMES),
    reason: text(1000, "The reason").nullable(),
    notes: text(4000, "The note"),
    flowTestId: id("a flow test").nullable(),
  })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Nothing to change." });
export type CutUpdateInput = z.input<typeof cutUpdateSchema>;
