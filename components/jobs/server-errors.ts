"use client";

import type { FieldValues, Path, UseFormReturn } from "react-hook-form";
import { toast } from "sonner";
import { ApiError } from "../table/fetch-json";

/** Puts the server's per-field messages under the fields and says the rest in a toast. */
export function showServerErrors<T extends FieldValues>(form: UseFormReturn<T, unknown, FieldValues> | UseFormReturn<T>, err: unknown, fallback: string) {
  if (err instanceof ApiError && err.fields) {
    for (const [k, msgs] of Object.entries(err.fields)) if (k !== "_") (form as UseFormReturn<T>).setError(k as Path<T>, { message: msgs[0] });
  }
  toast.error(err instanceof Error ? err.message : fallback);
}
