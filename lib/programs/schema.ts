/** Shapes of program and revision inputs, shared by the forms and the verbs. */
import { z } from "zod";
import { PORTS } from "@/db/enums";
import { notes, optionalRecordId, recordId, requiredText } from "../library/fields";

export const programSchema = z.object({
  headTypeId: recordId("a head type"),
  port: z.enum(PORTS, { message: "Choose intake or exhaust." }),
  name: requiredText("the program's name", 80),
  notes: notes(),
});
export type ProgramInput = z.input<typeof programSchema>;

export const revisionSchema = z.object({
  parentId: optionalRecordId(),
  sourceScanId: optionalRecordId(),
  plateId: optionalRecordId(),
  machineId: optionalRecordId(),
  changeNote: z.string().trim().min(3, { message: "Say what changed (at least a few words)." }).max(2000, { message: "Use at most 2000 characters." }),
});
export type RevisionInput = z.input<typeof revisionSchema>;

export const revisionMoveSchema = z.object({
  to: z.enum(["draft", "proving", "withdrawn"], { message: "Choose where the revision goes." }),
  note: z.string().trim().max(1000).default(""),
});
export type RevisionMoveInput = z.input<typeof revisionMoveSchema>;

export const releaseSchema = z.object({
  password: z.string().min(1, { message: "Enter your password to sign the release." }).max(200),
  overrideReason: z
    .string()
    .trim()
    .max(1000)
    .optional()
    .refine((v) => !v || v.length >= 10, { message: "Write the reason in a sentence (at least 10 characters)." }),
});
export type ReleaseInput = z.input<typeof releaseSchema>;
