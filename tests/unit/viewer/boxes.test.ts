import { describe, expect, it } from "vitest";
import { boxEdges, machineBoxInWork, plateBox, unionBox } from "@/components/viewer/boxes";

describe("plate envelope and machine travel boxes", () => {
  it("reads the plate's stored envelope and refuses an inside-out one", () => {
    expect(plateBox({ min: { x: -50, y: -40, z: -120 }, max: { x: 50, y: 40, z: 10 } })).toEqual({ min: [-50, -40, -120], max: [50, 40, 10] });
    expect(plateBox({ min: { x: 5, y: 0, z: 0 }, max: { x: 1, y: 1, z: 1 } })).toBeNull();
    expect(plateBox(null)).toBeNull();
  });

  it("places machine travel in work coordinates: work = machine − offset (as the toolpath engine)", () => {
    const r = machineBoxInWork({ X: { min: 0, max: 600 }, Y: { min: -200, max: 200 }, Z: { min: -400, max: 0 } }, { x: 300, y: 10, z: -250 });
    expect(r.box).toEqual({ min: [-300, -210, -150], max: [300, 190, 250] });
  });

  it("says why the machine box is missing", () => {
    expect(machineBoxInWork({ X: { min: 0, max: 1 }, Y: { min: 0, max: 1 }, Z: { min: 0, max: 1 } }, null).note).toMatch(/work offset/);
    expect(machineBoxInWork({ X: { min: 0, max: 1 } }, { x: 0, y: 0, z: 0 }).note).toMatch(/travel/);
  });

  it("draws 12 axis-parallel edges whose lengths are the box sizes", () => {
    const e = boxEdges({ min: [0, 0, 0], max: [2, 3, 5] });
    expect(e.length).toBe(72);
    const lengths: number[] = [];
    for (let i = 0; i < 24; i += 2) {
      const d = [0, 1, 2].map((k) => Math.abs(e[3 * (i + 1) + k] - e[3 * i + k]));
      expect(d.filter((x) => x > 0).length).toBe(1);
      lengths.push(Math.max(...d));
    }
    expect(lengths.sort()).toEqual([2, 2, 2, 2, 3, 3, 3, 3, 5, 5, 5, 5]);
  });

  it("unites boxes, ignoring missing ones", () => {
    expect(unionBox(null, { min: [0, 0, 0], max: [1, 1, 1] }, { min: [-1, 2, 0], max: [0, 3, 4] })).toEqual({ min: [-1, 0, 0], max: [1, 3, 4] });
    expect(unionBox(null, undefined)).toBeNull();
  });
});
