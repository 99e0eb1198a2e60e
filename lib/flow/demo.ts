/**
 * Invented, plausible flow curves for demo data. Not measurements and not a prediction of any
 * real head: a smooth blend of a curtain-limited regime at low lift and a port-limited regime at
 * high lift (the shape Heywood ch. 6 describes), with a little deterministic "bench scatter".
 */
import { STANDARD_AIR } from "./labels";
import { idealVelocity } from "./orifice";
import { flow, length, pressure } from "./units";
import { circleArea, curtainArea } from "./valve";

export type DemoCurveOptions = {
  valveMm: number;
  kind: "stock" | "ported";
  port?: "intake" | "exhaust";
  /** Lifts in mm; default every 0.050 in (1.27 mm) up to L/D ≈ 0.35. */
  lifts?: number[];
  /** Scatter seed; the same seed gives the same curve. */
  seed?: number;
  /** Relative scatter (0.006 = ±0.6 %); 0 for a clean curve. */
  scatter?: number;
};

export type DemoPoint = { liftMm: number; flowCfm: number };

/**
 * Coefficients of the blend (invented tuning): curtain-regime Cd at low lift and the valve-area Cd
 * the port settles at. Intake values sit in the common-practice band of ~0.45 (stock) to ~0.70
 * (well ported). Exhaust valves are small for their port, so their valve-area Cd is set higher,
 * which lands exhaust/intake ratios near the common-practice ~75 % for usual valve sizes.
 */
const SHAPE = {
  intake: { stock: { curtain: 0.78, valve: 0.52 }, ported: { curtain: 0.82, valve: 0.68 } },
  exhaust: { stock: { curtain: 0.74, valve: 0.62 }, ported: { curtain: 0.8, valve: 0.76 } },
} as const;
/** Sharpness of the hand-over between the two regimes. */
const BLEND_EXPONENT = 3;

/** Small seeded generator (mulberry32) so demo data is stable between seeds of the database. */
function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function defaultDemoLifts(valveMm: number): number[] {
  const step = length.convert(0.05, "in", "mm");
  const lifts: number[] = [];
  for (let lift = step; lift <= 0.35 * valveMm + 1e-9; lift += step) lifts.push(Math.round(lift * 1000) / 1000);
  return lifts;
}

/** A demo curve at 28 inH₂O in ISO 2533 standard air, flows in cfm. */
export function demoFlowCurve(options: DemoCurveOptions): DemoPoint[] {
  const shape = SHAPE[options.port ?? "intake"][options.kind];
  const valveM = length.toSi(options.valveMm, "mm");
  const valveArea = circleArea(valveM);
  const v = idealVelocity(pressure.toSi(28, "inH2O"), STANDARD_AIR.iso2533.densityKgM3);
  const random = seededRandom(options.seed ?? Math.round(options.valveMm * 1000) + (options.kind === "ported" ? 7 : 0));
  const scatter = options.scatter ?? 0.006;
  const lifts = options.lifts ?? defaultDemoLifts(options.valveMm);
  return lifts.map((liftMm) => {
    const curtainLimited = shape.curtain * curtainArea(valveM, length.toSi(liftMm, "mm"));
    const portLimited = shape.valve * valveArea;
    const effective = (curtainLimited ** -BLEND_EXPONENT + portLimited ** -BLEND_EXPONENT) ** (-1 / BLEND_EXPONENT);
    const noise = 1 + scatter * (2 * random() - 1);
    return { liftMm, flowCfm: flow.fromSi(effective * v * noise, "cfm") };
  });
}
