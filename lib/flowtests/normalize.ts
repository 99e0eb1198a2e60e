/**
 * Between what a person typed and what is stored. Records keep lift in mm, flow in cfm at the
 * test's own depression, depression in inH₂O (conventional), air in °C / kPa / %, sizes in mm;
 * the computed columns are never stored, they are recomputed from these with the flow math each
 * time they are shown, so a fix in the math shows on every old test too.
 */
import {
  area,
  flow,
  flowAtDepression,
  length,
  pressure,
  temperatureToCelsius,
  tryComputeFlowTest,
  type FlowIssue,
  type FlowTestResult,
} from "@/lib/flow";
import { SUBJECT_LINK, toFlowInput, type FlowInputSource, type FlowSubject, type FlowTestRecord, type FlowTestRecordInput } from "./schema";

export type StoredFlowTest = {
  subject: FlowSubject;
  headTypeId: number;
  masterId: number | null;
  revisionId: number | null;
  headId: number | null;
  port: "intake" | "exhaust";
  cylinder: number | null;
  portNumber: number | null;
  depressionInH2O: number;
  tempC: number | null;
  baroKpa: number | null;
  rhPct: number | null;
  valveDiameterMm: number;
  seatIdMm: number | null;
  minSectionMm2: number | null;
  entryRadius: boolean;
  exhaustPipe: boolean;
  operatorId: number | null;
  testedOn: string;
  notes: string;
};

export type StoredPoint = { liftMm: number; flowCfm: number };

/** The stored fields the flow math reads. */
export type StoredFigures = Pick<StoredFlowTest, "valveDiameterMm" | "seatIdMm" | "minSectionMm2" | "depressionInH2O" | "tempC" | "baroKpa" | "rhPct">;

/** Drops the float noise a unit conversion leaves (0.1 in → 2.5400000000000005 mm), nothing a bench can see. */
export const clean = (value: number) => Number(value.toPrecision(12));
const cleanOrNull = (value: number | null | undefined) => (value == null ? null : clean(value));

/** A validated record in the stored units. Points measured at their own depression are moved to the test depression by the square-root law, the same law the math applies. */
export function recordToStored(record: FlowTestRecord, operatorId: number | null): { test: StoredFlowTest; points: StoredPoint[] } {
  const link = SUBJECT_LINK[record.subject];
  const air = record.ambient;
  const hasAir = air?.temperature != null && air?.pressure != null;
  const testDepressionPa = pressure.toSi(record.depression, record.depressionUnit);
  const points = record.points
    .map((p) => {
      const cfm = flow.convert(p.flow, record.flowUnit, "cfm");
      const atTestDepression = p.depression === undefined ? cfm : flowAtDepression(cfm, pressure.toSi(p.depression, record.depressionUnit), testDepressionPa);
      return { liftMm: clean(length.convert(p.lift, record.liftUnit, "mm")), flowCfm: clean(atTestDepression) };
    })
    .sort((a, b) => a.liftMm - b.liftMm);
  return {
    test: {
      subject: record.subject,
      headTypeId: record.headTypeId,
      masterId: link === "masterId" ? (record.masterId ?? null) : null,
      revisionId: link === "revisionId" ? (record.revisionId ?? null) : null,
      headId: link === "headId" ? (record.headId ?? null) : null,
      port: record.port,
      cylinder: record.cylinder ?? null,
      portNumber: record.portNumber ?? null,
      depressionInH2O: clean(pressure.convert(record.depression, record.depressionUnit, "inH2O")),
      tempC: hasAir ? clean(temperatureToCelsius(air!.temperature!, air!.temperatureUnit)) : null,
      baroKpa: hasAir ? clean(pressure.convert(air!.pressure!, air!.pressureUnit, "kPa")) : null,
      rhPct: hasAir ? cleanOrNull(air!.relativeHumidityPercent) : null,
      valveDiameterMm: clean(length.convert(record.valveDiameter, record.lengthUnit, "mm")),
      seatIdMm: record.seatDiameter == null ? null : clean(length.convert(record.seatDiameter, record.lengthUnit, "mm")),
      minSectionMm2: record.minSectionArea == null ? null : clean(area.convert(record.minSectionArea, record.areaUnit, "mm2")),
      entryRadius: record.entryRadius,
      exhaustPipe: record.exhaustPipe,
      operatorId: record.operatorId ?? operatorId,
      testedOn: record.testedOn,
      notes: record.notes,
    },
    points,
  };
}

/** The flow math's input for a stored test, in the stored units. */
export function storedToFlowSource(test: StoredFigures, points: StoredPoint[]): FlowInputSource {
  return {
    valveDiameter: test.valveDiameterMm,
    seatDiameter: test.seatIdMm,
    lengthUnit: "mm",
    minSectionArea: test.minSectionMm2,
    areaUnit: "mm2",
    depression: test.depressionInH2O,
    depressionUnit: "inH2O",
    ambient:
      test.tempC != null && test.baroKpa != null
        ? { temperature: test.tempC, temperatureUnit: "C", pressure: test.baroKpa, pressureUnit: "kPa", relativeHumidityPercent: test.rhPct }
        : undefined,
    liftUnit: "mm",
    flowUnit: "cfm",
    points: points.map((p) => ({ lift: p.liftMm, flow: p.flowCfm })),
  };
}

/** A stored test as the entry form's values (stored units), for editing. */
export function storedToRecordInput(test: StoredFlowTest, points: StoredPoint[]): FlowTestRecordInput {
  const source = storedToFlowSource(test, points);
  return {
    ...source,
    ambient: source.ambient ?? { temperature: null, temperatureUnit: "C", pressure: null, pressureUnit: "kPa", relativeHumidityPercent: null },
    headTypeId: test.headTypeId,
    subject: test.subject,
    masterId: test.masterId,
    revisionId: test.revisionId,
    headId: test.headId,
    port: test.port,
    cylinder: test.cylinder,
    portNumber: test.portNumber,
    testedOn: test.testedOn,
    operatorId: test.operatorId,
    entryRadius: test.entryRadius,
    exhaustPipe: test.exhaustPipe,
    notes: test.notes,
  };
}

/** Every computed column of a stored test, or why it cannot be computed (never throws). */
export function computeStored(test: StoredFigures, points: StoredPoint[]): { ok: true; result: FlowTestResult } | { ok: false; issues: FlowIssue[] } {
  if (points.length === 0) return { ok: false, issues: [{ path: "points", message: "This test has no lift points." }] };
  return tryComputeFlowTest(toFlowInput(storedToFlowSource(test, points)));
}
