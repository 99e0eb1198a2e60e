import { buttonClass } from "../ui/Button";

const SELECT = "min-h-10 rounded-md border border-rule bg-card px-2 text-sm";

/** Two selects (A and B) that open a comparison page by plain GET: works without scripts. */
export function ComparePicker({
  action,
  noun,
  options,
  defaultA,
  defaultB,
}: {
  action: string;
  noun: { one: string; many: string };
  options: Array<{ value: number; label: string }>;
  defaultA?: number;
  defaultB?: number;
}) {
  const pick = (name: "a" | "b", defaultValue?: number) => (
    <label className="flex flex-col gap-1 text-xs font-semibold text-ink-soft">
      {noun.one} {name.toUpperCase()}
      <select name={name} className={SELECT} required defaultValue={defaultValue}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
  return (
    <form action={action} className="flex flex-wrap items-end gap-2" aria-label={`Compare two ${noun.many}`}>
      {pick("a", defaultA)}
      {pick("b", defaultB)}
      <button type="submit" className={buttonClass("secondary")} disabled={options.length < 2}>
        Compare the {noun.many}
      </button>
    </form>
  );
}
