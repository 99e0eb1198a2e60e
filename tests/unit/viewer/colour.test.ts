import { describe, expect, it } from "vitest";
import { DEVIATION_RAMP, deviationColours, divergingT, hexToRgb, rampColour, rgbToHex, STATION_RAMP, stationColours, toolColour, TOOL_COLOURS } from "@/components/viewer/colour";

describe("colour scales", () => {
  it("converts hex and back", () => {
    expect(hexToRgb("#ff8000")).toEqual([1, 128 / 255, 0]);
    expect(hexToRgb("#f80")).toEqual([1, 136 / 255, 0]);
    for (const c of TOOL_COLOURS) expect(rgbToHex(hexToRgb(c))).toBe(c);
  });

  it("interpolates a ramp linearly between its stops and clamps outside", () => {
    const stops = ["#000000", "#ffffff", "#ff0000"];
    expect(rampColour(0, stops)).toEqual([0, 0, 0]);
    expect(rampColour(0.25, stops)).toEqual([0.5, 0.5, 0.5]);
    expect(rampColour(0.75, stops)).toEqual([1, 0.5, 0.5]);
    expect(rampColour(1, stops)).toEqual([1, 0, 0]);
    expect(rampColour(7, stops)).toEqual([1, 0, 0]);
    expect(rampColour(-1, stops)).toEqual([0, 0, 0]);
  });

  it("colours points by station: entry gets the first stop, the last station the last", () => {
    const c = stationColours(Uint16Array.from([0, 4, 2, 9]), 5);
    expect([...c.subarray(0, 3)]).toEqual([...Float32Array.from(hexToRgb(STATION_RAMP[0]))]);
    expect([...c.subarray(3, 6)]).toEqual([...Float32Array.from(hexToRgb(STATION_RAMP[STATION_RAMP.length - 1]))]);
    // A station index past the count (should not happen) is clamped to the last station.
    expect([...c.subarray(9, 12)]).toEqual([...c.subarray(3, 6)]);
    expect([...c.subarray(6, 9)]).toEqual([...Float32Array.from(rampColour(0.5, STATION_RAMP))]);
  });

  it("maps deviations symmetrically: 0 in the middle, ± limit at the ends", () => {
    expect(divergingT(0, 0.2)).toBe(0.5);
    expect(divergingT(0.2, 0.2)).toBe(1);
    expect(divergingT(-0.1, 0.2)).toBe(0.25);
    expect(divergingT(-5, 0.2)).toBe(0);
    expect(divergingT(Number.NaN, 0.2)).toBe(0.5);
    const c = deviationColours(Float32Array.from([-1, 0, 1]), 1);
    expect([...c.subarray(0, 3)]).toEqual([...Float32Array.from(hexToRgb(DEVIATION_RAMP[0]))]);
    expect([...c.subarray(3, 6)]).toEqual([...Float32Array.from(hexToRgb(DEVIATION_RAMP[2]))]);
  });

  it("cycles the tool palette", () => {
    expect(toolColour(0)).toBe(TOOL_COLOURS[0]);
    expect(toolColour(TOOL_COLOURS.length + 1)).toBe(TOOL_COLOURS[1]);
  });
});
