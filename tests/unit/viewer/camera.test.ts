import { describe, expect, it } from "vitest";
import { boundsOfPositions, boxCentre, boxRadius, fitDistance, placeCamera, presetDirection, principalAxis, VIEW_PRESETS } from "@/components/viewer/camera";

const len = (v: number[]) => Math.hypot(v[0], v[1], v[2]);

describe("camera placement for the view presets", () => {
  it("fits a sphere: distance = r / sin(half angle) (trigonometry), the narrower angle decides", () => {
    expect(fitDistance(1, 90, 1, 1)).toBeCloseTo(Math.SQRT2, 12);
    // Portrait: the horizontal half-angle atan(tan 45° · 0.5) is narrower.
    expect(fitDistance(1, 90, 0.5, 1)).toBeCloseTo(1 / Math.sin(Math.atan(0.5)), 12);
    expect(fitDistance(2, 60, 2, 1.15)).toBeCloseTo((2 * 1.15) / Math.sin(Math.PI / 6), 12);
  });

  it("gives unit directions; top looks down Z, front from −Y, side from +X", () => {
    for (const { id } of VIEW_PRESETS) expect(len(presetDirection(id, [0, 0, 1]))).toBeCloseTo(1, 12);
    expect(presetDirection("top", null)[2]).toBeGreaterThan(0.999);
    expect(presetDirection("front", null)).toEqual([0, -1, 0]);
    expect(presetDirection("side", null)).toEqual([1, 0, 0]);
    // Along the port: the camera sits behind the entry, i.e. opposite the axis.
    const d = presetDirection("along-port", [1, 0, 0]);
    expect(d[0]).toBeCloseTo(-1, 12);
    // A vertical port axis is tilted a hair so the orbit camera keeps a defined roll.
    expect(Math.abs(presetDirection("along-port", [0, 0, 1])[2])).toBeLessThan(1);
  });

  it("places the camera at the fit distance from the box centre", () => {
    const box = { min: [0, 0, 0] as [number, number, number], max: [10, 20, 30] as [number, number, number] };
    const c = placeCamera("front", box, 45, 1.5);
    expect(c.target).toEqual(boxCentre(box));
    const dist = len([c.position[0] - c.target[0], c.position[1] - c.target[1], c.position[2] - c.target[2]]);
    expect(dist).toBeCloseTo(fitDistance(boxRadius(box), 45, 1.5), 9);
    expect(c.position[1]).toBeLessThan(c.target[1]);
  });

  it("finds the long axis of points spread along a line", () => {
    const n = 500;
    const p = new Float32Array(3 * n);
    for (let i = 0; i < n; i++) {
      const t = i - n / 2;
      // Along (1, 2, 2)/3 with a small sideways wobble.
      p.set([t / 3 + 0.3 * Math.sin(i), (2 * t) / 3 - 0.3 * Math.cos(i), (2 * t) / 3 + 0.2 * Math.sin(3 * i)], 3 * i);
    }
    const a = principalAxis(p)!;
    const dot = Math.abs(a[0] / 3 + (2 * a[1]) / 3 + (2 * a[2]) / 3);
    expect(dot).toBeGreaterThan(0.999);
    expect(principalAxis(new Float32Array(3))).toBeNull();
  });

  it("bounds xyz triples", () => {
    expect(boundsOfPositions(Float32Array.from([1, 5, -2, -3, 4, 8]))).toEqual({ min: [-3, 4, -2], max: [1, 5, 8] });
  });
});
