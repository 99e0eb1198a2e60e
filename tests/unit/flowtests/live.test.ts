import { describe, expect, it } from "vitest";
import { computeFlowTest } from "@/lib/flow";
import { liveFlowFigures } from "@/lib/flowtests/live";

describe("live computed columns in the entry form", () => {
  it("hands each computed point back to its own row, whatever the row order", () => {
    const live = liveFlowFigures({
      valveDiameter: 45.72,
      depression: 28,
      points: [
        { lift: 7.62, flow: 176 },
        { lift: 2.54, flow: 68 },
        { lift: 5.08, flow: 128.5 },
      ],
    });
    expect(live.result).not.toBeNull();
    expect(live.byRow.map((p) => p?.liftMm)).toEqual([7.62, 2.54, 5.08]);
    // Same figure as the math on the whole test (standard air, at 28″ so the flow is unchanged).
    const whole = computeFlowTest({ valveDiameter: 45.72, depression: 28, points: [{ lift: 2.54, flow: 68 }] });
    expect(live.byRow[1]!.cdValve).toBeCloseTo(whole.points[0].cdValve, 12);
  });

  it("skips rows still being typed and repeated lifts instead of blocking the others", () => {
    const live = liveFlowFigures({
      valveDiameter: 45.72,
      depression: 28,
      points: [{ lift: 2.54, flow: 68 }, { lift: undefined, flow: 90 }, { lift: 2.54, flow: 70 }, null, { lift: 5.08, flow: Number.NaN }],
    });
    expect(live.byRow.map((p) => (p ? p.flowCfm : null))).toEqual([68, null, null, null, null]);
  });

  it("says what it waits for", () => {
    expect(liveFlowFigures({ depression: 28, points: [{ lift: 1, flow: 2 }] }).waitingFor).toEqual(["Enter the valve diameter."]);
    expect(liveFlowFigures({ valveDiameter: 40, depression: 28, points: [] }).waitingFor[0]).toMatch(/lift points/);
    // A lift larger than the valve: the math's own message comes through.
    expect(liveFlowFigures({ valveDiameter: 40, depression: 28, points: [{ lift: 50, flow: 2 }] }).waitingFor[0]).toMatch(/larger than the valve/);
  });

  it("uses the air readings only when both temperature and pressure are there", () => {
    const base = { valveDiameter: 45.72, depression: 28, points: [{ lift: 5, flow: 120 }] };
    expect(liveFlowFigures({ ...base, ambient: { temperature: 30 } }).result!.densitySource).toBe("standard-air");
    expect(liveFlowFigures({ ...base, ambient: { temperature: 30, pressure: 98 } }).result!.densitySource).toBe("ambient");
  });
});
