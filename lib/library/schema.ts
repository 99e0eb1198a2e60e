/** Shapes of the library records' inputs, shared by the forms (zodResolver) and the verbs. */
import { z } from "zod";
import { PORTS } from "@/db/enums";
import { anyNumber, calendarDate, measure, notes, optionalDate, optionalMeasure, optionalRecordId, optionalText, recordId, requiredText, wholeNumber } from "./fields";

// ─── Head types ─────────────────────────────────────────────────────────────

export const headTypeSchema = z
  .object({
    castingNumber: requiredText("the casting number", 40).regex(/^[A-Za-z0-9][A-Za-z0-9 ./_-]*$/, {
      message: "Use letters, digits, spaces, dots, dashes or slashes.",
    }),
    engineFamily: requiredText("the engine family", 120),
    cylinders: wholeNumber("the number of cylinders", 1, 16),
    valvesPerCylinder: wholeNumber("valves per cylinder", 1, 5),
    boreMm: measure("the bore", 20, 250, "mm"),
    strokeMm: measure("the stroke", 20, 250, "mm"),
    intakeValveMm: measure("the intake valve diameter", 10, 90, "mm"),
    exhaustValveMm: measure("the exhaust valve diameter", 10, 90, "mm"),
    intakeSeatIdMm: optionalMeasure("the intake seat ID", 5, 90, "mm"),
    exhaustSeatIdMm: optionalMeasure("the exhaust seat ID", 5, 90, "mm"),
    notes: notes(),
  })
  .refine((v) => v.intakeSeatIdMm == null || v.intakeSeatIdMm < v.intakeValveMm, {
    path: ["intakeSeatIdMm"],
    message: "The seat ID must be smaller than the valve head.",
  })
  .refine((v) => v.exhaustSeatIdMm == null || v.exhaustSeatIdMm < v.exhaustValveMm, {
    path: ["exhaustSeatIdMm"],
    message: "The seat ID must be smaller than the valve head.",
  });
export type HeadTypeInput = z.input<typeof headTypeSchema>;

// ─── Master heads ───────────────────────────────────────────────────────────

const portMeasurements = z
  .object({
    throatMm: optionalMeasure("the throat", 5, 90, "mm"),
    seatIdMm: optionalMeasure("the seat ID", 5, 90, "mm"),
    portVolumeCc: optionalMeasure("the port volume", 10, 1000, "cc"),
    shortSideNote: optionalText(500),
  })
  .default({});

export const masterSchema = z
  .object({
    label: requiredText("the master's label", 40).regex(/^[A-Za-z0-9][A-Za-z0-9 ./_-]*$/, {
      message: "Use letters, digits, spaces, dots, dashes or slashes.",
    }),
    headTypeId: recordId("a head type"),
    porterId: optionalRecordId(),
    startedOn: optionalDate("the start date"),
    finishedOn: optionalDate("the finish date"),
    handPortNotes: z.object({ intake: optionalText(4000), exhaust: optionalText(4000) }).default({}),
    measurements: z.object({ intake: portMeasurements, exhaust: portMeasurements }).default({ intake: {}, exhaust: {} }),
    notes: notes(),
  })
  .refine((v) => !v.startedOn || !v.finishedOn || v.finishedOn >= v.startedOn, {
    path: ["finishedOn"],
    message: "The finish date cannot be before the start.",
  });
export type MasterInput = z.input<typeof masterSchema>;

export const masterMoveSchema = z.object({
  to: z.enum(["hand_porting", "ready_to_digitize", "digitized", "retired"], { message: "Choose a stage." }),
  note: z.string().trim().max(500).default(""),
});
export type MasterMoveInput = z.input<typeof masterMoveSchema>;

// ─── Fixture plates ─────────────────────────────────────────────────────────

export const WORK_OFFSET_CODES = ["G54", "G55", "G56", "G57", "G58", "G59"] as const;

const point3 = (what: string) => z.object({ x: anyNumber(`${what} X`), y: anyNumber(`${what} Y`), z: anyNumber(`${what} Z`) });

export const plateSchema = z
  .object({
    code: requiredText("the plate code", 40).regex(/^[A-Za-z0-9][A-Za-z0-9 ./_-]*$/, { message: "Use letters, digits, spaces, dots, dashes or slashes." }),
    headTypeId: recordId("a head type"),
    datumDescription: z.string().trim().max(2000).default(""),
    workOffsets: z
      .array(
        z.object({
          code: z.enum(WORK_OFFSET_CODES, { message: "Choose G54 to G59." }),
          x: anyNumber("X"),
          y: anyNumber("Y"),
          z: anyNumber("Z"),
          a: z.number().nullish(),
          b: z.number().nullish(),
        }),
      )
      .min(1, { message: "Give at least one work offset." })
      .max(6)
      .refine((rows) => new Set(rows.map((r) => r.code)).size === rows.length, { message: "Each work offset code once." }),
    portAxisAngles: z
      .object({
        intake: z.object({ a: z.number().min(-360).max(360).nullish(), b: z.number().min(-360).max(360).nullish() }).default({}),
        exhaust: z.object({ a: z.number().min(-360).max(360).nullish(), b: z.number().min(-360).max(360).nullish() }).default({}),
      })
      .default({ intake: {}, exhaust: {} }),
    envelope: z.object({ min: point3("Envelope minimum"), max: point3("Envelope maximum") }),
    notes: notes(),
  })
  .superRefine((v, ctx) => {
    for (const axis of ["x", "y", "z"] as const) {
      if (v.envelope.min[axis] >= v.envelope.max[axis]) {
        ctx.addIssue({ code: "custom", path: ["envelope", "max", axis], message: `The envelope's ${axis.toUpperCase()} maximum must be above its minimum.` });
      }
    }
  });
export type PlateInput = z.input<typeof plateSchema>;

// ─── Machines ───────────────────────────────────────────────────────────────

const range = (what: string) => z.object({ min: anyNumber(`${what} minimum`), max: anyNumber(`${what} maximum`) });
const rapid = (axis: string) => z.number({ message: `Enter the ${axis} rapid rate.` }).positive({ message: "Rapid rates are above zero." }).max(200_000);

export const machineSchema = z
  .object({
    name: requiredText("the machine's name", 80),
    description: z.string().trim().max(500).default(""),
    axes: z
      .string()
      .trim()
      .toUpperCase()
      .regex(/^XYZA?B?C?$/, { message: "Axes are XYZ followed by any of A, B, C in order, e.g. XYZAB." }),
    limits: z.object({
      travelMm: z.object({ X: range("X travel"), Y: range("Y travel"), Z: range("Z travel") }),
      rotaryDeg: z.object({ A: range("A limit").nullish(), B: range("B limit").nullish(), C: range("C limit").nullish() }).default({}),
      rapidPerMin: z.object({ X: rapid("X"), Y: rapid("Y"), Z: rapid("Z"), A: rapid("A").nullish(), B: rapid("B").nullish(), C: rapid("C").nullish() }),
    }),
    maxFeedMmMin: measure("the maximum feed", 1, 200_000, "mm/min"),
    maxSpindleRpm: measure("the maximum spindle speed", 1, 200_000, "rpm"),
    toolChangeS: measure("the tool-change time", 0, 600, "s"),
    active: z.boolean().default(true),
    notes: notes(),
  })
  .superRefine((v, ctx) => {
    for (const axis of ["X", "Y", "Z"] as const) {
      const r = v.limits.travelMm[axis];
      if (r.min >= r.max) ctx.addIssue({ code: "custom", path: ["limits", "travelMm", axis, "max"], message: `${axis} travel maximum must be above its minimum.` });
    }
    for (const axis of ["A", "B", "C"] as const) {
      const r = v.limits.rotaryDeg[axis];
      if (r && r.min >= r.max) ctx.addIssue({ code: "custom", path: ["limits", "rotaryDeg", axis, "max"], message: `${axis} maximum must be above its minimum.` });
      const present = v.axes.includes(axis);
      if (present && v.limits.rapidPerMin[axis] == null) {
        ctx.addIssue({ code: "custom", path: ["limits", "rapidPerMin", axis], message: `Enter the ${axis} rapid rate (the machine has an ${axis} axis).` });
      }
    }
  });
export type MachineInput = z.input<typeof machineSchema>;

// ─── Scans ──────────────────────────────────────────────────────────────────

export const scanSchema = z.object({
  masterId: recordId("the master head"),
  plateId: recordId("the fixture plate"),
  machineId: recordId("the machine"),
  port: z.enum(PORTS, { message: "Choose intake or exhaust." }),
  operatorId: optionalRecordId(),
  stylusDiameterMm: measure("the stylus diameter", 0.1, 25, "mm"),
  pointSpacingMm: measure("the point spacing", 0.01, 10, "mm"),
  scannedOn: calendarDate("the scan date"),
  notes: notes(),
});
export type ScanInput = z.input<typeof scanSchema>;

export const attachmentCaptionSchema = z.object({ caption: z.string().trim().max(200).default("") });
