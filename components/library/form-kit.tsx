"use client";

/**
 * Small pieces every record form shares: inputs bound to react-hook-form registrations, numbers
 * that arrive as numbers (empty → null, so the shared zod schema says what is missing), and a
 * submit helper that maps the server's field messages back beside their inputs.
 */
import { useRouter } from "next/navigation";
import type { FieldValues, UseFormRegisterReturn, UseFormReturn } from "react-hook-form";
import { toast } from "sonner";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Field, inputClass } from "../ui/Field";

/** For `register(name, numberValue)`: "" becomes null, anything else a number (NaN is refused by zod). */
export const numberValue = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v)) };
export const idValue = numberValue;

type Common = { id: string; label: string; error?: string; hint?: string; reg: UseFormRegisterReturn };

export function TextInput({ id, label, error, hint, reg, ...rest }: Common & React.InputHTMLAttributes<HTMLInputElement>) {
  return (
    <Field label={label} htmlFor={id} error={error} hint={hint}>
      <input id={id} className={inputClass(!!error)} aria-invalid={!!error} aria-describedby={error ? `${id}-error` : undefined} {...rest} {...reg} />
    </Field>
  );
}

export function NumberInput({ id, label, error, hint, reg, unit, step = "any" }: Common & { unit?: string; step?: string }) {
  return (
    <Field label={unit ? `${label} (${unit})` : label} htmlFor={id} error={error} hint={hint}>
      <input id={id} type="number" inputMode="decimal" step={step} className={inputClass(!!error)} aria-invalid={!!error} aria-describedby={error ? `${id}-error` : undefined} {...reg} />
    </Field>
  );
}

export function TextArea({ id, label, error, hint, reg, rows = 3 }: Common & { rows?: number }) {
  return (
    <Field label={label} htmlFor={id} error={error} hint={hint}>
      <textarea id={id} rows={rows} className={`${inputClass(!!error)} py-2`} aria-invalid={!!error} {...reg} />
    </Field>
  );
}

export function Select({ id, label, error, hint, reg, options, placeholder }: Common & { options: Array<{ value: string | number; label: string }>; placeholder?: string }) {
  return (
    <Field label={label} htmlFor={id} error={error} hint={hint}>
      <select id={id} className={inputClass(!!error)} aria-invalid={!!error} {...reg}>
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  );
}

export function FormSection({ title, children, note }: { title: string; children: React.ReactNode; note?: React.ReactNode }) {
  return (
    <fieldset className="rounded-lg border border-rule bg-card p-4">
      <legend className="px-1 text-sm font-bold uppercase tracking-wider text-ink-soft">{title}</legend>
      {note && <div className="mb-3 text-sm text-ink-soft">{note}</div>}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

/**
 * Sends the form's values as JSON; on success shows `done` and goes to `next(result)`; on a
 * refusal puts each field message beside its input and the summary in a toast.
 */
export function useJsonSubmit<T extends FieldValues, O extends FieldValues, R>(
  form: UseFormReturn<T, unknown, O>,
  opts: { url: string; method: "POST" | "PUT"; done: (r: R) => string; next?: (r: R) => string | null },
) {
  const router = useRouter();
  return form.handleSubmit(async (values) => {
    try {
      const result = await fetchJson<R>(opts.url, { method: opts.method, body: JSON.stringify(values) });
      toast.success(opts.done(result));
      const to = opts.next?.(result);
      if (to) router.push(to);
      router.refresh();
    } catch (err) {
      if (err instanceof ApiError && err.fields) {
        for (const [k, msgs] of Object.entries(err.fields)) if (k !== "_") form.setError(k as never, { message: msgs[0] });
      }
      toast.error(err instanceof Error ? err.message : "That did not work. Try again.");
    }
  });
}

/** The message of a possibly nested field error, by dotted path. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let cur: unknown = errors;
  for (const k of path.split(".")) cur = cur && typeof cur === "object" ? (cur as Record<string, unknown>)[k] : undefined;
  const m = cur && typeof cur === "object" ? (cur as { message?: unknown }).message : undefined;
  return typeof m === "string" ? m : undefined;
}
