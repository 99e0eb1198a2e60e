/**
 * The flow sheet's facts as label/value pairs, formatted once for the screen, the printout and
 * the PDF, so the three never disagree. Estimates carry their rule-of-thumb label.
 */
import type { FlowTestDetail } from "@/db/queries/flow-tests";
import {
  COMPRESSIBILITY_NOTE,
  DENSITY_LAW,
  ESTIMATE_CAUTION,
  FLOW_LAW,
  INCH_OF_WATER,
  MACH_INDEX_THRESHOLD,
  MEAN_CD_NOTE,
  POWER_RULE_LABEL,
  computeEngineEstimates,
  density,
  type FlowTestResult,
} from "@/lib/flow";
import { SUBJECT_WORDS, PORT_WORDS, benchSetup, fixed, portPlace } from "./words";

export type SheetFact = { label: string; value: string; note?: string };

export type FlowSheet = {
  title: string;
  subtitle: string;
  tested: SheetFact[];
  bench: SheetFact[];
  summary: SheetFact[];
  estimates: SheetFact[];
  conventions: string[];
  warnings: string[];
  cautions: string[];
};

/** The usual shop cautions beside any figure that may guide metal removal. */
export const SHOP_CAUTIONS = [
  ESTIMATE_CAUTION,
  "Keep the wall thickness near water jackets and valve seats; check castings before porting deeper.",
  "Run guards closed and wear eye protection at the machine and the grinder.",
  "Defer to the machine builder's instructions, local codes and licensed practice.",
];

export function flowSheet(test: FlowTestDetail, result: FlowTestResult): FlowSheet {
  const place = portPlace(test.cylinder, test.portNumber);
  const s = result.summary;
  const tested: SheetFact[] = [
    { label: "Casting", value: `${test.castingNumber ?? "—"}${test.engineFamily ? ` (${test.engineFamily})` : ""}` },
    { label: "What was tested", value: `${SUBJECT_WORDS[test.subject]}${test.subject === "baseline" ? "" : `: ${test.subjectLabel}`}` },
    { label: "Port", value: `${PORT_WORDS[test.port]}${place ? `, ${place}` : ""}` },
    { label: "Tested on", value: test.testedOn },
    { label: "Operator", value: test.operatorName ?? "—" },
  ];
  const air = result.ambient;
  const bench: SheetFact[] = [
    { label: "Bench depression", value: `${fixed(result.depressionInH2O, 1)} inH₂O (${fixed(result.depressionPa / 1000, 3)} kPa)` },
    { label: "Setup", value: benchSetup(test.entryRadius, test.exhaustPipe) },
    {
      label: "Air",
      value: air
        ? `${fixed(air.temperatureC, 1)} °C, ${fixed(air.pressurePa / 1000, 2)} kPa, ${air.humidityAssumed ? "humidity not entered (taken as dry)" : `${fixed(air.relativeHumidityPercent, 0)} % RH`}`
        : "not entered: standard air assumed",
    },
    {
      label: "Air density used",
      value: `${fixed(result.densityKgM3, 4)} kg/m³ (${fixed(density.fromSi(result.densityKgM3, "lb/ft3"), 5)} lb/ft³)`,
      note: result.densitySource === "ambient" ? DENSITY_LAW.name : result.standardAir.label,
    },
    { label: "Valve diameter", value: `${fixed(result.valveDiameterMm, 2)} mm`, note: `valve-head area ${fixed(s.valveAreaMm2, 0)} mm²` },
    { label: "Seat ID", value: test.seatIdMm == null ? "—" : `${fixed(test.seatIdMm, 2)} mm` },
    {
      label: "Minimum section",
      value: s.minSectionAreaMm2 == null ? "—" : `${fixed(s.minSectionAreaMm2, 0)} mm²`,
      note: s.sectionToValveAreaRatio == null ? undefined : `${fixed(s.sectionToValveAreaRatio * 100, 1)} % of the valve-head area`,
    },
  ];
  const summary: SheetFact[] = [
    { label: "Peak flow at 28 inH₂O, standard air", value: `${fixed(s.peakFlowCfmAt28, 1)} cfm`, note: `at ${fixed(s.peakFlowLiftMm, 2)} mm lift` },
    { label: "Flow at L/D 0.25", value: s.flowCfmAt28AtLd025 == null ? "not tested that high" : `${fixed(s.flowCfmAt28AtLd025, 1)} cfm` },
    { label: "Flow coefficient on valve area", value: `mean ${fixed(s.meanCdValve, 3)}, peak ${fixed(s.peakCdValve, 3)}` },
    { label: "Mean flow coefficient on curtain area", value: fixed(s.meanCdCurtain, 3) },
    { label: "Lift points", value: `${s.pointCount}, up to ${fixed(s.maxLiftMm, 2)} mm (L/D ${fixed(s.maxLd, 3)})` },
    { label: "Ideal velocity at 28 inH₂O", value: `${fixed(s.idealVelocityAt28Ms, 1)} m/s`, note: `${fixed(s.idealCfmPerSqInAt28, 1)} cfm per in² is the ideal ceiling` },
  ];

  const estimates: SheetFact[] = [];
  if (test.port === "intake" && test.boreMm && test.strokeMm && test.cylinders && result.valveDiameterMm < test.boreMm) {
    const e = computeEngineEstimates({
      bore: test.boreMm,
      stroke: test.strokeMm,
      lengthUnit: "mm",
      // Any speed: the figures used below do not depend on it.
      rpm: 6000,
      cylinders: test.cylinders,
      intakeValveDiameter: result.valveDiameterMm,
      meanFlowCoefficient: Math.min(1.2, s.meanCdValve),
      intakeCfmAt28: s.peakFlowCfmAt28,
    });
    if (e.powerEstimateHp != null) {
      estimates.push({ label: "Power potential (estimate)", value: `about ${fixed(e.powerEstimateHp, 0)} hp for ${test.cylinders} cylinders`, note: POWER_RULE_LABEL });
    }
    if (e.rpmAtMachThreshold != null) {
      estimates.push({
        label: `Engine speed where the inlet Mach index reaches ${MACH_INDEX_THRESHOLD}`,
        value: `about ${fixed(Math.round(e.rpmAtMachThreshold / 10) * 10, 0)} rpm`,
        note: `${e.labels.machIndex}. ${MEAN_CD_NOTE}`,
      });
    }
  }

  return {
    title: `Flow test #${test.id}`,
    subtitle: `${test.castingNumber ?? ""} ${PORT_WORDS[test.port].toLowerCase()} · ${test.subjectLabel} · ${test.testedOn}`,
    tested,
    bench,
    summary,
    estimates,
    conventions: [
      `Corrected flows are moved to ${result.referenceDepressionInH2O} inH₂O and to ${result.standardAir.label}.`,
      `Air density: ${DENSITY_LAW.name} (${DENSITY_LAW.source}); ${DENSITY_LAW.assumption}.`,
      `Flow law: ${FLOW_LAW.name}.`,
      COMPRESSIBILITY_NOTE,
      `Inch of water: ${INCH_OF_WATER.label}.`,
    ],
    warnings: result.warnings,
    cautions: SHOP_CAUTIONS,
  };
}
