/**
 * The shape of a flow-test record as a person enters it: what was tested, the bench and the air,
 * the valve, and the lift table in the units they chose. Shared by the React form (zodResolver)
 * and the server, so both show the same messages. The flow math's own checks (plausible
 * depression, lift smaller than the valve, no lift twice…) run inside, with the same field paths.
 */
import { z } from "zod";
import { FLOW_SUBJECTS, PORTS } from "@/db/enums";
import {
  AREA_UNITS,
  FLOW_UNITS,
  LIFT_UNITS,
  MAX_POINTS,
  PRESSURE_UNITS,
  TEMPERATURE_UNITS,
  columnMappingSchema,
  flowPointSchema,
  flowTestInputSchema,
  type FlowTestInput,
} from "@/lib/flow";

/** Notes are a paragraph or two; a page of text belongs in an attachment. */
export const NOTES_MAX = 4000;
/** A flow-bench CSV is a few dozen rows; a megabyte is already the wrong file. */
export const CSV_MAX_CHARS = 1024 * 1024;

const id = (message: string) => z.number({ message }).int({ message }).positive({ message });
const optionalId = z.number().int().positive().nullish();
const positive = (message: string) => z.number({ message }).finite({ message }).positive({ message });

/** A calendar date as YYYY-MM-DD that exists (no 2024-02-30). */
export const calendarDate = z
  .string({ message: "Enter the test date." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: "Enter the date as YYYY-MM-DD." })
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, { message: "That date does not exist." });

export const ambientFieldsSchema = z.object({
  temperature: z.number().finite().nullish(),
  temperatureUnit: z.enum(TEMPERATURE_UNITS).default("C"),
  pressure: z.number().finite().positive({ message: "Barometric pressure must be above zero." }).nullish(),
  pressureUnit: z.enum(PRESSURE_UNITS).default("kPa"),
  relativeHumidityPercent: z.number().finite().min(0, { message: "Humidity is 0–100 %." }).max(100, { message: "Humidity is 0–100 %." }).nullish(),
});

/** Everything but the lift table; also what a CSV import sends beside the file. */
export const flowTestFieldsBase = z.object({
  headTypeId: id("Choose the head type (casting)."),
  subject: z.enum(FLOW_SUBJECTS, { message: "Choose what was tested." }),
  /** Only the link that matches `subject` is kept; the others are cleared when stored. */
  masterId: optionalId,
  revisionId: optionalId,
  headId: optionalId,
  port: z.enum(PORTS, { message: "Choose intake or exhaust." }),
  cylinder: z.number().int({ message: "Cylinder is a whole number." }).min(1, { message: "Cylinders count from 1." }).max(24).nullish(),
  portNumber: z.number().int({ message: "Port number is a whole number." }).min(1, { message: "Ports count from 1." }).max(4, { message: "At most 4 ports of a kind per cylinder." }).nullish(),
  testedOn: calendarDate,
  /** Who ran the bench; the person recording when left out. */
  operatorId: optionalId,
  depression: positive("Enter the bench depression."),
  depressionUnit: z.enum(PRESSURE_UNITS).default("inH2O"),
  ambient: ambientFieldsSchema.optional(),
  valveDiameter: positive("Enter the valve diameter."),
  seatDiameter: z.number().finite().positive({ message: "Seat ID must be above zero." }).nullish(),
  lengthUnit: z.enum(LIFT_UNITS).default("mm"),
  minSectionArea: z.number().finite().positive({ message: "Minimum section must be above zero." }).nullish(),
  areaUnit: z.enum(AREA_UNITS).default("mm2"),
  entryRadius: z.boolean().default(false),
  exhaustPipe: z.boolean().default(false),
  notes: z.string().trim().max(NOTES_MAX, { message: `Keep notes under ${NOTES_MAX} characters.` }).default(""),
});

/** One row of the lift table, with messages for a person typing (the math's own rules run after). */
export const recordPointSchema = z.object({
  lift: z.number({ message: "Enter the lift." }).finite({ message: "Enter the lift." }).positive({ message: "Lift must be above zero." }),
  flow: z.number({ message: "Enter the flow." }).finite({ message: "Enter the flow." }).nonnegative({ message: "Flow cannot be negative." }),
  /** This point's own depression, in the test's depression unit, when the bench could not hold it. */
  depression: z.number().finite().positive({ message: "Depression must be above zero." }).optional(),
}) satisfies z.ZodType<z.output<typeof flowPointSchema>>;

export const flowTestRecordBase = flowTestFieldsBase.extend({
  liftUnit: z.enum(LIFT_UNITS).default("mm"),
  flowUnit: z.enum(FLOW_UNITS).default("cfm"),
  points: z
    .array(recordPointSchema, { message: "Enter the lift table." })
    .min(1, { message: "Enter at least one lift point." })
    .max(MAX_POINTS, { message: `At most ${MAX_POINTS} lift points.` }),
});

export type FlowSubject = (typeof FLOW_SUBJECTS)[number];
type RecordOut = z.output<typeof flowTestRecordBase>;
type FieldsOut = z.output<typeof flowTestFieldsBase>;
/** What the flow math needs of a record. */
export type FlowInputSource = Pick<
  RecordOut,
  "valveDiameter" | "seatDiameter" | "lengthUnit" | "minSectionArea" | "areaUnit" | "depression" | "depressionUnit" | "ambient" | "liftUnit" | "flowUnit" | "points"
>;

/** The link column each subject needs. */
export const SUBJECT_LINK: Record<FlowSubject, "masterId" | "revisionId" | "headId" | null> = {
  master: "masterId",
  revision: "revisionId",
  head: "headId",
  baseline: null,
};

const LINK_MESSAGE = {
  masterId: "Choose the master head that was tested.",
  revisionId: "Choose the program revision whose first cut was tested.",
  headId: "Choose the production head that was tested.",
} as const;

/** The flow math's input for a record (air readings only when both temperature and pressure are given). */
export function toFlowInput(record: FlowInputSource): FlowTestInput {
  const air = record.ambient;
  const hasAir = air?.temperature != null && air?.pressure != null;
  return {
    valveDiameter: record.valveDiameter,
    ...(record.seatDiameter != null ? { seatDiameter: record.seatDiameter } : {}),
    lengthUnit: record.lengthUnit,
    ...(record.minSectionArea != null ? { minSectionArea: record.minSectionArea } : {}),
    areaUnit: record.areaUnit,
    depression: record.depression,
    depressionUnit: record.depressionUnit,
    ...(hasAir
      ? {
          ambient: {
            temperature: air!.temperature!,
            temperatureUnit: air!.temperatureUnit,
            pressure: air!.pressure!,
            pressureUnit: air!.pressureUnit,
            ...(air!.relativeHumidityPercent != null ? { relativeHumidityPercent: air!.relativeHumidityPercent } : {}),
          },
        }
      : {}),
    standardAir: "iso2533",
    liftUnit: record.liftUnit,
    flowUnit: record.flowUnit,
    points: record.points.map((p) => (p.depression === undefined ? { lift: p.lift, flow: p.flow } : p)),
  };
}

function checkFields(fields: FieldsOut, ctx: z.RefinementCtx) {
  const link = SUBJECT_LINK[fields.subject];
  if (link && fields[link] == null) ctx.addIssue({ code: "custom", path: [link], message: LINK_MESSAGE[link] });
  const air = fields.ambient;
  if (air) {
    const hasT = air.temperature != null;
    const hasP = air.pressure != null;
    if (hasT && !hasP) ctx.addIssue({ code: "custom", path: ["ambient", "pressure"], message: "Enter the barometric pressure too, or leave both empty (standard air is then assumed)." });
    if (hasP && !hasT) ctx.addIssue({ code: "custom", path: ["ambient", "temperature"], message: "Enter the air temperature too, or leave both empty (standard air is then assumed)." });
    if (air.relativeHumidityPercent != null && !(hasT && hasP)) {
      ctx.addIssue({ code: "custom", path: ["ambient", "relativeHumidityPercent"], message: "Humidity needs the temperature and the barometric pressure." });
    }
  }
}

/** The whole record, with the flow math's checks forwarded under the same field names. */
export const flowTestRecordSchema = flowTestRecordBase.superRefine((record, ctx) => {
  checkFields(record, ctx);
  // Half-entered air is reported above; the math only sees complete readings.
  // zod still runs this after soft failures (an empty table, a negative valve); the math's
  // rules would only repeat them or follow from them, so they wait until those are fixed.
  if (!flowTestRecordBase.safeParse(record).success) return;
  const math = flowTestInputSchema.safeParse(toFlowInput(record));
  if (!math.success) {
    for (const issue of math.error.issues) ctx.addIssue({ code: "custom", path: issue.path as PropertyKey[], message: issue.message });
  }
});

export type FlowTestRecordInput = z.input<typeof flowTestRecordSchema>;
export type FlowTestRecord = z.output<typeof flowTestRecordSchema>;

/** A CSV import: the file's text, an optional column mapping, and the rest of the record. */
export const flowTestImportSchema = z.object({
  csv: z
    .string({ message: "Send the CSV text." })
    .min(1, { message: "The file is empty." })
    .max(CSV_MAX_CHARS, { message: "The file is larger than a flow-bench CSV can be (1 MB)." }),
  mapping: columnMappingSchema.optional(),
  test: flowTestFieldsBase.superRefine(checkFields),
});
export type FlowTestImportInput = z.input<typeof flowTestImportSchema>;
