import { getISOWeek, getISOWeekYear, startOfISOWeek, format } from "date-fns";
import { describe, expect, it } from "vitest";
import { defaultPortsPerHead, formatHours, plannedMachineTime } from "@/lib/jobs/planning";
import { buildSchedule, NO_MACHINE, type ScheduleJob } from "@/lib/jobs/schedule";
import { isoWeekOf, parseCalendarDate } from "@/lib/jobs/week";

describe("planned machine time", () => {
  it("is cycle time × ports per head × heads for each port, plus the setup", () => {
    const plan = plannedMachineTime({
      ports: [
        { port: "intake", cycleTimeS: 742.5, revisionChosen: true },
        { port: "exhaust", cycleTimeS: 611, revisionChosen: true },
      ],
      portsPerHead: 4,
      heads: 6,
      setupMinutes: 75,
    });
    expect(plan.known).toBe(true);
    if (!plan.known) return;
    expect(plan.perPortS.intake).toBeCloseTo(742.5 * 4 * 6, 9);
    expect(plan.perPortS.exhaust).toBeCloseTo(611 * 4 * 6, 9);
    expect(plan.setupS).toBe(75 * 60);
    expect(plan.totalS).toBeCloseTo((742.5 + 611) * 4 * 6 + 75 * 60, 9);
  });

  it("scales linearly with heads (one more head adds one head's cutting)", () => {
    const at = (heads: number) => plannedMachineTime({ ports: [{ port: "intake", cycleTimeS: 300, revisionChosen: true }], portsPerHead: 3, heads, setupMinutes: 30 });
    const a = at(2);
    const b = at(3);
    if (!a.known || !b.known) throw new Error("expected known plans");
    expect(b.totalS - a.totalS).toBeCloseTo(300 * 3, 9);
  });

  it("says why the figure is unknown instead of undercounting", () => {
    expect(plannedMachineTime({ ports: [], portsPerHead: 4, heads: 1, setupMinutes: 0 })).toEqual({ known: false, reason: "no_ports", ports: [] });
    expect(
      plannedMachineTime({ ports: [{ port: "intake", cycleTimeS: null, revisionChosen: false }, { port: "exhaust", cycleTimeS: 10, revisionChosen: true }], portsPerHead: 4, heads: 1, setupMinutes: 0 }),
    ).toEqual({ known: false, reason: "no_revision", ports: ["intake"] });
    expect(
      plannedMachineTime({ ports: [{ port: "intake", cycleTimeS: 10, revisionChosen: true }, { port: "exhaust", cycleTimeS: null, revisionChosen: true }], portsPerHead: 4, heads: 1, setupMinutes: 0 }),
    ).toEqual({ known: false, reason: "not_analysed", ports: ["exhaust"] });
  });

  it("derives ports per head: one per cylinder on the casting, half the engine's on a vee or flat engine", () => {
    expect(defaultPortsPerHead({ cylinders: 8, engineFamily: "Tarrow 5.8 pushrod V8" })).toBe(4);
    expect(defaultPortsPerHead({ cylinders: 6, engineFamily: "Flat six, air-cooled" })).toBe(3);
    expect(defaultPortsPerHead({ cylinders: 4, engineFamily: "Brisk 2.0 twin-cam four" })).toBe(4);
    expect(defaultPortsPerHead({ cylinders: 1, engineFamily: "single" })).toBe(1);
  });

  it("formats hours and minutes", () => {
    expect(formatHours(3725)).toBe("1 h 02 min");
    expect(formatHours(59 * 60)).toBe("59 min");
  });
});

describe("ISO weeks", () => {
  it("agrees with date-fns (a general-purpose date library) across year boundaries", () => {
    // ISO 8601 week rules, checked against date-fns' implementation over three years of days.
    const start = Date.UTC(2025, 11, 20);
    for (let i = 0; i < 3 * 366; i += 1) {
      const d = new Date(start + i * 86_400_000);
      const text = d.toISOString().slice(0, 10);
      const local = new Date(`${text}T12:00:00`);
      const week = isoWeekOf(text)!;
      expect(week.week).toBe(getISOWeek(local));
      expect(week.year).toBe(getISOWeekYear(local));
      expect(week.monday).toBe(format(startOfISOWeek(local), "yyyy-MM-dd"));
    }
  });

  it("knows the edge cases by heart too: 1 Jan 2027 (a Friday) is in week 53 of 2026", () => {
    expect(isoWeekOf("2027-01-01")!.label).toBe("2026-W53");
    expect(isoWeekOf("2024-12-30")!.label).toBe("2025-W01");
  });

  it("refuses dates that do not exist", () => {
    expect(parseCalendarDate("2026-02-30")).toBeNull();
    expect(isoWeekOf("2026-13-01")).toBeNull();
    expect(isoWeekOf("soon")).toBeNull();
  });
});

describe("the schedule", () => {
  const job = (over: Partial<ScheduleJob>): ScheduleJob => ({
    id: 1,
    number: "J-1",
    state: "scheduled",
    machineId: 1,
    machineName: "Cell 2",
    dueOn: "2026-12-09",
    plan: { known: true, totalS: 3600, cuttingS: 3000, setupS: 600, perPortS: {} },
    ...over,
  });

  it("sums planned time per machine and due week, quoting apart, unknowns counted", () => {
    const machines = buildSchedule([
      job({ id: 1, number: "J-1" }),
      job({ id: 2, number: "J-2", dueOn: "2026-12-11", plan: { known: true, totalS: 1800, cuttingS: 1800, setupS: 0, perPortS: {} } }),
      job({ id: 3, number: "J-3", state: "quoted", dueOn: "2026-12-10" }),
      job({ id: 4, number: "J-4", plan: { known: false, reason: "not_analysed", ports: ["intake"] } }),
      job({ id: 5, number: "J-5", dueOn: "2026-12-16" }),
      job({ id: 6, number: "J-6", dueOn: null }),
      job({ id: 7, number: "J-7", machineId: null, machineName: null }),
    ]);
    expect(machines.map((m) => m.machineName)).toEqual(["Cell 2", NO_MACHINE]);
    const cell = machines[0]!;
    expect(cell.weeks.map((w) => w.week)).toEqual(["2026-W50", "2026-W51", "none"]);
    const w50 = cell.weeks[0]!;
    expect(w50.committedS).toBe(3600 + 1800);
    expect(w50.tentativeS).toBe(3600);
    expect(w50.unknownJobs).toBe(1);
    expect(w50.jobs.map((j) => j.number)).toEqual(["J-1", "J-4", "J-3", "J-2"]);
    expect(cell.totalS).toBe(3600 + 1800 + 3600 + 3600);
  });
});
