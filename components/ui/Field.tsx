import { cx } from "./cx";

/** A labelled input with its message; the message comes from the same zod schema the server uses. */
export function Field({
  label,
  error,
  hint,
  children,
  htmlFor,
}: {
  label: string;
  error?: string;
  hint?: string;
  htmlFor: string;
  children: React.ReactNode;
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={htmlFor} className="text-sm font-semibold text-ink">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-xs text-ink-faint">{hint}</p>}
      {error && (
        <p id={`${htmlFor}-error`} role="alert" className="text-sm text-bad">
          {error}
        </p>
      )}
    </div>
  );
}

export const inputClass = (invalid?: boolean) =>
  cx(
    "min-h-10 rounded-md border bg-card px-3 text-base text-ink placeholder:text-ink-faint",
    invalid ? "border-bad" : "border-rule focus:border-copper",
  );
