"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { revisionSchema } from "@/lib/programs/schema";
import { FormSection, idValue, Select, TextArea, useJsonSubmit } from "../library/form-kit";
import { Button } from "../ui/Button";

type In = z.input<typeof revisionSchema>;
type Out = z.output<typeof revisionSchema>;

type Options = {
  revisions: Array<{ id: number; letter: string }>;
  scans: Array<{ id: number; masterLabel: string; scannedOn: string }>;
  plates: Array<{ id: number; code: string }>;
  machines: Array<{ id: number; name: string }>;
};

export function RevisionForm({ programId, id, initial, options }: { programId: number; id?: number; initial?: Partial<In>; options: Options }) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(revisionSchema), defaultValues: { changeNote: "", ...initial } });
  const e = form.formState.errors;
  const submit = useJsonSubmit<In, Out, { id: number; letter: string }>(form, {
    url: id ? `/api/revisions/${id}` : `/api/programs/${programId}/revisions`,
    method: id ? "PUT" : "POST",
    done: (r) => `Revision ${r.letter} saved as a draft.`,
    next: (r) => `/programs/${programId}/revisions/${r.id}`,
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Revision">
      <FormSection title="Where it comes from" note="Plate and machine default to the scan's when left empty.">
        <Select id="rv-parent" label="Parent revision" reg={form.register("parentId", idValue)} error={e.parentId?.message} placeholder={id ? "(none)" : "(the latest revision)"} options={options.revisions.map((r) => ({ value: r.id, label: `Revision ${r.letter}` }))} />
        <Select id="rv-scan" label="Source scan" reg={form.register("sourceScanId", idValue)} error={e.sourceScanId?.message} placeholder="(none)" options={options.scans.map((s) => ({ value: s.id, label: `S-${s.id} · ${s.masterLabel} · ${s.scannedOn}` }))} />
        <Select id="rv-plate" label="Fixture plate" reg={form.register("plateId", idValue)} error={e.plateId?.message} placeholder="(from the scan)" options={options.plates.map((p) => ({ value: p.id, label: p.code }))} />
        <Select id="rv-machine" label="Machine" reg={form.register("machineId", idValue)} error={e.machineId?.message} placeholder="(from the scan)" options={options.machines.map((m) => ({ value: m.id, label: m.name }))} />
      </FormSection>
      <TextArea id="rv-note" label="Change note" rows={4} reg={form.register("changeNote")} error={e.changeNote?.message} hint="What changed against the parent, and why." />
      <div>
        <Button type="submit" variant="primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : id ? "Save changes" : "Create draft revision"}
        </Button>
      </div>
    </form>
  );
}
