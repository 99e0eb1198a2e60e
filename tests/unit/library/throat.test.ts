import { describe, expect, it } from "vitest";
import { throatCheck } from "@/lib/library/throat";

describe("throat against the valve head", () => {
  it("gives the diameter percentage and the area percentage as its square", () => {
    // Domain reference §12 table: d = 1.800 in, 90 % throat d = 1.620 in, area 81.00 % (1.62² / 1.8²).
    const c = throatCheck("intake", 1.62 * 25.4, 1.8 * 25.4)!;
    expect(c.percentOfValve).toBeCloseTo(90, 10);
    expect(c.percentOfValveArea).toBeCloseTo(81, 10);
    // Common practice (domain §9): intake 85–90 %, so 90 % is still within.
    expect(c.verdict).toBe("within");
  });

  it("uses the exhaust guideline for exhaust ports (common practice 85–88 %)", () => {
    // 1.717 / 2.020 in = 85.0 % (domain §12 row for 2.020 in, 85 % throat).
    expect(throatCheck("exhaust", 1.717, 2.02)!.verdict).toBe("within");
    expect(throatCheck("exhaust", 1.8, 2.0)!.verdict).toBe("above"); // 90 % > 88 %
    expect(throatCheck("intake", 1.6, 2.0)!.verdict).toBe("below"); // 80 % < 85 %
  });

  it("has nothing to say without both readings", () => {
    expect(throatCheck("intake", null, 45)).toBeNull();
    expect(throatCheck("intake", 40, undefined)).toBeNull();
    expect(throatCheck("intake", 0, 45)).toBeNull();
  });
});
