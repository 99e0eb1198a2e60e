"use client";

/**
 * Reading a bench CSV in the browser with the same parser the server uses: units from the
 * headers, a column mapping when the headers are not recognised, and one message per bad line.
 * Nothing reaches the lift table unless the whole file reads cleanly.
 */
import { useState } from "react";
import { CSV_HEADER_EXAMPLES, FLOW_UNITS, LIFT_UNITS, PRESSURE_UNITS, parseFlowCsv, type ColumnMappingInput, type CsvError, type CsvImport } from "@/lib/flow";
import { CSV_MAX_CHARS } from "@/lib/flowtests/schema";
import { Button } from "../ui/Button";
import { inputClass } from "../ui/Field";
import { FLOW_UNIT_LABEL, PRESSURE_UNIT_LABEL } from "./units";

export type LoadedCsv = Extract<CsvImport, { ok: true }> & { fileName: string };

type MappingDraft = {
  lift: string;
  liftUnit: (typeof LIFT_UNITS)[number];
  flow: string;
  flowUnit: (typeof FLOW_UNITS)[number];
  depression: string;
  depressionUnit: (typeof PRESSURE_UNITS)[number];
  hasHeader: boolean;
};

const EMPTY_MAPPING: MappingDraft = { lift: "", liftUnit: "in", flow: "", flowUnit: "cfm", depression: "", depressionUnit: "inH2O", hasHeader: true };

function toMapping(d: MappingDraft): ColumnMappingInput {
  const ref = (v: string) => (d.hasHeader ? v : Number(v));
  return {
    lift: { column: ref(d.lift), unit: d.liftUnit },
    flow: { column: ref(d.flow), unit: d.flowUnit },
    ...(d.depression !== "" ? { depression: { column: ref(d.depression), unit: d.depressionUnit } } : {}),
    hasHeader: d.hasHeader,
  };
}

/** Cells of the first content line, to offer as columns when the file has no header. */
function firstCells(text: string): string[] {
  const line = text.split(/\r\n|\n|\r/).find((l) => l.trim() !== "" && !l.trim().startsWith("#")) ?? "";
  const delimiter = line.includes("\t") ? "\t" : line.includes(";") ? ";" : ",";
  return line.split(delimiter).map((c) => c.trim());
}

export function CsvImportPanel({ onLoaded }: { onLoaded: (csv: LoadedCsv) => void }) {
  const [text, setText] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const [errors, setErrors] = useState<CsvError[]>([]);
  const [headers, setHeaders] = useState<string[]>([]);
  const [loaded, setLoaded] = useState<LoadedCsv | null>(null);
  const [showMapping, setShowMapping] = useState(false);
  const [mapping, setMapping] = useState<MappingDraft>(EMPTY_MAPPING);
  const [pasted, setPasted] = useState("");

  const read = (source: string, name: string, withMapping?: ColumnMappingInput) => {
    setText(source);
    setFileName(name);
    const result = parseFlowCsv(source, withMapping);
    if (result.ok) {
      const done = { ...result, fileName: name };
      setErrors([]);
      setLoaded(done);
      setShowMapping(false);
      onLoaded(done);
      return;
    }
    setLoaded(null);
    setErrors(result.errors);
    setHeaders(result.headers.length ? result.headers : firstCells(source));
    // Header problems (line 1) or mapping problems (line 0) are solved by naming the columns.
    if (withMapping || result.errors.some((e) => e.row <= 1)) setShowMapping(true);
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    if (file.size > CSV_MAX_CHARS) {
      setLoaded(null);
      setErrors([{ row: 0, message: `${file.name} is ${(file.size / 1e6).toFixed(1)} MB; a flow-bench CSV is a few kB. Nothing was read.` }]);
      return;
    }
    read(await file.text(), file.name);
  };

  const columnOptions = mapping.hasHeader ? headers.map((h) => ({ value: h, label: h || "(blank)" })) : (text ? firstCells(text) : headers).map((_, i) => ({ value: String(i), label: `column ${i + 1}` }));
  const setM = (patch: Partial<MappingDraft>) => setMapping((m) => ({ ...m, ...patch }));

  return (
    <div className="flex flex-col gap-3 rounded-md border border-dashed border-rule bg-paper p-3" data-testid="csv-import">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex flex-col gap-1 text-sm font-semibold text-ink">
          Import the bench&apos;s CSV
          <input
            type="file"
            accept=".csv,.txt,.tsv,text/csv,text/plain"
            className="text-sm font-normal file:mr-3 file:min-h-10 file:rounded-md file:border file:border-rule file:bg-card file:px-3 file:font-semibold"
            onChange={(e) => void onFile(e.target.files?.[0])}
            data-testid="csv-file"
          />
        </label>
        <p className="max-w-md text-xs text-ink-soft">
          Name the columns with their unit — lift: {CSV_HEADER_EXAMPLES.lift}; flow: {CSV_HEADER_EXAMPLES.flow}; optionally {CSV_HEADER_EXAMPLES.depression}. Otherwise map them
          below. Comma, semicolon or tab separated.
        </p>
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer text-ink-soft">Paste the CSV text instead</summary>
        <div className="mt-2 flex flex-col gap-2">
          <textarea className={`${inputClass()} min-h-28 font-mono text-sm`} value={pasted} onChange={(e) => setPasted(e.target.value)} aria-label="CSV text" />
          <div>
            <Button onClick={() => read(pasted, "pasted text")} disabled={pasted.trim() === ""}>
              Read pasted text
            </Button>
          </div>
        </div>
      </details>

      {loaded && (
        <p role="status" className="rounded-md border border-ok/30 bg-ok-wash px-3 py-2 text-sm text-ok" data-testid="csv-loaded">
          Read {loaded.rows.length} rows from {loaded.fileName}: lift from “{loaded.columns.lift}” in {loaded.units.lift}, flow from “{loaded.columns.flow}” in{" "}
          {FLOW_UNIT_LABEL[loaded.units.flow]}
          {loaded.columns.depression ? `, depression from “${loaded.columns.depression}” in ${PRESSURE_UNIT_LABEL[loaded.units.depression!]}` : ""}.
          {loaded.ignoredColumns.length > 0 && ` Not used: ${loaded.ignoredColumns.join(", ")}.`} They are in the lift table below.
        </p>
      )}

      {errors.length > 0 && (
        <div role="alert" className="flex flex-col gap-2" data-testid="csv-errors">
          <p className="text-sm font-semibold text-bad">
            {fileName ? `${fileName}: ` : ""}
            {errors.length} {errors.length === 1 ? "problem" : "problems"}. Nothing was taken from the file; correct it and read it again.
          </p>
          <div className="max-h-60 overflow-auto rounded-md border border-bad/30 bg-card">
            <table className="w-full border-collapse text-left text-sm">
              <thead className="bg-bad-wash text-bad">
                <tr>
                  <th scope="col" className="px-2 py-1">
                    Line
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Column
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Problem
                  </th>
                </tr>
              </thead>
              <tbody>
                {errors.map((e, i) => (
                  <tr key={i} className="border-t border-rule/60">
                    <td className="px-2 py-0.5 font-mono">{e.row === 0 ? "—" : e.row}</td>
                    <td className="px-2 py-0.5">{e.column ?? ""}</td>
                    <td className="px-2 py-0.5">{e.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      )}

      {showMapping && text !== null && (
        <fieldset className="flex flex-col gap-2 rounded-md border border-rule bg-card p-3" data-testid="csv-mapping">
          <legend className="px-1 text-sm font-semibold">Name the columns</legend>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" className="h-4 w-4 accent-copper" checked={mapping.hasHeader} onChange={(e) => setM({ hasHeader: e.target.checked, lift: "", flow: "", depression: "" })} />
            The first line holds column names
          </label>
          <div className="grid gap-2 sm:grid-cols-3">
            {(
              [
                ["lift", "Lift column", "liftUnit", LIFT_UNITS],
                ["flow", "Flow column", "flowUnit", FLOW_UNITS],
                ["depression", "Depression column (optional)", "depressionUnit", PRESSURE_UNITS],
              ] as const
            ).map(([key, label, unitKey, units]) => (
              <div key={key} className="flex flex-col gap-1 text-sm">
                <span className="font-semibold">{label}</span>
                <div className="flex gap-1">
                  <select className={inputClass()} aria-label={label} value={mapping[key]} onChange={(e) => setM({ [key]: e.target.value } as Partial<MappingDraft>)}>
                    <option value="">{key === "depression" ? "none" : "choose…"}</option>
                    {columnOptions.map((o) => (
                      <option key={o.value} value={o.value}>
                        {o.label}
                      </option>
                    ))}
                  </select>
                  <select className={inputClass()} aria-label={`${label} unit`} value={mapping[unitKey]} onChange={(e) => setM({ [unitKey]: e.target.value } as Partial<MappingDraft>)}>
                    {units.map((u) => (
                      <option key={u} value={u}>
                        {FLOW_UNIT_LABEL[u] ?? PRESSURE_UNIT_LABEL[u] ?? u}
                      </option>
                    ))}
                  </select>
                </div>
              </div>
            ))}
          </div>
          <div>
            <Button variant="primary" disabled={mapping.lift === "" || mapping.flow === ""} onClick={() => read(text, fileName, toMapping(mapping))}>
              Read with these columns
            </Button>
          </div>
        </fieldset>
      )}
    </div>
  );
}
