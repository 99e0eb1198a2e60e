"use client";

/**
 * Recording (or, for a lead, correcting) a flow test. react-hook-form with the server's own zod
 * schema, so the messages match; the computed columns follow every keystroke (liveFlowFigures).
 */
import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef } from "react";
import { useFieldArray, useForm, useWatch, type FieldPath } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import type { SubjectOptions } from "@/db/queries/flow-tests";
import { AREA_UNITS, FLOW_UNITS, LIFT_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, length, pressure } from "@/lib/flow";
import { liveFlowFigures, type DraftValues } from "@/lib/flowtests/live";
import { flowTestRecordSchema } from "@/lib/flowtests/schema";
import { PORT_WORDS, SUBJECT_WORDS, fixed } from "@/lib/flowtests/words";
import { FLOW_SUBJECTS, PORTS } from "@/db/enums";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Card } from "../ui/Card";
import { Field, inputClass } from "../ui/Field";
import { CsvImportPanel, type LoadedCsv } from "./CsvImportPanel";
import { FlowCaution, FlowConventions } from "./FlowConventions";
import { FlowChart } from "./FlowChart";
import { AREA_UNIT_LABEL, FLOW_UNIT_LABEL, LENGTH_UNIT_LABEL, PRESSURE_UNIT_LABEL, TEMPERATURE_UNIT_LABEL, numeric } from "./units";

type In = z.input<typeof flowTestRecordSchema>;
type Out = z.output<typeof flowTestRecordSchema>;

const idValue = (v: unknown) => (v === "" || v == null ? undefined : Number(v));
const SUBJECT_HINT = {
  baseline: "An as-cast port, before any porting: the reference for gains.",
  master: "The hand-ported master head.",
  revision: "The first head cut with a program revision.",
  head: "A production head, e.g. a check after cutting.",
} as const;

function errorText(errors: unknown, path: string): string | undefined {
  let node = errors as Record<string, unknown> | undefined;
  for (const key of path.split(".")) node = node?.[key] as Record<string, unknown> | undefined;
  const message = (node as { message?: string; root?: { message?: string } } | undefined)?.message ?? (node as { root?: { message?: string } } | undefined)?.root?.message;
  return typeof message === "string" ? message : undefined;
}

export function FlowTestForm({ mode, id, initial }: { mode: "create" | "edit"; id?: number; initial: In }) {
  const router = useRouter();
  const qc = useQueryClient();
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(flowTestRecordSchema), defaultValues: initial, mode: "onTouched" });
  const { control, register, setValue, getFieldState, formState } = form;
  const { errors, isSubmitting } = formState;
  const rows = useFieldArray({ control, name: "points" });
  const values = useWatch({ control }) as In;
  const live = useMemo(() => liveFlowFigures(values as DraftValues), [values]);
  const err = (path: string) => errorText(errors, path);
  const num = (name: FieldPath<In>) => register(name, { setValueAs: numeric });

  const headTypeId = values.headTypeId;
  // Castings and operators once; the masters, revisions and heads of the chosen casting as it changes.
  const base = useQuery({ queryKey: ["flow-subjects", "all"], queryFn: () => fetchJson<SubjectOptions>("/api/flow-tests/subjects") });
  const subjects = useQuery({
    queryKey: ["flow-subjects", headTypeId ?? null],
    queryFn: () => fetchJson<SubjectOptions>(`/api/flow-tests/subjects?headTypeId=${headTypeId}`),
    enabled: !!headTypeId,
  });
  const options = subjects.data;
  const headType = base.data?.headTypes.find((t) => t.id === headTypeId);

  // Fill the valve and seat from the casting until the person types their own.
  const filledFrom = useRef<string>("");
  useEffect(() => {
    if (mode !== "create" || !headType) return;
    const key = `${headType.id}-${values.port}-${values.lengthUnit}`;
    if (filledFrom.current === key) return;
    const valveTouched = getFieldState("valveDiameter").isDirty;
    const seatTouched = getFieldState("seatDiameter").isDirty;
    filledFrom.current = key;
    const unit = values.lengthUnit ?? "mm";
    const toUnit = (mm: number | null) => (mm == null ? undefined : Number(length.convert(mm, "mm", unit).toFixed(unit === "in" ? 3 : 2)));
    const exhaust = values.port === "exhaust";
    if (!valveTouched) setValue("valveDiameter", toUnit(exhaust ? headType.exhaustValveMm : headType.intakeValveMm) as number, { shouldValidate: false });
    if (!seatTouched) setValue("seatDiameter", toUnit(exhaust ? headType.exhaustSeatIdMm : headType.intakeSeatIdMm), { shouldValidate: false });
  }, [mode, headType, values.port, values.lengthUnit, getFieldState, setValue]);

  const onCsv = (csv: LoadedCsv) => {
    const depressionUnit = values.depressionUnit ?? "inH2O";
    rows.replace(
      csv.rows.map((r) =>
        r.depression === undefined || !csv.units.depression
          ? { lift: r.lift, flow: r.flow }
          : // A row's own depression is kept in the test's depression unit.
            { lift: r.lift, flow: r.flow, depression: Number(pressure.convert(r.depression, csv.units.depression, depressionUnit).toPrecision(8)) },
      ),
    );
    setValue("liftUnit", csv.units.lift);
    setValue("flowUnit", csv.units.flow);
    if (!values.notes) setValue("notes", `Imported from ${csv.fileName}.`);
  };

  const addRow = () => {
    const last = values.points?.[values.points.length - 1]?.lift;
    const step = values.liftUnit === "in" ? 0.05 : 1;
    const next = typeof last === "number" && Number.isFinite(last) ? Number((last + step).toFixed(4)) : step;
    rows.append({ lift: next, flow: undefined as unknown as number });
  };

  const submit = form.handleSubmit(async (record) => {
    try {
      const saved = await fetchJson<{ id: number }>(mode === "create" ? "/api/flow-tests" : `/api/flow-tests/${id}`, {
        method: mode === "create" ? "POST" : "PUT",
        body: JSON.stringify(record),
      });
      toast.success(mode === "create" ? `Flow test #${saved.id} recorded.` : `Flow test #${saved.id} changed.`);
      await qc.invalidateQueries({ queryKey: ["flow-tests"] });
      router.push(`/flow-tests/${saved.id}`);
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError && error.fields) {
        for (const [key, messages] of Object.entries(error.fields)) {
          if (key !== "_") form.setError(key as FieldPath<In>, { message: messages[0] });
        }
      }
      toast.error(error instanceof Error ? error.message : "The test could not be saved.");
    }
  });

  const hasRowDepression = (values.points ?? []).some((p) => p?.depression !== undefined && p?.depression !== null);
  const link = values.subject === "master" ? "masterId" : values.subject === "revision" ? "revisionId" : values.subject === "head" ? "headId" : null;
  const linkChoices =
    link === "masterId"
      ? (options?.masters ?? []).map((m) => ({ id: m.id, label: `${m.label} (${m.stage.replace(/_/g, " ")})` }))
      : link === "revisionId"
        ? (options?.revisions ?? []).map((r) => ({ id: r.id, label: `${r.label} — ${r.port}, ${r.state}` }))
        : link === "headId"
          ? (options?.heads ?? []).map((h) => ({ id: h.id, label: h.serial }))
          : [];
  const linkWord = link === "masterId" ? "master head" : link === "revisionId" ? "program revision" : "production head";
  const summary = live.result?.summary;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5" aria-label={mode === "create" ? "Record a flow test" : "Change a flow test"}>
      <Card title="What was tested">
        <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-4">
          <Field label="Head type (casting)" htmlFor="ft-head-type" error={err("headTypeId")}>
            {/* Controlled: the options arrive after the first render, and the choice must still show. */}
            <select id="ft-head-type" className={inputClass(!!errors.headTypeId)} {...register("headTypeId", { setValueAs: idValue })} value={values.headTypeId ?? ""}>
              <option value="">{base.isPending ? "loading…" : base.isError ? "could not load the castings" : "choose…"}</option>
              {(base.data?.headTypes ?? []).map((t) => (
                <option key={t.id} value={t.id}>
                  {t.castingNumber} — {t.engineFamily}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Port" htmlFor="ft-port" error={err("port")}>
            <select id="ft-port" className={inputClass(!!errors.port)} {...register("port")}>
              {PORTS.map((p) => (
                <option key={p} value={p}>
                  {PORT_WORDS[p]}
                </option>
              ))}
            </select>
          </Field>
          <Field label="Cylinder" htmlFor="ft-cylinder" error={err("cylinder")} hint={headType ? `1 to ${headType.cylinders}` : undefined}>
            <input id="ft-cylinder" inputMode="numeric" className={inputClass(!!errors.cylinder)} {...num("cylinder")} />
          </Field>
          <Field label="Port number on that cylinder" htmlFor="ft-port-number" error={err("portNumber")} hint="for heads with two ports of a kind">
            <input id="ft-port-number" inputMode="numeric" className={inputClass(!!errors.portNumber)} {...num("portNumber")} />
          </Field>
        </div>
        <fieldset className="mt-4">
          <legend className="text-sm font-semibold text-ink">What was on the bench</legend>
          <div className="mt-2 grid gap-2 sm:grid-cols-2 xl:grid-cols-4">
            {FLOW_SUBJECTS.map((s) => (
              <label key={s} className={`flex cursor-pointer gap-2 rounded-md border px-3 py-2 text-sm ${values.subject === s ? "border-copper bg-copper-wash" : "border-rule bg-card"}`}>
                <input type="radio" value={s} className="mt-1 accent-copper" {...register("subject")} />
                <span>
                  <span className="font-semibold">{SUBJECT_WORDS[s]}</span>
                  <span className="block text-xs text-ink-soft">{SUBJECT_HINT[s]}</span>
                </span>
              </label>
            ))}
          </div>
          {errors.subject && <p className="mt-1 text-sm text-bad">{errors.subject.message}</p>}
        </fieldset>
        {link && (
          <div className="mt-4 max-w-xl">
            <Field label={`Which ${linkWord}`} htmlFor="ft-link" error={err(link)}>
              {!headTypeId ? (
                <p className="text-sm text-ink-soft">Choose the head type first.</p>
              ) : subjects.isPending ? (
                <p className="text-sm text-ink-soft">Loading…</p>
              ) : subjects.isError ? (
                <p className="text-sm text-bad">Could not load the choices: {(subjects.error as Error).message}</p>
              ) : linkChoices.length === 0 ? (
                <p className="rounded-md border border-dashed border-rule px-3 py-2 text-sm text-ink-soft" data-testid="no-link-choices">
                  No {linkWord}s of this casting are recorded yet. Record it first, or choose another subject.
                </p>
              ) : (
                <select
                  id="ft-link"
                  key={link}
                  value={(values[link] as number | null | undefined) ?? ""}
                  className={inputClass(!!err(link))}
                  {...register(link, {
                    setValueAs: idValue,
                    onChange: (e) => {
                      // A revision belongs to one port: follow it.
                      const rev = link === "revisionId" ? options?.revisions.find((r) => r.id === Number(e.target.value)) : undefined;
                      if (rev) setValue("port", rev.port);
                    },
                  })}
                >
                  <option value="">choose…</option>
                  {linkChoices.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.label}
                    </option>
                  ))}
                </select>
              )}
            </Field>
          </div>
        )}
        <div className="mt-4 grid gap-4 md:grid-cols-2 xl:grid-cols-4">
          <Field label="Tested on" htmlFor="ft-date" error={err("testedOn")}>
            <input id="ft-date" type="date" className={inputClass(!!errors.testedOn)} {...register("testedOn")} />
          </Field>
          <Field label="Operator" htmlFor="ft-operator" error={err("operatorId")} hint="who ran the bench">
            <select id="ft-operator" className={inputClass(!!errors.operatorId)} {...register("operatorId", { setValueAs: idValue })} value={values.operatorId ?? ""}>
              <option value="">the person recording</option>
              {(base.data?.operators ?? []).map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </select>
          </Field>
        </div>
      </Card>

      <div className="grid gap-5 xl:grid-cols-2">
        <Card title="Bench and air">
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Bench depression" htmlFor="ft-depression" error={err("depression")} hint="28 inH₂O is the usual test depression">
              <ValueWithUnit id="ft-depression" invalid={!!errors.depression} input={num("depression")} unitLabel="Depression unit" unit={register("depressionUnit")} units={PRESSURE_UNITS} labels={PRESSURE_UNIT_LABEL} />
            </Field>
            <Field label="Air temperature" htmlFor="ft-temp" error={err("ambient.temperature")} hint="leave the air empty for standard air">
              <ValueWithUnit id="ft-temp" invalid={!!err("ambient.temperature")} input={num("ambient.temperature")} unitLabel="Temperature unit" unit={register("ambient.temperatureUnit")} units={TEMPERATURE_UNITS} labels={TEMPERATURE_UNIT_LABEL} />
            </Field>
            <Field label="Barometric pressure" htmlFor="ft-baro" error={err("ambient.pressure")} hint="station pressure, not corrected to sea level">
              <ValueWithUnit id="ft-baro" invalid={!!err("ambient.pressure")} input={num("ambient.pressure")} unitLabel="Barometric pressure unit" unit={register("ambient.pressureUnit")} units={PRESSURE_UNITS} labels={PRESSURE_UNIT_LABEL} />
            </Field>
            <Field label="Relative humidity, %" htmlFor="ft-rh" error={err("ambient.relativeHumidityPercent")} hint="dry air is assumed when empty">
              <input id="ft-rh" inputMode="decimal" className={inputClass(!!err("ambient.relativeHumidityPercent"))} {...num("ambient.relativeHumidityPercent")} />
            </Field>
          </div>
        </Card>

        <Card title="Valve and port">
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Valve diameter" htmlFor="ft-valve" error={err("valveDiameter")} hint={headType ? `filled from ${headType.castingNumber}; change it if the valve differs` : undefined}>
              <ValueWithUnit id="ft-valve" invalid={!!errors.valveDiameter} input={num("valveDiameter")} unitLabel="Unit of valve and seat" unit={register("lengthUnit")} units={LIFT_UNITS} labels={LENGTH_UNIT_LABEL} />
            </Field>
            <Field label={`Seat ID (${LENGTH_UNIT_LABEL[values.lengthUnit ?? "mm"]})`} htmlFor="ft-seat" error={err("seatDiameter")} hint="inner seat diameter, for Cd on the seat area">
              <input id="ft-seat" inputMode="decimal" className={inputClass(!!errors.seatDiameter)} {...num("seatDiameter")} />
            </Field>
            <Field label="Minimum section" htmlFor="ft-section" error={err("minSectionArea")} hint="optional; from a scan or by hand">
              <ValueWithUnit id="ft-section" invalid={!!errors.minSectionArea} input={num("minSectionArea")} unitLabel="Area unit" unit={register("areaUnit")} units={AREA_UNITS} labels={AREA_UNIT_LABEL} />
            </Field>
            <div className="flex flex-col justify-end gap-2 text-sm">
              <label className="flex items-center gap-2">
                <input type="checkbox" className="h-5 w-5 accent-copper" {...register("entryRadius")} />
                With an entry radius (clay or fixture) on the port
              </label>
              <label className="flex items-center gap-2">
                <input type="checkbox" className="h-5 w-5 accent-copper" {...register("exhaustPipe")} />
                With a pipe on the exhaust exit
              </label>
            </div>
          </div>
        </Card>
      </div>

      <Card title="Lift table">
        <div className="flex flex-col gap-4">
          <CsvImportPanel onLoaded={onCsv} />
          <div className="flex flex-wrap items-end gap-3">
            <label className="flex flex-col gap-1 text-sm font-semibold">
              Lift unit
              <select className={inputClass()} {...register("liftUnit")} data-testid="lift-unit">
                {LIFT_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {LENGTH_UNIT_LABEL[u]}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1 text-sm font-semibold">
              Flow unit (at the test depression)
              <select className={inputClass()} {...register("flowUnit")} data-testid="flow-unit">
                {FLOW_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {FLOW_UNIT_LABEL[u]}
                  </option>
                ))}
              </select>
            </label>
            <p className="max-w-sm text-xs text-ink-soft">The unit says what the numbers you typed mean; changing it does not convert them.</p>
          </div>
          {err("points") && (
            <p role="alert" className="text-sm text-bad">
              {err("points")}
            </p>
          )}
          <div className="overflow-x-auto rounded-md border border-rule">
            <table className="w-full border-collapse text-sm" data-testid="lift-table">
              <thead className="bg-paper-deep text-right text-ink-soft">
                <tr>
                  <th scope="col" className="px-2 py-1 text-left">
                    #
                  </th>
                  <th scope="col" className="px-2 py-1 text-left">
                    Lift {LENGTH_UNIT_LABEL[values.liftUnit ?? "mm"]}
                  </th>
                  <th scope="col" className="px-2 py-1 text-left">
                    Flow {FLOW_UNIT_LABEL[values.flowUnit ?? "cfm"]}
                  </th>
                  {hasRowDepression && (
                    <th scope="col" className="px-2 py-1 text-left">
                      Depression {PRESSURE_UNIT_LABEL[values.depressionUnit ?? "inH2O"]}
                    </th>
                  )}
                  <th scope="col" className="px-2 py-1">
                    L/D
                  </th>
                  <th scope="col" className="px-2 py-1">
                    cfm @ 28″
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Cd valve
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Cd curtain
                  </th>
                  <th scope="col" className="px-2 py-1">
                    <span className="sr-only">Remove</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.fields.length === 0 && (
                  <tr>
                    <td colSpan={9} className="px-3 py-6 text-center text-ink-soft">
                      No lift points yet. Import the bench&apos;s CSV above, or add rows and type them.
                    </td>
                  </tr>
                )}
                {rows.fields.map((row, i) => {
                  const computed = live.byRow[i];
                  const liftError = err(`points.${i}.lift`);
                  const flowError = err(`points.${i}.flow`);
                  const depError = err(`points.${i}.depression`);
                  return (
                    <tr key={row.id} className="border-t border-rule/60 align-top">
                      <td className="px-2 py-1 text-ink-faint">{i + 1}</td>
                      <td className="px-2 py-1">
                        <input aria-label={`Lift, row ${i + 1}`} inputMode="decimal" className={`${inputClass(!!liftError)} w-24 font-mono`} {...num(`points.${i}.lift`)} />
                        {liftError && <p className="max-w-48 text-xs text-bad">{liftError}</p>}
                      </td>
                      <td className="px-2 py-1">
                        <input aria-label={`Flow, row ${i + 1}`} inputMode="decimal" className={`${inputClass(!!flowError)} w-24 font-mono`} {...num(`points.${i}.flow`)} />
                        {flowError && <p className="max-w-48 text-xs text-bad">{flowError}</p>}
                      </td>
                      {hasRowDepression && (
                        <td className="px-2 py-1">
                          <input aria-label={`Depression, row ${i + 1}`} inputMode="decimal" className={`${inputClass(!!depError)} w-24 font-mono`} {...num(`points.${i}.depression`)} />
                          {depError && <p className="max-w-48 text-xs text-bad">{depError}</p>}
                        </td>
                      )}
                      <td className="px-2 py-1 text-right font-mono">{fixed(computed?.ld, 3)}</td>
                      <td className="px-2 py-1 text-right font-mono font-semibold">{fixed(computed?.flowCfmAt28, 1)}</td>
                      <td className="px-2 py-1 text-right font-mono">{fixed(computed?.cdValve, 3)}</td>
                      <td className="px-2 py-1 text-right font-mono">{fixed(computed?.cdCurtain, 3)}</td>
                      <td className="px-2 py-1 text-right">
                        <button type="button" className="rounded px-2 py-1 text-ink-soft hover:bg-bad-wash hover:text-bad" onClick={() => rows.remove(i)} aria-label={`Remove row ${i + 1}`}>
                          ✕
                        </button>
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap gap-2">
            <Button onClick={addRow}>Add a row</Button>
            {rows.fields.length > 0 && (
              <Button variant="quiet" onClick={() => rows.replace([])}>
                Clear the table
              </Button>
            )}
          </div>

          <div aria-live="polite" className="rounded-md border border-rule bg-paper px-3 py-2 text-sm" data-testid="live-summary">
            {summary ? (
              <p>
                Peak <strong className="font-mono">{fixed(summary.peakFlowCfmAt28, 1)} cfm</strong> at {fixed(summary.peakFlowLiftMm, 2)} mm · at L/D 0.25{" "}
                <strong className="font-mono">{summary.flowCfmAt28AtLd025 == null ? "not reached" : `${fixed(summary.flowCfmAt28AtLd025, 1)} cfm`}</strong> · mean Cd on valve area{" "}
                <strong className="font-mono">{fixed(summary.meanCdValve, 3)}</strong> · air {fixed(live.result!.densityKgM3, 4)} kg/m³ (
                {live.result!.densitySource === "ambient" ? "from the readings, CIPM-2007" : "standard air"})
              </p>
            ) : (
              <p className="text-ink-soft">Computed columns appear as you type. Waiting for: {live.waitingFor.join(" ")}</p>
            )}
            {live.result?.warnings.map((w) => (
              <p key={w} className="text-warn">
                {w}
              </p>
            ))}
          </div>
          {live.result && <FlowChart series={[{ label: "this test", points: live.result.points }]} height={240} showTable={false} />}
        </div>
      </Card>

      <Card title="Notes">
        <Field label="Notes" htmlFor="ft-notes" error={err("notes")}>
          <textarea id="ft-notes" rows={3} className={`${inputClass(!!errors.notes)} py-2`} {...register("notes")} />
        </Field>
      </Card>

      <FlowConventions compact />
      <FlowCaution />

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : mode === "create" ? "Save flow test" : "Save changes"}
        </Button>
        <Button variant="quiet" onClick={() => router.back()}>
          Cancel
        </Button>
        {Object.keys(errors).length > 0 && <p className="text-sm text-bad">Some fields need attention; see the messages above.</p>}
      </div>
    </form>
  );
}

/** A number with its unit beside it (depression, temperature, pressure…). */
function ValueWithUnit<U extends string>({
  id,
  invalid,
  input,
  unitLabel,
  unit,
  units,
  labels,
}: {
  id: string;
  invalid: boolean;
  input: React.InputHTMLAttributes<HTMLInputElement> & { ref?: React.Ref<HTMLInputElement> };
  unitLabel: string;
  unit: React.SelectHTMLAttributes<HTMLSelectElement> & { ref?: React.Ref<HTMLSelectElement> };
  units: readonly U[];
  labels: Record<U, string>;
}) {
  return (
    <div className="flex gap-1">
      <input id={id} inputMode="decimal" className={`${inputClass(invalid)} w-full`} {...input} />
      <select aria-label={unitLabel} className={inputClass()} {...unit}>
        {units.map((u) => (
          <option key={u} value={u}>
            {labels[u]}
          </option>
        ))}
      </select>
    </div>
  );
}
