"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { HEAD_SOURCES } from "@/db/enums";
import { headUpdateSchema } from "@/lib/jobs/schema";
import { HEAD_SOURCE_LABEL, type HeadSource } from "@/lib/jobs/words";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof headUpdateSchema>;
type Out = z.output<typeof headUpdateSchema>;

export function HeadEditForm({ head }: { head: { id: number; serial: string; castingNumber: string; source: HeadSource; incomingNotes: string } }) {
  const router = useRouter();
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(headUpdateSchema),
    defaultValues: { serial: head.serial, castingNumber: head.castingNumber, source: head.source, incomingNotes: head.incomingNotes },
  });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (values) => {
    try {
      await fetchJson(`/api/heads/${head.id}`, { method: "PATCH", body: JSON.stringify(values) });
      toast.success("Head saved.");
      router.refresh();
    } catch (err) {
      showServerErrors(form, err, "The head could not be saved.");
    }
  });
  const id = (f: string) => `head-edit-${head.id}-${f}`;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Edit head">
      <Field label="Serial" htmlFor={id("serial")} error={errors.serial?.message}>
        <input id={id("serial")} className={inputClass(!!errors.serial)} {...form.register("serial")} />
      </Field>
      <Field label="Casting number" htmlFor={id("casting")} error={errors.castingNumber?.message}>
        <input id={id("casting")} className={inputClass(!!errors.castingNumber)} {...form.register("castingNumber")} />
      </Field>
      <Field label="Source" htmlFor={id("source")} error={errors.source?.message}>
        <select id={id("source")} className={inputClass(!!errors.source)} {...form.register("source")}>
          {HEAD_SOURCES.map((s) => (
            <option key={s} value={s}>
              {HEAD_SOURCE_LABEL[s]}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Incoming inspection" htmlFor={id("notes")} error={errors.incomingNotes?.message}>
        <textarea id={id("notes")} rows={3} className={inputClass(!!errors.incomingNotes)} {...form.register("incomingNotes")} />
      </Field>
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Save"}
      </Button>
    </form>
  );
}
