"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { masterSchema } from "@/lib/library/schema";
import { Button } from "../ui/Button";
import { Caution } from "../ui/Card";
import { errorAt, FormSection, idValue, NumberInput, numberValue, Select, TextArea, TextInput, useJsonSubmit } from "./form-kit";
import { ThroatReadout } from "./ThroatReadout";

type In = z.input<typeof masterSchema>;
type Out = z.output<typeof masterSchema>;
type HeadTypeOption = { id: number; castingNumber: string; engineFamily: string; intakeValveMm: number; exhaustValveMm: number };

export function MasterForm({ id, initial, headTypes, porters }: { id?: number; initial?: Partial<In>; headTypes: HeadTypeOption[]; porters: Array<{ id: number; name: string }> }) {
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(masterSchema),
    defaultValues: { notes: "", handPortNotes: {}, measurements: { intake: {}, exhaust: {} }, ...initial },
  });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; label: string }>(form, {
    url: id ? `/api/masters/${id}` : "/api/masters",
    method: id ? "PUT" : "POST",
    done: (r) => `Master ${r.label} saved.`,
    next: (r) => `/masters/${r.id}`,
  });
  const headTypeId = useWatch({ control: form.control, name: "headTypeId" });
  const ht = headTypes.find((h) => h.id === Number(headTypeId));
  const m = useWatch({ control: form.control, name: "measurements" });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Master head">
      <FormSection title="Master head">
        <TextInput id="m-label" label="Label" reg={form.register("label")} error={e.label?.message} hint="e.g. M-4471-02" />
        <Select
          id="m-headtype"
          label="Head type (casting)"
          reg={form.register("headTypeId", idValue)}
          error={e.headTypeId?.message}
          placeholder="Choose a casting"
          options={headTypes.map((h) => ({ value: h.id, label: `${h.castingNumber} — ${h.engineFamily}` }))}
        />
        <Select id="m-porter" label="Porter" reg={form.register("porterId", idValue)} error={e.porterId?.message} placeholder="(you, if you are a porter)" options={porters.map((p) => ({ value: p.id, label: p.name }))} />
        <TextInput id="m-started" type="date" label="Started" reg={form.register("startedOn", { setValueAs: (v) => v || null })} error={e.startedOn?.message} />
        <TextInput id="m-finished" type="date" label="Finished" reg={form.register("finishedOn", { setValueAs: (v) => v || null })} error={e.finishedOn?.message} />
      </FormSection>
      {(["intake", "exhaust"] as const).map((port) => (
        <FormSection key={port} title={port === "intake" ? "Intake port" : "Exhaust port"}>
          <div className="sm:col-span-2 lg:col-span-3">
            <TextArea id={`m-notes-${port}`} label="Hand-port notes" rows={3} reg={form.register(`handPortNotes.${port}`)} error={errorAt(e, `handPortNotes.${port}`)} hint="Bowl, short-side turn, guide boss, roof: what was done and why." />
          </div>
          <NumberInput id={`m-throat-${port}`} label="Throat by caliper" unit="mm" reg={form.register(`measurements.${port}.throatMm`, numberValue)} error={errorAt(e, `measurements.${port}.throatMm`)} />
          <NumberInput id={`m-seat-${port}`} label="Seat ID" unit="mm" reg={form.register(`measurements.${port}.seatIdMm`, numberValue)} error={errorAt(e, `measurements.${port}.seatIdMm`)} />
          <NumberInput id={`m-volume-${port}`} label="Port volume" unit="cc" reg={form.register(`measurements.${port}.portVolumeCc`, numberValue)} error={errorAt(e, `measurements.${port}.portVolumeCc`)} />
          <div className="sm:col-span-2 lg:col-span-3">
            <TextInput id={`m-short-${port}`} label="Short-side note" reg={form.register(`measurements.${port}.shortSideNote`)} error={errorAt(e, `measurements.${port}.shortSideNote`)} />
          </div>
          <div className="sm:col-span-2 lg:col-span-3">
            <ThroatReadout port={port} throatMm={m?.[port]?.throatMm as number | null | undefined} valveMm={ht ? (port === "intake" ? ht.intakeValveMm : ht.exhaustValveMm) : null} />
          </div>
        </FormSection>
      ))}
      <TextArea id="m-notes" label="General notes" reg={form.register("notes")} error={e.notes?.message} />
      <Caution title="Before removing more metal">
        <p>Check wall thickness near the water jackets and the valve seats before opening a port further; a hand reading is an estimate, and the flow bench and inspection decide.</p>
        <p>Wear eye protection at the grinder and keep guards in place.</p>
      </Caution>
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Register master"}
        </Button>
      </div>
    </form>
  );
}
