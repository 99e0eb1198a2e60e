/**
 * What the figures assume, said beside them: the density law, that compressibility is neglected,
 * the inch of water used and the standard air; and the shop cautions where figures may guide
 * metal removal.
 */
import { COMPRESSIBILITY_NOTE, DENSITY_LAW, FLOW_LAW, INCH_OF_WATER, STANDARD_AIR } from "@/lib/flow";
import { SHOP_CAUTIONS } from "@/lib/flowtests/sheet";
import { Caution } from "../ui/Card";

export function FlowConventions({ compact = false }: { compact?: boolean }) {
  return (
    <section aria-label="How the figures are computed" className="rounded-md border border-rule bg-paper px-4 py-3 text-sm text-ink-soft" data-testid="flow-conventions">
      <p className="font-semibold text-ink">How these figures are computed</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        <li>
          Air density: <strong className="text-ink">{DENSITY_LAW.name}</strong> from the temperature, barometric pressure and humidity entered
          {compact ? "" : ` (${DENSITY_LAW.source}; ${DENSITY_LAW.assumption})`}. Without readings, standard air is assumed.
        </li>
        <li>
          Corrected flows are moved to 28 inH₂O and to {STANDARD_AIR.iso2533.label} by the law {FLOW_LAW.name}.
        </li>
        <li>{COMPRESSIBILITY_NOTE}</li>
        {!compact && <li>Inch of water: {INCH_OF_WATER.label}.</li>}
      </ul>
    </section>
  );
}

export function FlowCaution() {
  return (
    <Caution title="Caution: estimates, not a licence to remove metal">
      {SHOP_CAUTIONS.map((line) => (
        <p key={line}>{line}</p>
      ))}
    </Caution>
  );
}
