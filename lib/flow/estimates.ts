/**
 * Engine-level estimates for one engine and, optionally, its flow figures, with the labels the
 * screen shows beside each number. Figures that need a missing input come back null.
 */
import {
  MACH_INDEX_THRESHOLD,
  inletMachIndex,
  meanPistonSpeed,
  portMeanVelocity,
  portVelocityRuleOfThumb,
  powerPotentialHp,
  rpmAtMachIndex,
} from "./engine";
import { ESTIMATE_CAUTION, MACH_INDEX_LABEL, MEAN_CD_NOTE, PORT_VELOCITY_RULE_LABEL, POWER_RULE_LABEL } from "./labels";
import { type EngineInput, engineInputSchema } from "./schema";
import { area, length, velocity } from "./units";

export type EngineEstimates = {
  meanPistonSpeedMs: number;
  meanPistonSpeedFtMin: number;
  /** Continuity velocity in the entered section; null without a section. */
  portMeanVelocityMs: number | null;
  portMeanVelocityFtS: number | null;
  /** Common-practice peak port velocity; null without a section. */
  portVelocityRuleMs: number | null;
  portVelocityRuleFtS: number | null;
  machIndex: number | null;
  machIndexThreshold: number;
  machIndexAboveThreshold: boolean | null;
  /** Engine speed at which Z reaches the threshold. */
  rpmAtMachThreshold: number | null;
  powerEstimateHp: number | null;
  labels: { power: string; portVelocityRule: string; machIndex: string; meanCd: string; caution: string };
};

/** Throws a ZodError when the input is invalid; see engineInputSchema. */
export function computeEngineEstimates(input: EngineInput): EngineEstimates {
  const engine = engineInputSchema.parse(input);
  const boreM = length.toSi(engine.bore, engine.lengthUnit);
  const strokeM = length.toSi(engine.stroke, engine.lengthUnit);
  const sectionM2 = engine.sectionArea === undefined ? null : area.toSi(engine.sectionArea, engine.areaUnit);
  const pistonSpeed = meanPistonSpeed(strokeM, engine.rpm);

  const portMean = sectionM2 === null ? null : portMeanVelocity(boreM, strokeM, engine.rpm, sectionM2);
  const portRule = sectionM2 === null ? null : portVelocityRuleOfThumb(boreM, strokeM, engine.rpm, sectionM2);

  let machIndex: number | null = null;
  let rpmAtThreshold: number | null = null;
  if (engine.intakeValveDiameter !== undefined && engine.meanFlowCoefficient !== undefined) {
    const machInput = {
      boreM,
      strokeM,
      intakeValveDiameterM: length.toSi(engine.intakeValveDiameter, engine.lengthUnit),
      meanFlowCoefficient: engine.meanFlowCoefficient,
      inletTemperatureK: engine.inletTemperatureC + 273.15,
    };
    machIndex = inletMachIndex({ ...machInput, rpm: engine.rpm });
    rpmAtThreshold = rpmAtMachIndex(machInput, MACH_INDEX_THRESHOLD);
  }

  const power =
    engine.intakeCfmAt28 !== undefined && engine.cylinders !== undefined
      ? powerPotentialHp(engine.intakeCfmAt28, engine.cylinders)
      : null;

  const ftS = (ms: number | null) => (ms === null ? null : velocity.fromSi(ms, "ft/s"));
  return {
    meanPistonSpeedMs: pistonSpeed,
    meanPistonSpeedFtMin: velocity.fromSi(pistonSpeed, "ft/min"),
    portMeanVelocityMs: portMean,
    portMeanVelocityFtS: ftS(portMean),
    portVelocityRuleMs: portRule,
    portVelocityRuleFtS: ftS(portRule),
    machIndex,
    machIndexThreshold: MACH_INDEX_THRESHOLD,
    machIndexAboveThreshold: machIndex === null ? null : machIndex > MACH_INDEX_THRESHOLD,
    rpmAtMachThreshold: rpmAtThreshold,
    powerEstimateHp: power,
    labels: {
      power: POWER_RULE_LABEL,
      portVelocityRule: PORT_VELOCITY_RULE_LABEL,
      machIndex: MACH_INDEX_LABEL,
      meanCd: MEAN_CD_NOTE,
      caution: ESTIMATE_CAUTION,
    },
  };
}
