"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm, type UseFormRegister } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { headUpdateSchema } from "@/lib/jobs/schema";
import type { HeadSource } from "@/lib/jobs/words";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { HeadFields, type HeadFieldValues } from "./HeadFields";
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
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Edit head">
      <HeadFields register={form.register as unknown as UseFormRegister<HeadFieldValues>} errors={errors} idPrefix={`head-edit-${head.id}`} serialLabel="Serial" />
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Save"}
      </Button>
    </form>
  );
}
