"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm, type UseFormRegister } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { headSchema } from "@/lib/jobs/schema";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { HeadFields, type HeadFieldValues } from "./HeadFields";
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
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Receive a head">
      <HeadFields register={form.register as unknown as UseFormRegister<HeadFieldValues>} errors={errors} idPrefix={`head-${jobId}`} serialLabel="Serial or casting mark" notesHint="Cracks, previous repairs, seat condition, anything odd." />
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Receive head"}
      </Button>
    </form>
  );
}
