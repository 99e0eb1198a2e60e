"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useFieldArray, useForm } from "react-hook-form";
import type { z } from "zod";
import { plateSchema, WORK_OFFSET_CODES } from "@/lib/library/schema";
import { Button } from "../ui/Button";
import { errorAt, FormSection, idValue, NumberInput, numberValue, Select, TextArea, TextInput, useJsonSubmit } from "./form-kit";

type In = z.input<typeof plateSchema>;
type Out = z.output<typeof plateSchema>;

export function PlateForm({ id, initial, headTypes }: { id?: number; initial?: Partial<In>; headTypes: Array<{ id: number; castingNumber: string }> }) {
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(plateSchema),
    defaultValues: {
      datumDescription: "",
      notes: "",
      workOffsets: [{ code: "G54", x: 0, y: 0, z: 0 }],
      portAxisAngles: { intake: {}, exhaust: {} },
      ...initial,
    },
  });
  const offsets = useFieldArray({ control: form.control, name: "workOffsets" });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; code: string }>(form, {
    url: id ? `/api/plates/${id}` : "/api/plates",
    method: id ? "PUT" : "POST",
    done: (r) => `Plate ${r.code} saved.`,
    next: (r) => `/plates/${r.id}`,
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Fixture plate">
      <FormSection title="Plate">
        <TextInput id="p-code" label="Plate code" reg={form.register("code")} error={e.code?.message} />
        <Select id="p-headtype" label="For casting" reg={form.register("headTypeId", idValue)} error={e.headTypeId?.message} placeholder="Choose a casting" options={headTypes.map((h) => ({ value: h.id, label: h.castingNumber }))} />
        <div className="sm:col-span-2 lg:col-span-3">
          <TextArea id="p-datum" label="Datum and dowels" reg={form.register("datumDescription")} error={e.datumDescription?.message} hint="How the head locates: dowels, faces, clamps, where zero is." />
        </div>
      </FormSection>
      <fieldset className="rounded-lg border border-rule bg-card p-4">
        <legend className="px-1 text-sm font-bold uppercase tracking-wider text-ink-soft">Work offsets (machine coordinates of work zero)</legend>
        {errorAt(e, "workOffsets") && <p className="mb-2 text-sm text-bad" role="alert">{errorAt(e, "workOffsets")}</p>}
        <div className="flex flex-col gap-3">
          {offsets.fields.map((field, i) => (
            <div key={field.id} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-7">
              <Select id={`p-wo-${i}-code`} label="Code" reg={form.register(`workOffsets.${i}.code`)} error={errorAt(e, `workOffsets.${i}.code`)} options={WORK_OFFSET_CODES.map((c) => ({ value: c, label: c }))} />
              {(["x", "y", "z", "a", "b"] as const).map((axis) => (
                <NumberInput key={axis} id={`p-wo-${i}-${axis}`} label={axis.toUpperCase()} unit={axis === "a" || axis === "b" ? "°" : "mm"} reg={form.register(`workOffsets.${i}.${axis}`, numberValue)} error={errorAt(e, `workOffsets.${i}.${axis}`)} />
              ))}
              <Button variant="quiet" onClick={() => offsets.remove(i)} disabled={offsets.fields.length <= 1} aria-label={`Remove offset ${i + 1}`}>
                Remove
              </Button>
            </div>
          ))}
          <div>
            <Button onClick={() => offsets.append({ code: WORK_OFFSET_CODES[Math.min(offsets.fields.length, 5)], x: 0, y: 0, z: 0 })} disabled={offsets.fields.length >= 6}>
              Add a work offset
            </Button>
          </div>
        </div>
      </fieldset>
      <FormSection title="Port-axis angles (degrees)" note="The rotary positions that point each port's axis along the spindle.">
        {(["intake", "exhaust"] as const).flatMap((port) =>
          (["a", "b"] as const).map((axis) => (
            <NumberInput key={`${port}-${axis}`} id={`p-ang-${port}-${axis}`} label={`${port === "intake" ? "Intake" : "Exhaust"} ${axis.toUpperCase()}`} unit="°" reg={form.register(`portAxisAngles.${port}.${axis}`, numberValue)} error={errorAt(e, `portAxisAngles.${port}.${axis}`)} />
          )),
        )}
      </FormSection>
      <FormSection title="Allowed envelope (work coordinates, mm)" note="Every toolpath on this plate is checked against this box: keep the tool out of the plate, clamps and dowels.">
        {(["min", "max"] as const).flatMap((side) =>
          (["x", "y", "z"] as const).map((axis) => (
            <NumberInput key={`${side}-${axis}`} id={`p-env-${side}-${axis}`} label={`${axis.toUpperCase()} ${side === "min" ? "minimum" : "maximum"}`} unit="mm" reg={form.register(`envelope.${side}.${axis}`, numberValue)} error={errorAt(e, `envelope.${side}.${axis}`)} />
          )),
        )}
      </FormSection>
      <TextArea id="p-notes" label="Notes" reg={form.register("notes")} error={e.notes?.message} />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Add plate"}
        </Button>
      </div>
    </form>
  );
}
