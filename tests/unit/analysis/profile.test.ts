import { describe, expect, it } from "vitest";
import { machineProfileOf, plateEnvelopeOf } from "@/lib/analysis/profile";
import { parseMachineProfile, parsePlateEnvelope } from "@/lib/toolpath";

const machine = {
  id: 1,
  name: "Cell 9",
  description: "",
  axes: "XYZAB",
  limits: {
    travelMm: { X: { min: -300, max: 300 }, Y: { min: -200, max: 200 }, Z: { min: -400, max: 0 } },
    rotaryDeg: { A: { min: -110, max: 20 }, C: { min: 0, max: 1 } },
    rapidPerMin: { X: 30000, Y: 30000, Z: 24000, A: 7200, B: 9000, C: 100 },
  },
  maxFeedMmMin: 10000,
  maxSpindleRpm: 15000,
  toolChangeS: 5,
  active: true,
  notes: "",
  createdAt: 0,
  updatedAt: 0,
};

describe("machine profile adapter", () => {
  it("maps limits, rates and times, and keeps only the machine's axes", () => {
    const p = machineProfileOf(machine);
    expect(p.axes).toEqual(["X", "Y", "Z", "A", "B"]);
    expect(p.travelMm).toEqual(machine.limits.travelMm);
    expect(p.rotaryLimitsDeg).toEqual({ A: { min: -110, max: 20 } }); // B is continuous, C absent
    expect(p.rapidRate).toEqual({ X: 30000, Y: 30000, Z: 24000, A: 7200, B: 9000 });
    expect(p).toMatchObject({ name: "Cell 9", maxFeedMmPerMin: 10000, maxSpindleRpm: 15000, toolChangeTimeS: 5 });
  });

  it("produces what the toolpath engine's own reader accepts unchanged", () => {
    const p = machineProfileOf(machine);
    expect(parseMachineProfile(JSON.parse(JSON.stringify(p)))).toEqual(p);
  });
});

describe("plate envelope adapter", () => {
  const plate = {
    id: 2,
    code: "FP-1",
    headTypeId: 1,
    datumDescription: "",
    workOffsets: { G54: { x: -150, y: 2.5, z: -210 } },
    portAxisAngles: {},
    envelope: { min: { x: -60, y: -45, z: -120 }, max: { x: 60, y: 45, z: 40 } },
    notes: "",
    createdAt: 0,
    updatedAt: 0,
  };

  it("turns the stored box and G54 into the engine's envelope", () => {
    const e = plateEnvelopeOf(plate);
    expect(e).toEqual({ name: "FP-1", min: { X: -60, Y: -45, Z: -120 }, max: { X: 60, Y: 45, Z: 40 }, workOffsetMm: { X: -150, Y: 2.5, Z: -210 } });
    expect(parsePlateEnvelope(JSON.parse(JSON.stringify(e)))).toEqual(e);
  });

  it("leaves the work offset out when the plate has none for that code", () => {
    expect(plateEnvelopeOf(plate, "G55").workOffsetMm).toBeUndefined();
  });
});
