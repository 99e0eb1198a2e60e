import { describe, expect, it } from "vitest";
import { circleArea, curtainArea, flowCoefficient, idealFlow, liftOverDiameter, meanSectionVelocity } from "@/lib/flow/valve";
import { STANDARD_AIR } from "@/lib/flow/labels";
import { area, flow, length, pressure } from "@/lib/flow/units";

const inch = (v: number) => length.toSi(v, "in");
const D = inch(1.8);
const rho075 = STANDARD_AIR.fan075.densityKgM3;
const dp28 = pressure.toSi(28, "inH2O");
const q220 = flow.toSi(220, "cfm");

// Check values: domain.md §5 (D = 1.80 in; 220 cfm at 28 inH2O, 0.075 lb/ft³) and §12.
describe("valve areas", () => {
  it("curtain equals valve-head area at L/D = 0.25", () => {
    expect(liftOverDiameter(inch(0.45), D)).toBeCloseTo(0.25, 12);
    expect(area.fromSi(curtainArea(D, inch(0.45)), "in2")).toBeCloseTo(2.54469, 5); // domain.md §5
    expect(area.fromSi(circleArea(D), "in2")).toBeCloseTo(2.54469, 5); // domain.md §5
    expect(area.fromSi(circleArea(D), "mm2")).toBeCloseTo(1641.73, 2); // domain.md §5
  });
  it("curtain area at 0.300 in", () => expect(area.fromSi(curtainArea(D, inch(0.3)), "in2")).toBeCloseTo(1.69646, 5)); // domain.md §5
  it.each([
    [2.02, 3.20474],
    [2.055, 3.31676],
    [1.6, 2.01062],
  ])("circle of %f in", (d, a) => expect(area.fromSi(circleArea(inch(d)), "in2")).toBeCloseTo(a, 5)); // domain.md §12
});

describe("flow coefficient Cd = Q / (A·√(2ΔP/ρ))", () => {
  it("ideal flow through the valve-head area", () => {
    expect(flow.fromSi(idealFlow(circleArea(D), dp28, rho075), "cfm")).toBeCloseTo(374.834, 3); // domain.md §5
  });
  it("on the valve-head area", () => expect(flowCoefficient(q220, circleArea(D), dp28, rho075)).toBeCloseTo(0.58693, 5)); // domain.md §5
  it("on a 90 % throat", () => expect(flowCoefficient(q220, circleArea(inch(1.62)), dp28, rho075)).toBeCloseTo(0.7246, 5)); // domain.md §5
  it("on the curtain at 0.300 in", () => expect(flowCoefficient(q220, curtainArea(D, inch(0.3)), dp28, rho075)).toBeCloseTo(0.88039, 5)); // domain.md §5
  it("does not depend on the depression when flow follows √ΔP", () => {
    const at10 = flowCoefficient(q220 * Math.sqrt(10 / 28), circleArea(D), pressure.toSi(10, "inH2O"), rho075);
    expect(at10).toBeCloseTo(0.58693, 5);
  });
});

describe("mean section velocity", () => {
  it("is flow over area", () => expect(meanSectionVelocity(0.1, 0.002)).toBeCloseTo(50, 12));
});
