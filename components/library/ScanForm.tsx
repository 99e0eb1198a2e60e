"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { scanSchema } from "@/lib/library/schema";
import { Button } from "../ui/Button";
import { FormSection, idValue, NumberInput, numberValue, Select, TextArea, TextInput, useJsonSubmit } from "./form-kit";

type In = z.input<typeof scanSchema>;
type Out = z.output<typeof scanSchema>;

type Options = {
  masters: Array<{ id: number; label: string; headTypeId: number; castingNumber: string }>;
  plates: Array<{ id: number; code: string; headTypeId: number }>;
  machines: Array<{ id: number; name: string }>;
  operators: Array<{ id: number; name: string }>;
};

export function ScanForm({ id, initial, options }: { id?: number; initial?: Partial<In>; options: Options }) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(scanSchema), defaultValues: { notes: "", port: "intake", scannedOn: new Date().toISOString().slice(0, 10), ...initial } });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number }>(form, {
    url: id ? `/api/scans/${id}` : "/api/scans",
    method: id ? "PUT" : "POST",
    done: (r) => `Scan S-${r.id} saved.`,
    next: (r) => `/scans/${r.id}`,
  });
  const masterId = useWatch({ control: form.control, name: "masterId" });
  const master = options.masters.find((m) => m.id === Number(masterId));
  const plates = master ? options.plates.filter((p) => p.headTypeId === master.headTypeId) : options.plates;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Scan">
      <FormSection title="Digitizing run">
        <Select id="s-master" label="Master head" reg={form.register("masterId", idValue)} error={e.masterId?.message} placeholder="Choose a master" options={options.masters.map((m) => ({ value: m.id, label: `${m.label} (${m.castingNumber})` }))} />
        <Select id="s-port" label="Port" reg={form.register("port")} error={e.port?.message} options={[{ value: "intake", label: "Intake" }, { value: "exhaust", label: "Exhaust" }]} />
        <Select id="s-plate" label="Fixture plate" reg={form.register("plateId", idValue)} error={e.plateId?.message} placeholder="Choose a plate" options={plates.map((p) => ({ value: p.id, label: p.code }))} />
        <Select id="s-machine" label="Machine" reg={form.register("machineId", idValue)} error={e.machineId?.message} placeholder="Choose a machine" options={options.machines.map((m) => ({ value: m.id, label: m.name }))} />
        <Select id="s-operator" label="Operator" reg={form.register("operatorId", idValue)} error={e.operatorId?.message} placeholder="(you)" options={options.operators.map((p) => ({ value: p.id, label: p.name }))} />
        <TextInput id="s-date" type="date" label="Scanned on" reg={form.register("scannedOn")} error={e.scannedOn?.message} />
        <NumberInput id="s-stylus" label="Stylus diameter" unit="mm" reg={form.register("stylusDiameterMm", numberValue)} error={e.stylusDiameterMm?.message} />
        <NumberInput id="s-spacing" label="Point spacing" unit="mm" reg={form.register("pointSpacingMm", numberValue)} error={e.pointSpacingMm?.message} />
      </FormSection>
      <TextArea id="s-notes" label="Notes" reg={form.register("notes")} error={e.notes?.message} />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Record scan"}
        </Button>
      </div>
    </form>
  );
}
