/** Inputs of machine tokens and of the machine's program fetch, shared by forms, routes and the CLI. */
import { z } from "zod";
import { PORTS } from "@/db/enums";

export const issueTokenSchema = z.object({
  machineId: z.number({ message: "Choose a machine." }).int().positive({ message: "Choose a machine." }),
  label: z.string().trim().min(2, { message: "Name the token, e.g. the cell computer it lives on." }).max(80, { message: "Use at most 80 characters." }),
});
export type IssueTokenInput = z.input<typeof issueTokenSchema>;

export const programFetchSchema = z.object({
  job: z.string().trim().min(1, { message: "Name the job number." }).max(24),
  port: z.enum(PORTS, { message: "The port is intake or exhaust." }),
});
export type ProgramFetchQuery = z.infer<typeof programFetchSchema>;
