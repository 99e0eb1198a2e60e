"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { machineSchema } from "@/lib/library/schema";
import { Button } from "../ui/Button";
import { errorAt, FormSection, NumberInput, numberValue, TextArea, TextInput, useJsonSubmit } from "./form-kit";

type In = z.input<typeof machineSchema>;
type Out = z.output<typeof machineSchema>;

export function MachineForm({ id, initial }: { id?: number; initial?: Partial<In> }) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(machineSchema), defaultValues: { description: "", notes: "", axes: "XYZAB", active: true, ...initial } });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; name: string }>(form, {
    url: id ? `/api/machines/${id}` : "/api/machines",
    method: id ? "PUT" : "POST",
    done: (r) => `Machine ${r.name} saved.`,
    next: (r) => `/machines/${r.id}`,
  });
  const axes = (useWatch({ control: form.control, name: "axes" }) ?? "").toUpperCase();
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Machine">
      <FormSection title="Machine">
        <TextInput id="mc-name" label="Name" reg={form.register("name")} error={e.name?.message} />
        <TextInput id="mc-axes" label="Axes" reg={form.register("axes")} error={e.axes?.message} hint="XYZ then any of A, B, C, e.g. XYZAB" />
        <label className="flex items-center gap-2 self-end pb-2 text-sm font-semibold">
          <input type="checkbox" {...form.register("active")} /> In service
        </label>
        <div className="sm:col-span-2 lg:col-span-3">
          <TextInput id="mc-desc" label="Description" reg={form.register("description")} error={e.description?.message} />
        </div>
      </FormSection>
      <FormSection title="Linear travel (machine coordinates, mm)">
        {(["X", "Y", "Z"] as const).flatMap((axis) =>
          (["min", "max"] as const).map((side) => (
            <NumberInput key={`${axis}-${side}`} id={`mc-t-${axis}-${side}`} label={`${axis} ${side === "min" ? "minimum" : "maximum"}`} unit="mm" reg={form.register(`limits.travelMm.${axis}.${side}`, numberValue)} error={errorAt(e, `limits.travelMm.${axis}.${side}`)} />
          )),
        )}
      </FormSection>
      <FormSection title="Rotary limits (degrees)" note="Leave both empty for a continuous axis.">
        {(["A", "B", "C"] as const)
          .filter((a) => axes.includes(a))
          .flatMap((axis) =>
            (["min", "max"] as const).map((side) => (
              <NumberInput
                key={`${axis}-${side}`}
                id={`mc-r-${axis}-${side}`}
                label={`${axis} ${side === "min" ? "minimum" : "maximum"}`}
                unit="°"
                reg={form.register(`limits.rotaryDeg.${axis}.${side}`, numberValue)}
                error={errorAt(e, `limits.rotaryDeg.${axis}.${side}`) ?? errorAt(e, `limits.rotaryDeg.${axis}`)}
              />
            )),
          )}
      </FormSection>
      <FormSection title="Rates and times">
        {(["X", "Y", "Z", "A", "B", "C"] as const)
          .filter((a) => axes.includes(a))
          .map((axis) => (
            <NumberInput key={axis} id={`mc-rapid-${axis}`} label={`${axis} rapid`} unit={"XYZ".includes(axis) ? "mm/min" : "°/min"} reg={form.register(`limits.rapidPerMin.${axis}`, numberValue)} error={errorAt(e, `limits.rapidPerMin.${axis}`)} />
          ))}
        <NumberInput id="mc-feed" label="Maximum feed" unit="mm/min" reg={form.register("maxFeedMmMin", numberValue)} error={e.maxFeedMmMin?.message} />
        <NumberInput id="mc-rpm" label="Maximum spindle" unit="rpm" reg={form.register("maxSpindleRpm", numberValue)} error={e.maxSpindleRpm?.message} />
        <NumberInput id="mc-tc" label="Tool change" unit="s" reg={form.register("toolChangeS", numberValue)} error={e.toolChangeS?.message} />
      </FormSection>
      <TextArea id="mc-notes" label="Notes" reg={form.register("notes")} error={e.notes?.message} hint="Per the machine builder's manual; guard and interlock checks." />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Add machine"}
        </Button>
      </div>
    </form>
  );
}
