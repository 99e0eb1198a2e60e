/**
 * One flow test in, every computed column out. Pure and synchronous, so a form can call it on
 * each keystroke and the server can store the same figures.
 *
 * Conventions: Cd and velocities use the air actually on the bench (test depression and test
 * density); `flowCfmAt28` is the comparison figure, moved to 28 inH₂O and to standard air by the
 * square-root law, so tests from different days and benches line up.
 */
import { z } from "zod";
import { CIPM2007_VALID_RANGE, cipm2007Density } from "./air";
import {
  COMPRESSIBILITY_NOTE,
  DENSITY_LAW,
  ESTIMATE_CAUTION,
  FLOW_LAW,
  INCH_OF_WATER,
  STANDARD_AIR,
  type StandardAirId,
} from "./labels";
import { flowAtDensity, flowAtDepression, idealVelocity } from "./orifice";
import { type FlowTest, type FlowTestInput, flowTestInputSchema } from "./schema";
import { area, flow, length, pressure, temperatureToCelsius } from "./units";
import { circleArea, curtainArea, flowCoefficient, liftOverDiameter, meanSectionVelocity } from "./valve";
import { interpolateAt } from "./interpolate";

/** The depression every comparison figure is moved to (inH₂O), the trade's usual test depression. */
export const REFERENCE_DEPRESSION_INH2O = 28;

export type FlowPointResult = {
  liftMm: number;
  liftIn: number;
  /** Lift over valve diameter. */
  ld: number;
  /** Depression this point was measured at. */
  depressionInH2O: number;
  /** As measured, at the test depression and in the test air. */
  flowCfm: number;
  flowLs: number;
  /** Moved to 28 inH₂O and to standard air: the figure to compare tests by. */
  flowCfmAt28: number;
  flowLsAt28: number;
  curtainAreaMm2: number;
  /** Flow coefficient on the curtain area π·D·L. */
  cdCurtain: number;
  /** Flow coefficient on the valve-head area π·D²/4. */
  cdValve: number;
  /** Flow coefficient on the inner-seat area, when the seat diameter is given. */
  cdSeat: number | null;
  /** √(2ΔP/ρ) for this point's depression and the test air. */
  idealVelocityMs: number;
  /** Mean velocity Q/A at the port's minimum section, test conditions; null without a section. */
  sectionVelocityMs: number | null;
  /** Corrected flow per square inch of valve-head area. */
  cfmPerSqInValve: number;
  /** Corrected flow per square inch of minimum section; null without a section. */
  cfmPerSqInSection: number | null;
};

export type FlowTestSummary = {
  pointCount: number;
  maxLiftMm: number;
  maxLd: number;
  peakFlowCfmAt28: number;
  peakFlowLiftMm: number;
  /** Corrected flow interpolated at L/D = 0.25 (curtain area equals valve area); null if not tested. */
  flowCfmAt28AtLd025: number | null;
  meanCdValve: number;
  peakCdValve: number;
  meanCdCurtain: number;
  valveAreaMm2: number;
  seatAreaMm2: number | null;
  minSectionAreaMm2: number | null;
  /** Minimum section as a share of the valve-head area; null without a section. */
  sectionToValveAreaRatio: number | null;
  /** Ideal velocity √(2ΔP/ρ) at 28 inH₂O in standard air. */
  idealVelocityAt28Ms: number;
  /** Ideal flow per square inch at 28 inH₂O in standard air (the ceiling of cfmPerSqIn*). */
  idealCfmPerSqInAt28: number;
};

export type AmbientResult = {
  temperatureC: number;
  pressurePa: number;
  relativeHumidityPercent: number;
  humidityAssumed: boolean;
  compressibilityZ: number;
};

export type FlowTestResult = {
  points: FlowPointResult[];
  summary: FlowTestSummary;
  /** Density of the test air (standard air when no ambient readings were entered). */
  densityKgM3: number;
  densitySource: "ambient" | "standard-air";
  standardAir: { id: StandardAirId; label: string; densityKgM3: number };
  ambient: AmbientResult | null;
  valveDiameterMm: number;
  depressionInH2O: number;
  depressionPa: number;
  referenceDepressionInH2O: number;
  conventions: {
    inchOfWater: string;
    densityLaw: string;
    flowLaw: string;
  };
  notes: string[];
  warnings: string[];
};

const mean = (values: number[]) => values.reduce((sum, v) => sum + v, 0) / values.length;

type TestAir = { densityKgM3: number; ambient: AmbientResult | null; warnings: string[] };

function testAir(test: FlowTest, standardDensity: number): TestAir {
  if (!test.ambient) return { densityKgM3: standardDensity, ambient: null, warnings: [] };
  const air = test.ambient;
  const temperatureC = temperatureToCelsius(air.temperature, air.temperatureUnit);
  const pressurePa = pressure.toSi(air.pressure, air.pressureUnit);
  const humidityAssumed = air.relativeHumidityPercent === undefined;
  const relativeHumidityPercent = air.relativeHumidityPercent ?? 0;
  const cipm = cipm2007Density({ pressurePa, temperatureC, relativeHumidityPercent });
  const warnings: string[] = [];
  const [tLow, tHigh] = CIPM2007_VALID_RANGE.temperatureC;
  if (temperatureC < tLow || temperatureC > tHigh) {
    warnings.push(`Ambient ${temperatureC.toFixed(1)} °C is outside the ${tLow}–${tHigh} °C range CIPM-2007 was validated for; the density is extrapolated.`);
  }
  const [pLow, pHigh] = CIPM2007_VALID_RANGE.pressurePa;
  if (pressurePa < pLow || pressurePa > pHigh) {
    warnings.push(`Barometric pressure ${(pressurePa / 1000).toFixed(1)} kPa is outside the range CIPM-2007 was validated for.`);
  }
  if (humidityAssumed) warnings.push("No humidity entered: the air was taken as dry.");
  return {
    densityKgM3: cipm.densityKgM3,
    ambient: { temperatureC, pressurePa, relativeHumidityPercent, humidityAssumed, compressibilityZ: cipm.compressibility },
    warnings,
  };
}

/** Computes every column of a flow test. Throws a ZodError when the input is not a valid test. */
export function computeFlowTest(input: FlowTestInput): FlowTestResult {
  const test = flowTestInputSchema.parse(input);
  const standard = STANDARD_AIR[test.standardAir];
  const air = testAir(test, standard.densityKgM3);
  const rho = air.densityKgM3;

  const valveM = length.toSi(test.valveDiameter, test.lengthUnit);
  const valveArea = circleArea(valveM);
  const seatArea = test.seatDiameter === undefined ? null : circleArea(length.toSi(test.seatDiameter, test.lengthUnit));
  const sectionArea = test.minSectionArea === undefined ? null : area.toSi(test.minSectionArea, test.areaUnit);
  const testDepressionPa = pressure.toSi(test.depression, test.depressionUnit);
  const referencePa = pressure.toSi(REFERENCE_DEPRESSION_INH2O, "inH2O");
  const valveAreaIn2 = area.fromSi(valveArea, "in2");

  const points = test.points
    .map((point): FlowPointResult => {
      const liftM = length.toSi(point.lift, test.liftUnit);
      const depressionPa = point.depression === undefined ? testDepressionPa : pressure.toSi(point.depression, test.depressionUnit);
      const q = flow.toSi(point.flow, test.flowUnit);
      const corrected = flowAtDensity(flowAtDepression(q, depressionPa, referencePa), rho, standard.densityKgM3);
      const curtain = curtainArea(valveM, liftM);
      const correctedCfm = flow.fromSi(corrected, "cfm");
      return {
        liftMm: length.fromSi(liftM, "mm"),
        liftIn: length.fromSi(liftM, "in"),
        ld: liftOverDiameter(liftM, valveM),
        depressionInH2O: pressure.fromSi(depressionPa, "inH2O"),
        flowCfm: flow.fromSi(q, "cfm"),
        flowLs: flow.fromSi(q, "L/s"),
        flowCfmAt28: correctedCfm,
        flowLsAt28: flow.fromSi(corrected, "L/s"),
        curtainAreaMm2: area.fromSi(curtain, "mm2"),
        cdCurtain: flowCoefficient(q, curtain, depressionPa, rho),
        cdValve: flowCoefficient(q, valveArea, depressionPa, rho),
        cdSeat: seatArea === null ? null : flowCoefficient(q, seatArea, depressionPa, rho),
        idealVelocityMs: idealVelocity(depressionPa, rho),
        sectionVelocityMs: sectionArea === null ? null : meanSectionVelocity(q, sectionArea),
        cfmPerSqInValve: correctedCfm / valveAreaIn2,
        cfmPerSqInSection: sectionArea === null ? null : correctedCfm / area.fromSi(sectionArea, "in2"),
      };
    })
    .sort((a, b) => a.liftMm - b.liftMm);

  const peak = points.reduce((best, p) => (p.flowCfmAt28 > best.flowCfmAt28 ? p : best));
  const last = points[points.length - 1];
  const idealVelocityAt28Ms = idealVelocity(referencePa, standard.densityKgM3);
  const summary: FlowTestSummary = {
    pointCount: points.length,
    maxLiftMm: last.liftMm,
    maxLd: last.ld,
    peakFlowCfmAt28: peak.flowCfmAt28,
    peakFlowLiftMm: peak.liftMm,
    flowCfmAt28AtLd025: interpolateAt(points.map((p) => ({ x: p.ld, y: p.flowCfmAt28 })), 0.25),
    meanCdValve: mean(points.map((p) => p.cdValve)),
    peakCdValve: Math.max(...points.map((p) => p.cdValve)),
    meanCdCurtain: mean(points.map((p) => p.cdCurtain)),
    valveAreaMm2: area.fromSi(valveArea, "mm2"),
    seatAreaMm2: seatArea === null ? null : area.fromSi(seatArea, "mm2"),
    minSectionAreaMm2: sectionArea === null ? null : area.fromSi(sectionArea, "mm2"),
    sectionToValveAreaRatio: sectionArea === null ? null : sectionArea / valveArea,
    idealVelocityAt28Ms,
    idealCfmPerSqInAt28: flow.fromSi(idealVelocityAt28Ms * area.toSi(1, "in2"), "cfm"),
  };

  const warnings = [...air.warnings];
  // A coefficient above 1 means more flow than an ideal opening of that area passes: the units
  // or the valve size are wrong far more often than the bench is.
  const implausible = points.filter((p) => p.cdCurtain > 1 || p.cdValve > 1).map((p) => p.liftMm.toFixed(2));
  if (implausible.length) {
    warnings.push(`Flow coefficient above 1 at ${implausible.join(", ")} mm lift: check the lift and flow units and the valve diameter.`);
  }
  const mixed = points.some((p) => Math.abs(p.depressionInH2O - pressure.fromSi(testDepressionPa, "inH2O")) > 1e-9);
  if (mixed) warnings.push("Some points were measured at their own depression; all were moved to 28 inH₂O by the square-root law.");

  return {
    points,
    summary,
    densityKgM3: rho,
    densitySource: air.ambient ? "ambient" : "standard-air",
    standardAir: { id: standard.id, label: standard.label, densityKgM3: standard.densityKgM3 },
    ambient: air.ambient,
    valveDiameterMm: length.fromSi(valveM, "mm"),
    depressionInH2O: pressure.fromSi(testDepressionPa, "inH2O"),
    depressionPa: testDepressionPa,
    referenceDepressionInH2O: REFERENCE_DEPRESSION_INH2O,
    conventions: { inchOfWater: INCH_OF_WATER.label, densityLaw: DENSITY_LAW.name, flowLaw: FLOW_LAW.name },
    notes: [COMPRESSIBILITY_NOTE, ESTIMATE_CAUTION],
    warnings,
  };
}

export type FlowIssue = { path: string; message: string };

/** For forms and the CLI: the result, or the input problems as path + message, never a throw. */
export function tryComputeFlowTest(input: unknown): { ok: true; result: FlowTestResult } | { ok: false; issues: FlowIssue[] } {
  const parsed = flowTestInputSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: formatIssues(parsed.error) };
  return { ok: true, result: computeFlowTest(parsed.data) };
}

export function formatIssues(error: z.ZodError): FlowIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join("."), message: issue.message }));
}
