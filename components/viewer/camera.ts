/**
 * Where the camera goes for each view preset. Work coordinates are Z-up (the machine's spindle
 * axis), so the camera's up vector is +Z and "top" looks straight down −Z.
 * Pure arithmetic on plain arrays; the viewer applies the result to its camera and controls.
 */

export type Vec3 = [number, number, number];
export type Box = { min: Vec3; max: Vec3 };
export type ViewPreset = "three-quarter" | "top" | "front" | "side" | "along-port";

export const VIEW_PRESETS: Array<{ id: ViewPreset; label: string }> = [
  { id: "three-quarter", label: "Three-quarter" },
  { id: "top", label: "Top" },
  { id: "front", label: "Front" },
  { id: "side", label: "Side" },
  { id: "along-port", label: "Along the port" },
];

export type CameraPlacement = { position: Vec3; target: Vec3 };

const norm = (v: Vec3): Vec3 => {
  const l = Math.hypot(v[0], v[1], v[2]) || 1;
  return [v[0] / l, v[1] / l, v[2] / l];
};

export function boxCentre(b: Box): Vec3 {
  return [(b.min[0] + b.max[0]) / 2, (b.min[1] + b.max[1]) / 2, (b.min[2] + b.max[2]) / 2];
}

export function boxRadius(b: Box): number {
  return Math.hypot(b.max[0] - b.min[0], b.max[1] - b.min[1], b.max[2] - b.min[2]) / 2;
}

/** Bounding box of xyz triples; a unit box round the origin when there are none. */
export function boundsOfPositions(positions: Float32Array): Box {
  if (positions.length < 3) return { min: [-1, -1, -1], max: [1, 1, 1] };
  const min: Vec3 = [Infinity, Infinity, Infinity];
  const max: Vec3 = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i + 2 < positions.length; i += 3) {
    for (let k = 0; k < 3; k++) {
      const v = positions[i + k];
      if (v < min[k]) min[k] = v;
      if (v > max[k]) max[k] = v;
    }
  }
  return { min, max };
}

/**
 * Distance at which a sphere of `radius` fills the view with a margin, for a perspective camera
 * of vertical field of view `fovDeg` and width/height `aspect` (the narrower angle decides).
 */
export function fitDistance(radius: number, fovDeg: number, aspect: number, margin = 1.15): number {
  const half = (fovDeg * Math.PI) / 360;
  const horizontal = Math.atan(Math.tan(half) * Math.max(aspect, 1e-3));
  const narrow = Math.min(half, horizontal);
  return (Math.max(radius, 1e-3) * margin) / Math.sin(narrow);
}

/**
 * Direction from the target to the camera for a preset. Exactly vertical directions are tilted a
 * hair, because an orbit camera with up = +Z cannot look exactly along Z (its roll is undefined).
 */
export function presetDirection(preset: ViewPreset, portAxis: Vec3 | null): Vec3 {
  let d: Vec3;
  switch (preset) {
    case "top":
      d = [0, -1e-3, 1];
      break;
    case "front":
      d = [0, -1, 0];
      break;
    case "side":
      d = [1, 0, 0];
      break;
    case "along-port":
      // Look down the port from its entry: the camera sits behind the entry, facing the exit.
      d = portAxis ? [-portAxis[0], -portAxis[1], -portAxis[2]] : [0, -1, 0];
      break;
    default:
      d = [1, -1, 0.8];
  }
  d = norm(d);
  if (Math.abs(d[2]) > 0.9995) d = norm([d[0], d[1] - 1e-3, d[2]]);
  return d;
}

export function placeCamera(preset: ViewPreset, box: Box, fovDeg: number, aspect: number, portAxis: Vec3 | null = null): CameraPlacement {
  const target = boxCentre(box);
  const dist = fitDistance(boxRadius(box), fovDeg, aspect);
  const d = presetDirection(preset, portAxis);
  return { target, position: [target[0] + d[0] * dist, target[1] + d[1] * dist, target[2] + d[2] * dist] };
}

/**
 * Direction of largest spread of a set of points (principal axis by power iteration on the
 * covariance), from at most ~`samples` evenly spaced points. A port is long along its axis, so
 * for a port's toolpath or cloud this is the port axis. Its sign is arbitrary.
 */
export function principalAxis(positions: Float32Array, samples = 20_000): Vec3 | null {
  const n = Math.floor(positions.length / 3);
  if (n < 2) return null;
  const stride = Math.max(1, Math.floor(n / samples));
  let m0 = 0;
  let m1 = 0;
  let m2 = 0;
  let count = 0;
  for (let i = 0; i < n; i += stride, count++) {
    m0 += positions[3 * i];
    m1 += positions[3 * i + 1];
    m2 += positions[3 * i + 2];
  }
  m0 /= count;
  m1 /= count;
  m2 /= count;
  const c = [0, 0, 0, 0, 0, 0]; // xx xy xz yy yz zz
  for (let i = 0; i < n; i += stride) {
    const x = positions[3 * i] - m0;
    const y = positions[3 * i + 1] - m1;
    const z = positions[3 * i + 2] - m2;
    c[0] += x * x;
    c[1] += x * y;
    c[2] += x * z;
    c[3] += y * y;
    c[4] += y * z;
    c[5] += z * z;
  }
  if (c[0] + c[3] + c[5] === 0) return null;
  let v: Vec3 = [1, 0.7, 0.4];
  for (let it = 0; it < 64; it++) {
    v = norm([c[0] * v[0] + c[1] * v[1] + c[2] * v[2], c[1] * v[0] + c[3] * v[1] + c[4] * v[2], c[2] * v[0] + c[4] * v[1] + c[5] * v[2]]);
  }
  return v;
}
