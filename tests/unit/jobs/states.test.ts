import { describe, expect, it } from "vitest";
import { JOB_STATES } from "@/db/enums";
import { JOB_MOVES, OPEN_JOB_STATES, isOpenJob, reasonsAgainstMove, type MoveFacts } from "@/lib/jobs/states";
import { JOB_STATE_LABEL } from "@/lib/jobs/words";

const ready: MoveFacts = {
  state: "quoted",
  machineId: 1,
  ports: [
    { port: "intake", cut: true, revisionId: 10, revisionState: "released" },
    { port: "exhaust", cut: true, revisionId: 11, revisionState: "released" },
  ],
  heads: [],
};

describe("job moves", () => {
  it("has a label in words for every state and no way out of shipped or cancelled", () => {
    for (const s of JOB_STATES) expect(JOB_STATE_LABEL[s]).toMatch(/^[A-Z][a-z ]+$/);
    expect(JOB_MOVES.shipped).toEqual([]);
    expect(JOB_MOVES.cancelled).toEqual([]);
    for (const s of OPEN_JOB_STATES) expect(JOB_MOVES[s]).toContain("cancelled");
    expect(isOpenJob("shipped")).toBe(false);
    expect(isOpenJob("in_inspection")).toBe(true);
  });

  it("schedules a job with a machine and released revisions on every cut port", () => {
    expect(reasonsAgainstMove(ready, "scheduled")).toEqual([]);
  });

  it("names each missing piece when scheduling", () => {
    const facts: MoveFacts = {
      ...ready,
      machineId: null,
      ports: [
        { port: "intake", cut: true, revisionId: null, revisionState: null },
        { port: "exhaust", cut: true, revisionId: 11, revisionState: "withdrawn" },
      ],
    };
    const reasons = reasonsAgainstMove(facts, "scheduled");
    expect(reasons).toHaveLength(3);
    expect(reasons.join(" ")).toMatch(/machine/);
    expect(reasons.join(" ")).toMatch(/released revision for the intake port/);
    expect(reasons.join(" ")).toMatch(/exhaust revision is withdrawn/);
  });

  it("ignores a port the job does not cut", () => {
    const facts: MoveFacts = { ...ready, ports: [ready.ports[0]!, { port: "exhaust", cut: false, revisionId: null, revisionState: null }] };
    expect(reasonsAgainstMove(facts, "scheduled")).toEqual([]);
  });

  it("refuses moves that are not on the map", () => {
    expect(reasonsAgainstMove(ready, "shipped")[0]).toMatch(/cannot move to shipped/);
    expect(reasonsAgainstMove({ ...ready, state: "shipped" }, "quoted")[0]).toMatch(/cannot move/);
    expect(reasonsAgainstMove(ready, "quoted")[0]).toMatch(/already/);
  });

  it("ships only with a finished head and none half-cut", () => {
    const inspecting = { ...ready, state: "in_inspection" as const };
    expect(reasonsAgainstMove({ ...inspecting, heads: [{ state: "scrapped" }] }, "shipped")).toContain("There is no finished head to ship.");
    expect(reasonsAgainstMove({ ...inspecting, heads: [{ state: "cut" }, { state: "cutting" }] }, "shipped")[0]).toMatch(/1 head is still being cut/);
    expect(reasonsAgainstMove({ ...inspecting, heads: [{ state: "cut" }, { state: "scrapped" }] }, "shipped")).toEqual([]);
  });

  it("sends a job to inspection only once a head has been cut", () => {
    const onMachine = { ...ready, state: "on_machine" as const };
    expect(reasonsAgainstMove({ ...onMachine, heads: [{ state: "received" }] }, "in_inspection")).toHaveLength(1);
    expect(reasonsAgainstMove({ ...onMachine, heads: [{ state: "cut" }] }, "in_inspection")).toEqual([]);
  });
});
