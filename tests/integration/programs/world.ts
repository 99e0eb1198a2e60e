/**
 * A small invented shop for the integration tests, built through the verbs themselves: one
 * casting, plate, machine, master (handed over), scan, program and a draft revision.
 */
import type { Db } from "@/db/client";
import { createHeadType } from "@/lib/library/head-types";
import { createMachine } from "@/lib/library/machines";
import { createMaster, moveMaster } from "@/lib/library/masters";
import { createPlate } from "@/lib/library/plates";
import { createScan } from "@/lib/library/scans";
import type { Mailer } from "@/lib/mail";
import { createProgram } from "@/lib/programs/programs";
import { createRevision } from "@/lib/programs/revisions";
import type { TestUser } from "../support/app";

let seq = 0;

/** A Mailer that only records: for verb calls whose notices are not under test. */
export function recordingMailer(): Mailer & { sent: Array<{ to: string | string[]; subject: string }> } {
  const sent: Array<{ to: string | string[]; subject: string }> = [];
  return {
    config: { host: "none", port: 0, secure: false, from: "t@test.invalid", connectTimeoutMs: 1 },
    sent,
    async send(mail) {
      sent.push({ to: mail.to, subject: mail.subject });
      return { messageId: String(sent.length), accepted: [String(mail.to)] };
    },
    async check() {
      return { ok: true };
    },
    close() {},
  };
}

export const machineInput = (name: string) => ({
  name,
  description: "test cell",
  axes: "XYZAB",
  limits: {
    travelMm: { X: { min: -400, max: 400 }, Y: { min: -300, max: 300 }, Z: { min: -500, max: 100 } },
    rotaryDeg: { A: { min: -120, max: 30 } },
    rapidPerMin: { X: 30000, Y: 30000, Z: 30000, A: 9000, B: 12000 },
  },
  maxFeedMmMin: 12000,
  maxSpindleRpm: 30000,
  toolChangeS: 6,
  notes: "",
});

export async function buildWorld(db: Db, people: { admin: TestUser; porter: TestUser; machinist: TestUser }) {
  seq++;
  const actor = (u: TestUser) => ({ id: u.id, email: u.email, name: u.name, role: u.role });
  const headType = createHeadType(db, actor(people.admin), {
    castingNumber: `TT-${seq}00-X`,
    engineFamily: "Test twin",
    cylinders: 2,
    valvesPerCylinder: 2,
    boreMm: 90,
    strokeMm: 80,
    intakeValveMm: 45,
    exhaustValveMm: 38,
    intakeSeatIdMm: 40,
    exhaustSeatIdMm: 33,
  });
  const plate = createPlate(db, actor(people.admin), {
    code: `FP-T${seq}`,
    headTypeId: headType.id,
    datumDescription: "two dowels",
    workOffsets: [{ code: "G54", x: -150, y: 0, z: -250 }],
    envelope: { min: { x: -100, y: -100, z: -150 }, max: { x: 100, y: 100, z: 150 } },
  });
  const machine = createMachine(db, actor(people.admin), machineInput(`Test cell ${seq}`));
  const master = createMaster(db, actor(people.porter), { label: `M-T${seq}`, headTypeId: headType.id });
  await moveMaster(db, actor(people.porter), master.id, { to: "ready_to_digitize" }, { mailer: recordingMailer() });
  const scan = createScan(db, actor(people.machinist), {
    masterId: master.id,
    plateId: plate.id,
    machineId: machine.id,
    port: "intake",
    stylusDiameterMm: 2,
    pointSpacingMm: 0.3,
    scannedOn: "2026-11-20",
  });
  const program = createProgram(db, actor(people.machinist), { headTypeId: headType.id, port: "intake", name: `Street intake ${seq}` });
  const revision = createRevision(db, actor(people.machinist), program.id, { sourceScanId: scan.id, changeNote: "first cut of the program" });
  return { headType, plate, machine, master, scan, program, revision };
}
