import { describe, expect, it } from "vitest";
import { flowTestImportSchema, flowTestRecordSchema, type FlowTestRecordInput } from "@/lib/flowtests/schema";

const base: FlowTestRecordInput = {
  headTypeId: 1,
  subject: "baseline",
  port: "intake",
  testedOn: "2025-03-04",
  depression: 28,
  valveDiameter: 51.31,
  seatDiameter: 46.23,
  points: [
    { lift: 2.54, flow: 60 },
    { lift: 5.08, flow: 110 },
  ],
};

const allIssues = (input: unknown) => {
  const r = flowTestRecordSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
};
const issues = (input: unknown) => {
  const r = flowTestRecordSchema.safeParse(input);
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("flow-test record schema", () => {
  it("accepts a complete baseline and fills the unit defaults", () => {
    const r = flowTestRecordSchema.parse(base);
    expect(r.depressionUnit).toBe("inH2O");
    expect(r.liftUnit).toBe("mm");
    expect(r.flowUnit).toBe("cfm");
    expect(r.entryRadius).toBe(false);
    expect(r.notes).toBe("");
  });

  it("asks for the link that matches what was tested", () => {
    expect(issues({ ...base, subject: "master" })).toHaveProperty("masterId");
    expect(issues({ ...base, subject: "revision" })).toHaveProperty("revisionId");
    expect(issues({ ...base, subject: "head" })).toHaveProperty("headId");
    expect(issues({ ...base, subject: "revision", revisionId: 4 })).toEqual({});
  });

  it("forwards the flow math's checks under the same field paths", () => {
    // A lift larger than the valve is a unit mix-up (lib/flow schema rule).
    expect(issues({ ...base, points: [{ lift: 60, flow: 100 }] })["points.0.lift"]).toMatch(/larger than the valve/);
    expect(issues({ ...base, seatDiameter: 52 })["seatDiameter"]).toMatch(/smaller than the valve/);
    expect(issues({ ...base, depression: 28, depressionUnit: "Pa" })["depression"]).toMatch(/check the unit/);
    expect(issues({ ...base, points: [{ lift: 2, flow: 1 }, { lift: 2, flow: 3 }] })["points.1.lift"]).toMatch(/appears twice/);
  });

  it("wants temperature and pressure together, and humidity only with both", () => {
    expect(issues({ ...base, ambient: { temperature: 20 } })).toHaveProperty(["ambient.pressure"]);
    expect(issues({ ...base, ambient: { pressure: 101 } })).toHaveProperty(["ambient.temperature"]);
    expect(issues({ ...base, ambient: { relativeHumidityPercent: 40 } })).toHaveProperty(["ambient.relativeHumidityPercent"]);
    expect(issues({ ...base, ambient: { temperature: 20, pressure: 101, relativeHumidityPercent: 40 } })).toEqual({});
    // The math's plausibility window still applies (kPa typed as Pa).
    expect(issues({ ...base, ambient: { temperature: 20, pressure: 101, pressureUnit: "Pa" } })["ambient.pressure"]).toMatch(/barometric/);
  });

  it("refuses dates that do not exist", () => {
    expect(issues({ ...base, testedOn: "2025-02-30" })).toHaveProperty("testedOn");
    expect(issues({ ...base, testedOn: "4.3.2025" })).toHaveProperty("testedOn");
  });

  it("caps the CSV an import may send", () => {
    const r = flowTestImportSchema.safeParse({ csv: "x".repeat(1024 * 1024 + 1), test: { ...base, points: undefined } });
    expect(r.success).toBe(false);
    expect(r.error?.issues.some((i) => i.path[0] === "csv")).toBe(true);
  });
});

describe("lift-table rows", () => {
  it("tell a person typing what is missing, row by row", () => {
    const found = issues({ ...base, points: [{ lift: 2.54, flow: undefined }, { lift: undefined, flow: 3 }, { lift: -1, flow: -2 }] });
    expect(found["points.0.flow"]).toBe("Enter the flow.");
    expect(found["points.1.lift"]).toBe("Enter the lift.");
    expect(found["points.2.lift"]).toBe("Lift must be above zero.");
    expect(found["points.2.flow"]).toBe("Flow cannot be negative.");
    // One message per field, not the math's repeat of it.
    expect(allIssues({ ...base, points: [] })).toEqual(["points: Enter at least one lift point."]);
    expect(allIssues({ ...base, valveDiameter: -3 })).toEqual(["valveDiameter: Enter the valve diameter."]);
  });
});
