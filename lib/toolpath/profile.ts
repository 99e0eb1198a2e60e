/**
 * Machine profiles and plate envelopes: the built-in assumption used when no machine is given,
 * and checked readers for profiles that arrive as JSON (CLI files, stored records).
 */
import {
  AXIS_NAMES,
  LINEAR_AXES,
  ROTARY_AXES,
  type AxisName,
  type LinearAxis,
  type MachineProfile,
  type PlateEnvelope,
  type Range,
  type RotaryAxis,
} from "./types";

/**
 * Used for cycle time when no machine is given. Its rates are an assumption, not any real
 * machine's, and it sets no limits, so nothing is checked against it. The report names it.
 */
export const ASSUMED_MACHINE: MachineProfile = {
  name: "assumed (no machine given)",
  axes: [...AXIS_NAMES],
  rapidRate: { X: 15000, Y: 15000, Z: 15000, A: 5400, B: 5400, C: 5400 },
  toolChangeTimeS: 6,
};

export class ProfileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ProfileError";
  }
}

type Json = Record<string, unknown>;

export function parseMachineProfile(value: unknown): MachineProfile {
  const o = object(value, "machine profile");
  const axes = o.axes === undefined ? [...AXIS_NAMES] : axisList(o.axes);
  const rapidRate = o.rapidRate === undefined ? {} : positiveMap(o.rapidRate, AXIS_NAMES, "rapidRate");
  for (const axis of axes) {
    if (rapidRate[axis] === undefined) throw new ProfileError(`machine profile: rapidRate.${axis} is missing`);
  }
  const profile: MachineProfile = {
    name: typeof o.name === "string" && o.name.trim() ? o.name.trim() : "machine",
    axes,
    rapidRate,
    toolChangeTimeS: nonNegative(o.toolChangeTimeS ?? 0, "toolChangeTimeS"),
  };
  if (o.travelMm !== undefined) profile.travelMm = rangeMap(o.travelMm, LINEAR_AXES, "travelMm");
  if (o.rotaryLimitsDeg !== undefined) profile.rotaryLimitsDeg = rangeMap(o.rotaryLimitsDeg, ROTARY_AXES, "rotaryLimitsDeg");
  if (o.maxFeedMmPerMin !== undefined) profile.maxFeedMmPerMin = positive(o.maxFeedMmPerMin, "maxFeedMmPerMin");
  if (o.maxSpindleRpm !== undefined) profile.maxSpindleRpm = positive(o.maxSpindleRpm, "maxSpindleRpm");
  if (o.homeMm !== undefined) profile.homeMm = numberMap(o.homeMm, LINEAR_AXES, "homeMm");
  return profile;
}

export function parsePlateEnvelope(value: unknown): PlateEnvelope {
  const o = object(value, "plate envelope");
  const min = fullNumberMap(o.min, "min");
  const max = fullNumberMap(o.max, "max");
  for (const axis of LINEAR_AXES) {
    if (min[axis] > max[axis]) throw new ProfileError(`plate envelope: min.${axis} is above max.${axis}`);
  }
  const plate: PlateEnvelope = { min, max };
  if (typeof o.name === "string") plate.name = o.name;
  if (o.workOffsetMm !== undefined) plate.workOffsetMm = fullNumberMap(o.workOffsetMm, "workOffsetMm");
  return plate;
}

function object(value: unknown, what: string): Json {
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw new ProfileError(`${what}: expected a JSON object`);
  }
  return value as Json;
}

function finite(value: unknown, field: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) throw new ProfileError(`${field}: expected a number`);
  return value;
}

function positive(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v <= 0) throw new ProfileError(`${field}: must be above zero`);
  return v;
}

function nonNegative(value: unknown, field: string): number {
  const v = finite(value, field);
  if (v < 0) throw new ProfileError(`${field}: must not be negative`);
  return v;
}

function axisList(value: unknown): AxisName[] {
  if (!Array.isArray(value) || value.length === 0) throw new ProfileError("axes: expected a list such as [\"X\",\"Y\",\"Z\",\"A\",\"B\"]");
  return value.map((a) => {
    if (typeof a !== "string" || !AXIS_NAMES.includes(a.toUpperCase() as AxisName)) {
      throw new ProfileError(`axes: unknown axis ${JSON.stringify(a)}`);
    }
    return a.toUpperCase() as AxisName;
  });
}

function positiveMap<K extends AxisName>(value: unknown, keys: readonly K[], field: string): Partial<Record<K, number>> {
  const o = object(value, field);
  const out: Partial<Record<K, number>> = {};
  for (const [k, v] of Object.entries(o)) {
    if (!keys.includes(k as K)) throw new ProfileError(`${field}: unknown axis ${k}`);
    out[k as K] = positive(v, `${field}.${k}`);
  }
  return out;
}

function numberMap<K extends AxisName>(value: unknown, keys: readonly K[], field: string): Partial<Record<K, number>> {
  const o = object(value, field);
  const out: Partial<Record<K, number>> = {};
  for (const [k, v] of Object.entries(o)) {
    if (!keys.includes(k as K)) throw new ProfileError(`${field}: unknown axis ${k}`);
    out[k as K] = finite(v, `${field}.${k}`);
  }
  return out;
}

function rangeMap<K extends LinearAxis | RotaryAxis>(value: unknown, keys: readonly K[], field: string): Partial<Record<K, Range>> {
  const o = object(value, field);
  const out: Partial<Record<K, Range>> = {};
  for (const [k, v] of Object.entries(o)) {
    if (!keys.includes(k as K)) throw new ProfileError(`${field}: unknown axis ${k}`);
    const r = object(v, `${field}.${k}`);
    const min = finite(r.min, `${field}.${k}.min`);
    const max = finite(r.max, `${field}.${k}.max`);
    if (min > max) throw new ProfileError(`${field}.${k}: min is above max`);
    out[k as K] = { min, max };
  }
  return out;
}

function fullNumberMap(value: unknown, field: string): Record<LinearAxis, number> {
  const o = object(value, field);
  return {
    X: finite(o.X, `${field}.X`),
    Y: finite(o.Y, `${field}.Y`),
    Z: finite(o.Z, `${field}.Z`),
  };
}
