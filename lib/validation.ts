/** zod at the edges: parse or throw an AppError carrying per-field messages. */
import type { z } from "zod";
import { AppError, type FieldErrors } from "./errors";

export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw new AppError("invalid", "Some fields need attention.", fieldErrors(result.error));
  }
  return result.data;
}
