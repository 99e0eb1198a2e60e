/**
 * The one adapter from our stored records to the toolpath engine's profiles: a machine row's
 * limits become a MachineProfile, a fixture plate's envelope (and its G54 offset, when given)
 * a PlateEnvelope.
 */
import type { fixturePlates, machines } from "@/db/schema";
import type { AxisName, MachineProfile, PlateEnvelope } from "../toolpath/types";

type MachineRow = typeof machines.$inferSelect;
type PlateRow = typeof fixturePlates.$inferSelect;

const AXES: readonly AxisName[] = ["X", "Y", "Z", "A", "B", "C"];

export function machineProfileOf(m: MachineRow): MachineProfile {
  const axes = AXES.filter((a) => m.axes.toUpperCase().includes(a));
  const rapidRate: MachineProfile["rapidRate"] = {};
  for (const a of axes) {
    const rate = m.limits.rapidPerMin[a];
    if (rate != null) rapidRate[a] = rate;
  }
  const profile: MachineProfile = {
    name: m.name,
    axes,
    rapidRate,
    maxFeedMmPerMin: m.maxFeedMmMin,
    maxSpindleRpm: m.maxSpindleRpm,
    toolChangeTimeS: m.toolChangeS,
  };
  const travel = Object.fromEntries(Object.entries(m.limits.travelMm ?? {}).filter(([a, r]) => axes.includes(a as AxisName) && r));
  if (Object.keys(travel).length) profile.travelMm = travel as MachineProfile["travelMm"];
  const rotary = Object.fromEntries(Object.entries(m.limits.rotaryDeg ?? {}).filter(([a, r]) => axes.includes(a as AxisName) && r));
  if (Object.keys(rotary).length) profile.rotaryLimitsDeg = rotary as MachineProfile["rotaryLimitsDeg"];
  return profile;
}

/** The plate's safe box; `offsetCode` picks the work offset that places it on the machine. */
export function plateEnvelopeOf(p: PlateRow, offsetCode = "G54"): PlateEnvelope {
  const e = p.envelope;
  const plate: PlateEnvelope = {
    name: p.code,
    min: { X: e.min.x, Y: e.min.y, Z: e.min.z },
    max: { X: e.max.x, Y: e.max.y, Z: e.max.z },
  };
  const offset = p.workOffsets?.[offsetCode];
  if (offset && [offset.x, offset.y, offset.z].every((v) => typeof v === "number" && Number.isFinite(v))) {
    plate.workOffsetMm = { X: offset.x, Y: offset.y, Z: offset.z };
  }
  return plate;
}
