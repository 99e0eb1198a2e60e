"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { programSchema } from "@/lib/programs/schema";
import { FormSection, idValue, Select, TextArea, TextInput, useJsonSubmit } from "../library/form-kit";
import { Button } from "../ui/Button";

type In = z.input<typeof programSchema>;
type Out = z.output<typeof programSchema>;

export function ProgramForm({ id, initial, headTypes }: { id?: number; initial?: Partial<In>; headTypes: Array<{ id: number; castingNumber: string }> }) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(programSchema), defaultValues: { notes: "", port: "intake", ...initial } });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; name: string }>(form, {
    url: id ? `/api/programs/${id}` : "/api/programs",
    method: id ? "PUT" : "POST",
    done: (r) => `Program ${r.name} saved.`,
    next: (r) => `/programs/${r.id}`,
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Program">
      <FormSection title="Program">
        <Select id="pg-headtype" label="Casting" reg={form.register("headTypeId", idValue)} error={e.headTypeId?.message} placeholder="Choose a casting" options={headTypes.map((h) => ({ value: h.id, label: h.castingNumber }))} />
        <Select id="pg-port" label="Port" reg={form.register("port")} error={e.port?.message} options={[{ value: "intake", label: "Intake" }, { value: "exhaust", label: "Exhaust" }]} />
        <TextInput id="pg-name" label="Name" reg={form.register("name")} error={e.name?.message} hint="e.g. Street intake" />
      </FormSection>
      <TextArea id="pg-notes" label="Notes" reg={form.register("notes")} error={e.notes?.message} />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Create program"}
        </Button>
      </div>
    </form>
  );
}
