"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { headTypeSchema } from "@/lib/library/schema";
import { Button } from "../ui/Button";
import { FormSection, NumberInput, numberValue, TextArea, TextInput, useJsonSubmit } from "./form-kit";

type In = z.input<typeof headTypeSchema>;
type Out = z.output<typeof headTypeSchema>;

export function HeadTypeForm({ id, initial }: { id?: number; initial?: Partial<In> }) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(headTypeSchema), defaultValues: { notes: "", ...initial } });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; castingNumber: string }>(form, {
    url: id ? `/api/head-types/${id}` : "/api/head-types",
    method: id ? "PUT" : "POST",
    done: (r) => `Head type ${r.castingNumber} saved.`,
    next: (r) => `/head-types/${r.id}`,
  });
  const n = (name: keyof In) => form.register(name, numberValue);
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Head type">
      <FormSection title="Casting">
        <TextInput id="ht-casting" label="Casting number" reg={form.register("castingNumber")} error={e.castingNumber?.message} />
        <TextInput id="ht-family" label="Engine family" reg={form.register("engineFamily")} error={e.engineFamily?.message} />
        <NumberInput id="ht-cyl" label="Cylinders" step="1" reg={n("cylinders")} error={e.cylinders?.message} />
        <NumberInput id="ht-vpc" label="Valves per cylinder" step="1" reg={n("valvesPerCylinder")} error={e.valvesPerCylinder?.message} />
        <NumberInput id="ht-bore" label="Bore" unit="mm" reg={n("boreMm")} error={e.boreMm?.message} />
        <NumberInput id="ht-stroke" label="Stroke" unit="mm" reg={n("strokeMm")} error={e.strokeMm?.message} />
      </FormSection>
      <FormSection title="Valves and seats">
        <NumberInput id="ht-iv" label="Intake valve head" unit="mm" reg={n("intakeValveMm")} error={e.intakeValveMm?.message} />
        <NumberInput id="ht-ev" label="Exhaust valve head" unit="mm" reg={n("exhaustValveMm")} error={e.exhaustValveMm?.message} />
        <NumberInput id="ht-is" label="Intake seat ID" unit="mm" reg={n("intakeSeatIdMm")} error={e.intakeSeatIdMm?.message} hint="Optional" />
        <NumberInput id="ht-es" label="Exhaust seat ID" unit="mm" reg={n("exhaustSeatIdMm")} error={e.exhaustSeatIdMm?.message} hint="Optional" />
      </FormSection>
      <TextArea id="ht-notes" label="Notes" reg={form.register("notes")} error={e.notes?.message} hint="Casting quirks: thin walls, water jackets, core shift." />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Add head type"}
        </Button>
      </div>
    </form>
  );
}
