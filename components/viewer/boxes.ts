/**
 * The two boxes drawn round a toolpath: the fixture plate's safe envelope (stored in work
 * coordinates) and the machine's travel (stored in machine coordinates). Travel is placed in work
 * coordinates with the plate's work offset (machine = work + offset, as the toolpath engine does);
 * without an offset the machine box cannot be placed and is not drawn (the legend says why).
 */
import type { Vec3 } from "./camera";

export type AxisBox = { min: Vec3; max: Vec3 };
type Range = { min: number; max: number };

export function plateBox(envelope: { min: { x: number; y: number; z: number }; max: { x: number; y: number; z: number } } | null | undefined): AxisBox | null {
  if (!envelope) return null;
  const min: Vec3 = [envelope.min.x, envelope.min.y, envelope.min.z];
  const max: Vec3 = [envelope.max.x, envelope.max.y, envelope.max.z];
  if (![...min, ...max].every(Number.isFinite) || min.some((v, k) => v > max[k])) return null;
  return { min, max };
}

export type MachineBoxResult = { box: AxisBox; note: null } | { box: null; note: string };

export function machineBoxInWork(
  travelMm: Partial<Record<"X" | "Y" | "Z", Range>> | null | undefined,
  workOffset: { x?: number; y?: number; z?: number } | null | undefined,
): MachineBoxResult {
  const axes = ["X", "Y", "Z"] as const;
  if (!travelMm || axes.some((a) => !travelMm[a])) return { box: null, note: "The machine record has no travel for all of X, Y and Z." };
  const off = workOffset ? [workOffset.x, workOffset.y, workOffset.z] : [];
  if (off.length !== 3 || !off.every((v) => typeof v === "number" && Number.isFinite(v))) {
    return { box: null, note: "The plate has no G54 work offset, so the machine's travel cannot be placed around the program." };
  }
  const o = off as number[];
  return {
    box: {
      min: [travelMm.X!.min - o[0], travelMm.Y!.min - o[1], travelMm.Z!.min - o[2]],
      max: [travelMm.X!.max - o[0], travelMm.Y!.max - o[1], travelMm.Z!.max - o[2]],
    },
    note: null,
  };
}

/** The 12 edges of a box as 24 xyz points, for one line-segments object. */
export function boxEdges(b: AxisBox): Float32Array {
  const [x0, y0, z0] = b.min;
  const [x1, y1, z1] = b.max;
  const c: Vec3[] = [
    [x0, y0, z0],
    [x1, y0, z0],
    [x1, y1, z0],
    [x0, y1, z0],
    [x0, y0, z1],
    [x1, y0, z1],
    [x1, y1, z1],
    [x0, y1, z1],
  ];
  const pairs = [0, 1, 1, 2, 2, 3, 3, 0, 4, 5, 5, 6, 6, 7, 7, 4, 0, 4, 1, 5, 2, 6, 3, 7];
  const out = new Float32Array(pairs.length * 3);
  pairs.forEach((p, i) => out.set(c[p], 3 * i));
  return out;
}

/** Smallest box holding all the given boxes (null entries ignored). */
export function unionBox(...boxes: Array<AxisBox | null | undefined>): AxisBox | null {
  const real = boxes.filter((b): b is AxisBox => !!b);
  if (real.length === 0) return null;
  const min: Vec3 = [Infinity, Infinity, Infinity];
  const max: Vec3 = [-Infinity, -Infinity, -Infinity];
  for (const b of real) {
    for (let k = 0; k < 3; k++) {
      min[k] = Math.min(min[k], b.min[k]);
      max[k] = Math.max(max[k], b.max[k]);
    }
  }
  return { min, max };
}
