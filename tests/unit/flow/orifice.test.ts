import { describe, expect, it } from "vitest";
import { compressibleFlowRatio, flowAtDensity, flowAtDepression, idealNozzleExpansibility, idealVelocity } from "@/lib/flow/orifice";
import { STANDARD_AIR } from "@/lib/flow/labels";
import { area, flow, pressure, velocity } from "@/lib/flow/units";

const inH2O = (h: number) => pressure.toSi(h, "inH2O");

describe("changing bench depression, Q ∝ √ΔP", () => {
  // domain.md §2: test depressions 28, 25, 10 inH2O are common practice; the law is the orifice equation (ISO 5167-1) [M].
  it("10 → 28 inH₂O", () => expect(flowAtDepression(250, inH2O(10), inH2O(28))).toBeCloseTo(418.33, 3)); // domain.md §2
  it("25 → 28 inH₂O", () => expect(flowAtDepression(300, inH2O(25), inH2O(28))).toBeCloseTo(317.49, 3)); // domain.md §2
  it("28 → 10 inH₂O", () => expect(flowAtDepression(280, inH2O(28), inH2O(10))).toBeCloseTo(167.332, 3)); // domain.md §2
});

describe("compressibility that the √ law neglects", () => {
  it.each([
    [10, 0.986743],
    [25, 0.966517],
    [28, 0.962422],
  ])("ideal-nozzle expansibility at %d inH₂O", (h, eps) => {
    expect(idealNozzleExpansibility(inH2O(h))).toBeCloseTo(eps, 6); // domain.md §2, ISO 5167-3 form, β → 0 [M]
  });
  it("10 → 28 inH₂O scales ideal mass flow by 1.632076, not √2.8", () => {
    expect(compressibleFlowRatio(inH2O(10), inH2O(28))).toBeCloseTo(1.632076, 6); // domain.md §2
    expect(flowAtDepression(1, inH2O(10), inH2O(28))).toBeCloseTo(1.67332, 6); // domain.md §2, √2.8
  });
  it("no depression, no effect", () => expect(idealNozzleExpansibility(0)).toBe(1));
});

describe("ideal velocity √(2ΔP/ρ) at 28 inH₂O", () => {
  it("ISO 2533 air", () => expect(idealVelocity(inH2O(28), 1.225)).toBeCloseTo(106.7095, 4)); // domain.md §3
  it("0.075 lb/ft³ air", () => {
    const v = idealVelocity(inH2O(28), STANDARD_AIR.fan075.densityKgM3);
    expect(v).toBeCloseTo(107.7532, 4); // domain.md §3
    expect(velocity.fromSi(v, "ft/min")).toBeCloseTo(21211.3, 1); // domain.md §3
  });
  it("ASHRAE standard air", () => expect(idealVelocity(inH2O(28), 1.2041)).toBeCloseTo(107.6316, 4)); // domain.md §3
  it("agrees within 0.1 % with the ventilation form V = 1096.7·√(H/ρ)", () => {
    // domain.md §3: ventilation texts print 1096.7 [M], allow ~0.1 %.
    const v = velocity.fromSi(idealVelocity(inH2O(28), STANDARD_AIR.fan075.densityKgM3), "ft/min");
    const handbook = 1096.7 * Math.sqrt(28 / 0.075);
    expect(Math.abs(v / handbook - 1)).toBeLessThan(0.001);
  });
  it("147.300 cfm per in² at 28 inH₂O, 0.075 lb/ft³", () => {
    const q = idealVelocity(inH2O(28), STANDARD_AIR.fan075.densityKgM3) * area.toSi(1, "in2");
    expect(flow.fromSi(q, "cfm")).toBeCloseTo(147.3, 3); // domain.md §3
  });
});

describe("correction to standard air", () => {
  it("denser test air passes less volume at equal depression, so the corrected flow rises", () => {
    // Q ∝ 1/√ρ at constant Cd: flow in 1.16845 kg/m³ air (domain.md §4 case) moved to 1.225 kg/m³.
    expect(flowAtDensity(200, 1.16845, 1.225)).toBeCloseTo(200 * Math.sqrt(1.16845 / 1.225), 10);
    expect(flowAtDensity(200, 1.16845, 1.225)).toBeLessThan(200);
  });
  it("is the identity at equal densities", () => expect(flowAtDensity(123.4, 1.2, 1.2)).toBe(123.4));
});

describe("the compressibility note", () => {
  it("quotes the overstatement the expansibility actually gives", async () => {
    const { COMPRESSIBILITY_NOTE } = await import("@/lib/flow/labels");
    const overstatement = (flowAtDepression(1, inH2O(10), inH2O(28)) / compressibleFlowRatio(inH2O(10), inH2O(28)) - 1) * 100;
    expect(overstatement).toBeCloseTo(2.53, 2); // domain.md §2: 1.673320 vs 1.632076
    expect(COMPRESSIBILITY_NOTE).toContain(`${overstatement.toFixed(1)} %`);
  });
});
