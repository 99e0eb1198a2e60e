"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { Controller, useForm, useWatch } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { CUT_OUTCOMES, type Port } from "@/db/enums";
import { cutSchema } from "@/lib/jobs/schema";
import { CUT_OUTCOME_LABEL, HEAD_STATE_LABEL, PORT_LABEL, type HeadState } from "@/lib/jobs/words";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { currentTime, fromLocalInput, idOrNull, numberOrNull, toLocalInput } from "./options";
import { CuttingCaution } from "./CuttingCaution";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof cutSchema>;
type Out = z.output<typeof cutSchema>;

export type CutFormProps = {
  jobId: number;
  heads: Array<{ id: number; serial: string; state: HeadState }>;
  ports: Array<{ port: Port; revisionId: number; revisionLabel: string }>;
  machines: Array<{ id: number; name: string }>;
  machineId: number | null;
  cylinders: number;
  flowTests: Array<{ id: number; headId: number; label: string }>;
  /** When the page was rendered: the form's default end time (the cut just finished). */
  now: number;
  /** No head of the job is cut yet: the first-article caution leads. */
  firstArticle: boolean;
};

/** The machinist's record of one port cut on one head, against the job's chosen revision. */
export function CutForm({ jobId, heads, ports, machines, machineId, cylinders, flowTests, now, firstArticle }: CutFormProps) {
  const router = useRouter();
  // Heads still waiting come first, so the form starts on the next one to cut.
  const waiting = (h: { state: HeadState }) => (h.state === "received" || h.state === "cutting" ? 0 : 1);
  const open = heads.filter((h) => h.state !== "scrapped" && h.state !== "shipped").sort((a, b) => waiting(a) - waiting(b));
  const blank = (now: number): In => ({
    headId: open[0]?.id ?? (undefined as unknown as number),
    port: ports[0]?.port ?? "intake",
    revisionId: ports[0]?.revisionId,
    machineId,
    cylinder: null,
    startedAt: now - 45 * 60_000,
    endedAt: now,
    outcome: "good",
    reason: "",
    notes: "",
    flowTestId: null,
  });
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(cutSchema), defaultValues: blank(now) });
  const { errors, isSubmitting } = form.formState;
  const outcome = useWatch({ control: form.control, name: "outcome" });
  const port = useWatch({ control: form.control, name: "port" });
  const headId = Number(useWatch({ control: form.control, name: "headId" }));
  const revision = ports.find((p) => p.port === port);

  const submit = form.handleSubmit(async (values) => {
    try {
      const res = await fetchJson<{ headState: HeadState }>("/api/cuts", { method: "POST", body: JSON.stringify({ ...values, revisionId: revision?.revisionId }) });
      toast.success(`Cut recorded; the head is now ${HEAD_STATE_LABEL[res.headState].toLowerCase()}.`);
      form.reset(blank(currentTime()));
      router.refresh();
    } catch (err) {
      showServerErrors(form, err, "The cut could not be recorded.");
    }
  });

  if (ports.length === 0) return <p className="text-sm text-warn">Cuts can be recorded once the lead has chosen a released revision for a port.</p>;
  if (open.length === 0) return <p className="text-sm text-ink-soft">No head of this job is waiting to be cut. Receive a head first.</p>;

  const id = (f: string) => `cut-${jobId}-${f}`;
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2" aria-label="Record a cut">
      <div className="sm:col-span-2">
        <CuttingCaution firstArticle={firstArticle} compact />
      </div>
      <Field label="Head" htmlFor={id("head")} error={errors.headId?.message}>
        <select id={id("head")} className={inputClass(!!errors.headId)} {...form.register("headId", { setValueAs: idOrNull })}>
          {open.map((h) => (
            <option key={h.id} value={h.id}>
              {h.serial} ({HEAD_STATE_LABEL[h.state].toLowerCase()})
            </option>
          ))}
        </select>
      </Field>
      <Field label="Port" htmlFor={id("port")} error={errors.port?.message} hint={revision ? `Cut with ${revision.revisionLabel}, the job's revision.` : undefined}>
        <select id={id("port")} className={inputClass(!!errors.port)} {...form.register("port")}>
          {ports.map((p) => (
            <option key={p.port} value={p.port}>
              {PORT_LABEL[p.port]}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Machine" htmlFor={id("machine")} error={errors.machineId?.message}>
        <select id={id("machine")} className={inputClass(!!errors.machineId)} {...form.register("machineId", { setValueAs: idOrNull })}>
          <option value="">Choose…</option>
          {machines.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Cylinder (only if one port)" htmlFor={id("cyl")} error={errors.cylinder?.message} hint="Leave empty when the cut covers every port of this kind.">
        <input id={id("cyl")} type="number" min={1} max={cylinders} className={inputClass(!!errors.cylinder)} {...form.register("cylinder", { setValueAs: numberOrNull })} />
      </Field>
      <Field label="Started" htmlFor={id("start")} error={errors.startedAt?.message}>
        <Controller
          control={form.control}
          name="startedAt"
          render={({ field }) => (
            <input
              id={id("start")}
              type="datetime-local"
              className={inputClass(!!errors.startedAt)}
              value={typeof field.value === "number" && Number.isFinite(field.value) ? toLocalInput(field.value) : ""}
              onChange={(e) => field.onChange(fromLocalInput(e.target.value))}
              onBlur={field.onBlur}
            />
          )}
        />
      </Field>
      <Field label="Ended" htmlFor={id("end")} error={errors.endedAt?.message}>
        <Controller
          control={form.control}
          name="endedAt"
          render={({ field }) => (
            <input
              id={id("end")}
              type="datetime-local"
              className={inputClass(!!errors.endedAt)}
              value={typeof field.value === "number" && Number.isFinite(field.value) ? toLocalInput(field.value) : ""}
              onChange={(e) => field.onChange(fromLocalInput(e.target.value))}
              onBlur={field.onBlur}
            />
          )}
        />
      </Field>
      <fieldset className="flex flex-col gap-1 sm:col-span-2">
        <legend className="text-sm font-semibold text-ink">Outcome</legend>
        <div className="flex flex-wrap gap-5">
          {CUT_OUTCOMES.map((o) => (
            <label key={o} className="flex items-center gap-2">
              <input type="radio" value={o} className="h-4 w-4 accent-copper" {...form.register("outcome")} /> {CUT_OUTCOME_LABEL[o]}
            </label>
          ))}
        </div>
      </fieldset>
      {outcome !== "good" && (
        <div className="sm:col-span-2">
          <Field label="Reason" htmlFor={id("reason")} error={errors.reason?.message} hint="e.g. broke into the water jacket under the short side; core shift.">
            <textarea id={id("reason")} rows={2} className={inputClass(!!errors.reason)} {...form.register("reason")} />
          </Field>
        </div>
      )}
      <Field label="Post-cut flow test (optional)" htmlFor={id("flow")} error={errors.flowTestId?.message}>
        <select id={id("flow")} className={inputClass(!!errors.flowTestId)} {...form.register("flowTestId", { setValueAs: idOrNull })}>
          <option value="">None</option>
          {flowTests
            .filter((t) => t.headId === headId)
            .map((t) => (
              <option key={t.id} value={t.id}>
                {t.label}
              </option>
            ))}
        </select>
      </Field>
      <Field label="Notes" htmlFor={id("notes")} error={errors.notes?.message}>
        <input id={id("notes")} className={inputClass(!!errors.notes)} {...form.register("notes")} />
      </Field>
      <div className="sm:col-span-2">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Record the cut"}
        </Button>
      </div>
    </form>
  );
}
