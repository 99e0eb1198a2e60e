/**
 * Colours of the 3D views: tools, the ramp along the port, the diverging deviation scale.
 * Colour never carries meaning alone: every view has a legend with numbers or words beside it.
 */

export type Rgb = [number, number, number];

export function hexToRgb(hex: string): Rgb {
  const h = hex.replace("#", "");
  const full = h.length === 3 ? h.split("").map((c) => c + c).join("") : h;
  const n = Number.parseInt(full, 16);
  return [((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255];
}

export function rgbToHex([r, g, b]: Rgb): string {
  const c = (x: number) => Math.round(Math.min(1, Math.max(0, x)) * 255).toString(16).padStart(2, "0");
  return `#${c(r)}${c(g)}${c(b)}`;
}

/** Tool colours in order of first use; chosen to stay apart on the paper background. */
export const TOOL_COLOURS = ["#b0592d", "#2f5d8a", "#2f6b3f", "#8a5a00", "#6b3f8a", "#1f7a7a", "#5a4a3a", "#a0366b"];

export function toolColour(toolIndex: number): string {
  return TOOL_COLOURS[((toolIndex % TOOL_COLOURS.length) + TOOL_COLOURS.length) % TOOL_COLOURS.length];
}

/** Colour at t ∈ [0, 1] of a ramp through evenly spaced stops (t outside is clamped). */
export function rampColour(t: number, stops: readonly string[]): Rgb {
  const rgb = stops.map(hexToRgb);
  if (rgb.length === 1 || !Number.isFinite(t)) return rgb[0];
  const x = Math.min(1, Math.max(0, t)) * (rgb.length - 1);
  const i = Math.min(rgb.length - 2, Math.floor(x));
  const f = x - i;
  const a = rgb[i];
  const b = rgb[i + 1];
  return [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f];
}

/** Entry (station 0) to valve end. */
export const STATION_RAMP = ["#2f5d8a", "#1f7a7a", "#8a7a2a", "#b0592d"] as const;

/** Negative (B inside A: less room) → no change → positive (B outside A: more room). */
export const DEVIATION_RAMP = ["#2f5d8a", "#8fb0cc", "#d9d3c8", "#dba582", "#9b2c2c"] as const;

/** Per-point colours by station index along the centerline, as an RGB Float32Array. */
export function stationColours(stations: Uint16Array, stationCount: number, stops: readonly string[] = STATION_RAMP): Float32Array {
  const out = new Float32Array(stations.length * 3);
  const last = Math.max(1, stationCount - 1);
  // A lookup table per station: the ramp is evaluated once per station, not once per point.
  const table = new Float32Array(Math.max(1, stationCount) * 3);
  for (let s = 0; s < Math.max(1, stationCount); s++) table.set(rampColour(s / last, stops), 3 * s);
  for (let i = 0; i < stations.length; i++) {
    const s = Math.min(stations[i], Math.max(0, stationCount - 1));
    out[3 * i] = table[3 * s];
    out[3 * i + 1] = table[3 * s + 1];
    out[3 * i + 2] = table[3 * s + 2];
  }
  return out;
}

/** Maps a signed value onto the diverging ramp: −limit → 0, 0 → ½, +limit → 1. */
export function divergingT(value: number, limit: number): number {
  if (!(limit > 0) || !Number.isFinite(value)) return 0.5;
  return Math.min(1, Math.max(0, 0.5 + value / (2 * limit)));
}

export function deviationColours(values: Float32Array, limit: number, stops: readonly string[] = DEVIATION_RAMP): Float32Array {
  const out = new Float32Array(values.length * 3);
  for (let i = 0; i < values.length; i++) out.set(rampColour(divergingT(values[i], limit), stops), 3 * i);
  return out;
}
