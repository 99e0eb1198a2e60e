"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm, useWatch } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { defaultPortsPerHead } from "@/lib/jobs/planning";
import { jobCreateSchema } from "@/lib/jobs/schema";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { idOrNull, numberOrNull } from "./options";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof jobCreateSchema>;
type Out = z.output<typeof jobCreateSchema>;

export type JobFormOptions = {
  customers: Array<{ id: number; name: string }>;
  headTypes: Array<{ id: number; castingNumber: string; engineFamily: string; cylinders: number }>;
  machines: Array<{ id: number; name: string }>;
  nextNumber?: string;
};

type Existing = { id: number; headTypeLocked: boolean } & Out;

/** Opens a job (no `job`) or edits one; the same schema as the server. */
export function JobForm({ options, job, presetCustomerId }: { options: JobFormOptions; job?: Existing; presetCustomerId?: number }) {
  const router = useRouter();
  const qc = useQueryClient();
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(jobCreateSchema),
    defaultValues: job ?? {
      number: options.nextNumber,
      customerId: presetCustomerId ?? (undefined as unknown as number),
      headTypeId: undefined as unknown as number,
      quantity: 1,
      cutIntake: true,
      cutExhaust: true,
      machineId: options.machines.length === 1 ? options.machines[0]!.id : null,
      dueOn: null,
      setupMinutes: 60,
      portsPerHead: null,
      notes: "",
    },
  });
  const { errors, isSubmitting } = form.formState;
  const headTypeId = useWatch({ control: form.control, name: "headTypeId" });
  const type = options.headTypes.find((h) => h.id === Number(headTypeId));
  const derived = type ? defaultPortsPerHead(type) : null;

  const submit = form.handleSubmit(async (values) => {
    try {
      const saved = await fetchJson<{ id: number; number: string }>(job ? `/api/jobs/${job.id}` : "/api/jobs", {
        method: job ? "PATCH" : "POST",
        body: JSON.stringify(values),
      });
      toast.success(job ? `Job ${saved.number} saved.` : `Job ${saved.number} opened.`);
      qc.invalidateQueries({ queryKey: ["jobs"] });
      if (job) router.refresh();
      else router.push(`/jobs/${saved.id}`);
    } catch (err) {
      showServerErrors(form, err, "The job could not be saved.");
    }
  });

  const id = (f: string) => `job-${job?.id ?? "new"}-${f}`;
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2" aria-label={job ? "Edit job" : "Open a job"}>
      <Field label="Job number" htmlFor={id("number")} error={errors.number?.message} hint="Letters, digits and dashes.">
        <input id={id("number")} className={inputClass(!!errors.number)} {...form.register("number")} />
      </Field>
      <Field label="Customer" htmlFor={id("customer")} error={errors.customerId?.message}>
        <select id={id("customer")} className={inputClass(!!errors.customerId)} {...form.register("customerId", { setValueAs: idOrNull })}>
          <option value="">Choose…</option>
          {options.customers.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Casting (head type)" htmlFor={id("type")} error={errors.headTypeId?.message} hint={job?.headTypeLocked ? "Locked once heads arrive." : undefined}>
        <select id={id("type")} aria-readonly={job?.headTypeLocked} className={inputClass(!!errors.headTypeId)} {...form.register("headTypeId", { setValueAs: idOrNull })}>
          {!job?.headTypeLocked && <option value="">Choose…</option>}
          {options.headTypes.filter((h) => !job?.headTypeLocked || h.id === job.headTypeId).map((h) => (
            <option key={h.id} value={h.id}>
              {h.castingNumber} — {h.engineFamily}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Heads (quantity)" htmlFor={id("qty")} error={errors.quantity?.message}>
        <input id={id("qty")} type="number" min={1} className={inputClass(!!errors.quantity)} {...form.register("quantity", { valueAsNumber: true })} />
      </Field>
      <fieldset className="flex flex-col gap-1 sm:col-span-2">
        <legend className="text-sm font-semibold text-ink">Ports to cut</legend>
        <div className="flex gap-6">
          <label className="flex items-center gap-2">
            <input type="checkbox" className="h-4 w-4 accent-copper" {...form.register("cutIntake")} /> Intake
          </label>
          <label className="flex items-center gap-2">
            <input type="checkbox" className="h-4 w-4 accent-copper" {...form.register("cutExhaust")} /> Exhaust
          </label>
        </div>
        {errors.cutIntake && (
          <p role="alert" className="text-sm text-bad">
            {errors.cutIntake.message}
          </p>
        )}
      </fieldset>
      <Field label="Machine" htmlFor={id("machine")} error={errors.machineId?.message}>
        <select id={id("machine")} className={inputClass(!!errors.machineId)} {...form.register("machineId", { setValueAs: idOrNull })}>
          <option value="">Not chosen yet</option>
          {options.machines.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Due" htmlFor={id("due")} error={errors.dueOn?.message}>
        <input id={id("due")} type="date" className={inputClass(!!errors.dueOn)} {...form.register("dueOn", { setValueAs: (v) => (v ? v : null) })} />
      </Field>
      <Field label="Setup (minutes)" htmlFor={id("setup")} error={errors.setupMinutes?.message} hint="Fixture plate, work offsets, first-article check.">
        <input id={id("setup")} type="number" min={0} step={5} className={inputClass(!!errors.setupMinutes)} {...form.register("setupMinutes", { valueAsNumber: true })} />
      </Field>
      <Field
        label="Ports of each kind per head"
        htmlFor={id("pph")}
        error={errors.portsPerHead?.message}
        hint={derived != null ? `Leave empty for ${derived} (one per cylinder on this casting).` : "Leave empty to derive it from the casting."}
      >
        <input id={id("pph")} type="number" min={1} className={inputClass(!!errors.portsPerHead)} {...form.register("portsPerHead", { setValueAs: numberOrNull })} />
      </Field>
      <div className="sm:col-span-2">
        <Field label="Notes" htmlFor={id("notes")} error={errors.notes?.message}>
          <textarea id={id("notes")} rows={3} className={inputClass(!!errors.notes)} {...form.register("notes")} />
        </Field>
      </div>
      <div className="sm:col-span-2">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : job ? "Save changes" : "Open the job"}
        </Button>
      </div>
    </form>
  );
}
