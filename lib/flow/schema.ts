/**
 * Input shapes of the flow math, shared by the server, the React forms and the CLI.
 * Values stay in the units the user typed; each group names its unit, and the math converts.
 * Plausibility bounds are there to catch unit mix-ups (Pa typed as kPa, lift in mm marked inches).
 */
import { z } from "zod";
import type { StandardAirId } from "./labels";
import {
  AREA_UNITS,
  FLOW_UNITS,
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  pressure,
  temperatureToCelsius,
  length,
} from "./units";

/** A flow test has a dozen or two points; far more means the wrong file. */
export const MAX_POINTS = 500;
/** Bench depressions outside this window are unit mistakes, not tests (Pa). */
export const DEPRESSION_RANGE_PA = [100, 20_000] as const;
/** Barometric pressures a shop can see, from high altitude to a deep low (Pa). */
export const BAROMETRIC_RANGE_PA = [50_000, 110_000] as const;
export const AMBIENT_TEMPERATURE_RANGE_C = [-30, 60] as const;

export const LIFT_UNITS = ["mm", "in"] as const;
const positive = z.number().finite().positive();

export const flowPointSchema = z.object({
  lift: positive,
  flow: z.number().finite().nonnegative(),
  /** This point's own depression, when the bench could not hold the test depression. */
  depression: positive.optional(),
});

export const ambientSchema = z
  .object({
    temperature: z.number().finite(),
    temperatureUnit: z.enum(TEMPERATURE_UNITS).default("C"),
    pressure: positive,
    pressureUnit: z.enum(PRESSURE_UNITS).default("kPa"),
    /** Left out means dry air, which the result states. */
    relativeHumidityPercent: z.number().finite().min(0).max(100).optional(),
  })
  .superRefine((air, ctx) => {
    const celsius = temperatureToCelsius(air.temperature, air.temperatureUnit);
    const [tMin, tMax] = AMBIENT_TEMPERATURE_RANGE_C;
    if (celsius < tMin || celsius > tMax) {
      ctx.addIssue({ code: "custom", path: ["temperature"], message: `ambient temperature must be between ${tMin} and ${tMax} °C` });
    }
    const pa = pressure.toSi(air.pressure, air.pressureUnit);
    const [pMin, pMax] = BAROMETRIC_RANGE_PA;
    if (pa < pMin || pa > pMax) {
      ctx.addIssue({
        code: "custom",
        path: ["pressure"],
        message: `barometric pressure must be between ${pMin / 1000} and ${pMax / 1000} kPa; check the unit`,
      });
    }
  });

export const flowTestInputSchema = z
  .object({
    valveDiameter: positive,
    /** Inner seat diameter, for a flow coefficient on the seat area. */
    seatDiameter: positive.optional(),
    /** Unit of valve and seat diameters. */
    lengthUnit: z.enum(LIFT_UNITS).default("mm"),
    /** Minimum section of the port, entered by hand or taken from a scan. */
    minSectionArea: positive.optional(),
    areaUnit: z.enum(AREA_UNITS).default("mm2"),
    depression: positive,
    depressionUnit: z.enum(PRESSURE_UNITS).default("inH2O"),
    ambient: ambientSchema.optional(),
    standardAir: z.enum(["iso2533", "fan075"] as const satisfies readonly StandardAirId[]).default("iso2533"),
    liftUnit: z.enum(LIFT_UNITS).default("mm"),
    flowUnit: z.enum(FLOW_UNITS).default("cfm"),
    points: z.array(flowPointSchema).min(1).max(MAX_POINTS),
  })
  .superRefine((test, ctx) => {
    const valveM = length.toSi(test.valveDiameter, test.lengthUnit);
    if (test.seatDiameter !== undefined && test.seatDiameter >= test.valveDiameter) {
      ctx.addIssue({ code: "custom", path: ["seatDiameter"], message: "seat diameter must be smaller than the valve diameter" });
    }
    const [dMin, dMax] = DEPRESSION_RANGE_PA;
    const depressionInRange = (value: number) => {
      const pa = pressure.toSi(value, test.depressionUnit);
      return pa >= dMin && pa <= dMax;
    };
    const rangeText = `between ${dMin} Pa and ${dMax / 1000} kPa (${(dMin / 249.08891).toFixed(1)}–${(dMax / 249.08891).toFixed(0)} inH₂O); check the unit`;
    if (!depressionInRange(test.depression)) {
      ctx.addIssue({ code: "custom", path: ["depression"], message: `bench depression must be ${rangeText}` });
    }
    const seen = new Map<number, number>();
    test.points.forEach((point, index) => {
      const liftM = length.toSi(point.lift, test.liftUnit);
      if (liftM > valveM) {
        ctx.addIssue({
          code: "custom",
          path: ["points", index, "lift"],
          message: `lift ${point.lift} ${test.liftUnit} is larger than the valve diameter; check the units`,
        });
      }
      if (point.depression !== undefined && !depressionInRange(point.depression)) {
        ctx.addIssue({ code: "custom", path: ["points", index, "depression"], message: `depression must be ${rangeText}` });
      }
      const earlier = seen.get(point.lift);
      if (earlier !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["points", index, "lift"],
          message: `lift ${point.lift} ${test.liftUnit} appears twice (points ${earlier + 1} and ${index + 1})`,
        });
      } else {
        seen.set(point.lift, index);
      }
    });
  });

export type FlowPointInput = z.input<typeof flowPointSchema>;
export type AmbientInput = z.input<typeof ambientSchema>;
export type FlowTestInput = z.input<typeof flowTestInputSchema>;
export type FlowTest = z.output<typeof flowTestInputSchema>;

export const engineInputSchema = z
  .object({
    bore: positive,
    stroke: positive,
    /** Unit of bore, stroke and intake valve diameter. */
    lengthUnit: z.enum(LIFT_UNITS).default("mm"),
    rpm: positive,
    cylinders: z.number().int().positive().max(24).optional(),
    intakeValveDiameter: positive.optional(),
    /** Mean intake flow coefficient on the valve-head area, e.g. the mean Cd of a flow test. */
    meanFlowCoefficient: z.number().finite().positive().max(1.2).optional(),
    /** Port section for the velocity figures. */
    sectionArea: positive.optional(),
    areaUnit: z.enum(AREA_UNITS).default("mm2"),
    /** Intake flow corrected to 28 inH₂O, for the power rule of thumb. */
    intakeCfmAt28: positive.optional(),
    inletTemperatureC: z.number().finite().min(-30).max(80).default(20),
  })
  .superRefine((engine, ctx) => {
    if (engine.intakeValveDiameter !== undefined && engine.intakeValveDiameter >= engine.bore) {
      ctx.addIssue({ code: "custom", path: ["intakeValveDiameter"], message: "valve diameter must be smaller than the bore" });
    }
  });
export type EngineInput = z.input<typeof engineInputSchema>;
export type Engine = z.output<typeof engineInputSchema>;

const columnRef = z.union([z.string().min(1), z.number().int().nonnegative()]);
/** How the user maps CSV columns when the headers are not recognised (a name, or a 0-based index). */
export const columnMappingSchema = z.object({
  lift: z.object({ column: columnRef, unit: z.enum(LIFT_UNITS) }),
  flow: z.object({ column: columnRef, unit: z.enum(FLOW_UNITS) }),
  depression: z.object({ column: columnRef, unit: z.enum(PRESSURE_UNITS) }).optional(),
  /** false when the file has no header row (then columns must be indices). */
  hasHeader: z.boolean().default(true),
});
export type ColumnMappingInput = z.input<typeof columnMappingSchema>;
export type ColumnMapping = z.output<typeof columnMappingSchema>;
