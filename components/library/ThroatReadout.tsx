import type { Port } from "@/db/enums";
import { guidelineText, throatCheck } from "@/lib/library/throat";
import { Badge } from "../ui/Badge";

const VERDICT = { below: ["Below the guideline", "warn"], within: ["Within the guideline", "ok"], above: ["Above the guideline", "warn"] } as const;

/** The throat as a percentage of the valve head, with the common-practice guideline beside it. */
export function ThroatReadout({ port, throatMm, valveMm }: { port: Port; throatMm: number | null | undefined; valveMm: number | null | undefined }) {
  const c = throatCheck(port, throatMm, valveMm);
  return (
    <div className="rounded-md border border-rule bg-paper px-3 py-2 text-sm" data-testid={`throat-${port}`}>
      {c ? (
        <p className="flex flex-wrap items-center gap-2">
          <span>
            Throat <strong className="font-mono">{c.percentOfValve.toFixed(1)} %</strong> of the {valveMm?.toFixed(2)} mm valve (area {c.percentOfValveArea.toFixed(1)} %)
          </span>
          <Badge tone={VERDICT[c.verdict][1]}>{VERDICT[c.verdict][0]}</Badge>
        </p>
      ) : (
        <p className="text-ink-soft">Enter the throat reading to see it against the valve.</p>
      )}
      <p className="mt-1 text-xs text-ink-faint">{guidelineText(port)}</p>
    </div>
  );
}
