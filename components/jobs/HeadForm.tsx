"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { HEAD_SOURCES } from "@/db/enums";
import { headSchema } from "@/lib/jobs/schema";
import { HEAD_SOURCE_LABEL } from "@/lib/jobs/words";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof headSchema>;
type Out = z.output<typeof headSchema>;

/** Receives a head onto a job, with its incoming inspection. */
export function HeadForm({ jobId, castingNumber }: { jobId: number; castingNumber: string }) {
  const router = useRouter();
  const empty: In = { jobId, serial: "", castingNumber, source: "customer_core", incomingNotes: "" };
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(headSchema), defaultValues: empty });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (values) => {
    try {
      const head = await fetchJson<{ serial: string }>("/api/heads", { method: "POST", body: JSON.stringify(values) });
      toast.success(`Head ${head.serial} received.`);
      form.reset(empty);
      router.refresh();
    } catch (err) {
      showServerErrors(form, err, "The head could not be recorded.");
    }
  });
  const id = (f: string) => `head-${jobId}-${f}`;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Receive a head">
      <Field label="Serial or casting mark" htmlFor={id("serial")} error={errors.serial?.message}>
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
      <Field label="Incoming inspection" htmlFor={id("notes")} error={errors.incomingNotes?.message} hint="Cracks, previous repairs, seat condition, anything odd.">
        <textarea id={id("notes")} rows={3} className={inputClass(!!errors.incomingNotes)} {...form.register("incomingNotes")} />
      </Field>
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Receive head"}
      </Button>
    </form>
  );
}
