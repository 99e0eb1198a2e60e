/**
 * Arc geometry in the plane (RS274/NGC v3 §3.5.3). Expected values are worked by hand from
 * the circle's equation, not taken from the code.
 */
import { describe, expect, it } from "vitest";
import { arcExtent, arcFromCentre, arcFromRadius, arcPointAt, arcSegments } from "@/lib/toolpath/arc";
import { expectNear } from "./helpers";

describe("arcFromCentre", () => {
  it("a clockwise quarter from (10,0) about the origin sweeps −90°", () => {
    const { arc, problem } = arcFromCentre(10, 0, 0, -10, -10, 0, true, 0.002);
    expect(problem).toBeNull();
    expectNear(arc!.sweep, -Math.PI / 2);
    expectNear(arc!.planarLength, 5 * Math.PI);
  });
  it("start = end is a full turn in the programmed direction", () => {
    expectNear(arcFromCentre(1, 0, 1, 0, -1, 0, false, 0.002).arc!.sweep, 2 * Math.PI);
    expectNear(arcFromCentre(1, 0, 1, 0, -1, 0, true, 0.002).arc!.sweep, -2 * Math.PI);
  });
});

describe("arcFromRadius", () => {
  it("R > 0 takes the short way, R < 0 the long way round", () => {
    const short = arcFromRadius(0, 0, 10, 0, 10, false, 0.002).arc!;
    const long = arcFromRadius(0, 0, 10, 0, -10, false, 0.002).arc!;
    expectNear(short.cv, Math.sqrt(75));
    expectNear(long.cv, -Math.sqrt(75));
    expectNear(short.sweep, Math.PI / 3);
    expectNear(long.sweep, (5 * Math.PI) / 3);
  });
  it("a chord a hair longer than the diameter is a half circle without complaint", () => {
    const { arc, problem } = arcFromRadius(0, 0, 20.001, 0, 10, true, 0.002);
    expect(problem).toBeNull();
    expectNear(Math.abs(arc!.sweep), Math.PI);
  });
});

describe("arcExtent and drawing", () => {
  it("counts the quadrant points the arc passes, not just its ends", () => {
    // counter-clockwise from (10,0) to (−10,0) about the origin passes (0,10) only
    const { arc } = arcFromCentre(10, 0, -10, 0, -10, 0, false, 0.002);
    const [minU, minV, maxU, maxV] = arcExtent(arc!, 10, 0, -10, 0);
    expectNear(maxV, 10);
    expectNear(minV, 0);
    expectNear(minU, -10);
    expectNear(maxU, 10);
  });
  it("segments follow the chord tolerance and end on the end point", () => {
    const { arc } = arcFromCentre(100, 0, 100, 0, -100, 0, false, 0.002);
    const n = arcSegments(arc!, 0.005, 10_000);
    // sagitta r(1 − cos(θ/2)) ≤ 0.005 with r = 100 gives θ ≤ 0.02 rad: 2π / 0.02 ≈ 315 segments
    expect(n).toBeGreaterThanOrEqual(314);
    expect(n).toBeLessThanOrEqual(316);
    const [u, v] = arcPointAt(arc!, 1);
    expectNear(u, 100, 1e-9);
    expectNear(v, 0, 1e-9);
  });
});
