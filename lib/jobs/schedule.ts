/**
 * The schedule view: planned machine time summed per machine and per week (the week the job is
 * due). Jobs still being quoted are counted apart as tentative; a job whose time is unknown is
 * listed but adds nothing, and the week says how many such jobs it holds.
 */
import type { JobState } from "@/db/enums";
import type { Plan } from "./planning";
import { isoWeekOf } from "./week";

export type ScheduleJob = {
  id: number;
  number: string;
  state: JobState;
  machineId: number | null;
  machineName: string | null;
  dueOn: string | null;
  plan: Plan;
};

export type ScheduleWeek = {
  /** "2026-W49", or "none" for jobs without a due date. */
  week: string;
  monday: string | null;
  committedS: number;
  tentativeS: number;
  unknownJobs: number;
  jobs: ScheduleJob[];
};

export type ScheduleMachine = { machineId: number | null; machineName: string; weeks: ScheduleWeek[]; totalS: number };

export const NO_MACHINE = "No machine chosen yet";

export function buildSchedule(jobs: ScheduleJob[]): ScheduleMachine[] {
  const machines = new Map<string, ScheduleMachine>();
  for (const job of jobs) {
    const mKey = job.machineId == null ? "none" : String(job.machineId);
    let machine = machines.get(mKey);
    if (!machine) {
      machine = { machineId: job.machineId, machineName: job.machineName ?? NO_MACHINE, weeks: [], totalS: 0 };
      machines.set(mKey, machine);
    }
    const iso = job.dueOn ? isoWeekOf(job.dueOn) : null;
    const wKey = iso?.label ?? "none";
    let week = machine.weeks.find((w) => w.week === wKey);
    if (!week) {
      week = { week: wKey, monday: iso?.monday ?? null, committedS: 0, tentativeS: 0, unknownJobs: 0, jobs: [] };
      machine.weeks.push(week);
    }
    week.jobs.push(job);
    if (!job.plan.known) week.unknownJobs++;
    else if (job.state === "quoted") week.tentativeS += job.plan.totalS;
    else {
      week.committedS += job.plan.totalS;
      machine.totalS += job.plan.totalS;
    }
  }
  const out = [...machines.values()];
  for (const m of out) {
    // Dated weeks in calendar order, the undated bucket last.
    m.weeks.sort((a, b) => (a.monday ?? "9999").localeCompare(b.monday ?? "9999"));
    for (const w of m.weeks) w.jobs.sort((a, b) => (a.dueOn ?? "").localeCompare(b.dueOn ?? "") || a.number.localeCompare(b.number));
  }
  // Machines by name, the "no machine" group last.
  return out.sort((a, b) => (a.machineId == null ? 1 : 0) - (b.machineId == null ? 1 : 0) || a.machineName.localeCompare(b.machineName));
}
