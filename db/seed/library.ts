/**
 * The invented shop's library: castings of invented engine families with plausible sizes,
 * a 5-axis machine, and a fixture plate per casting. None of these are real products.
 */
import type { Db } from "../client";
import { fixturePlates, headTypes, machines } from "../schema";

const inch = (v: number) => Math.round(v * 25.4 * 100) / 100;

export const DEMO_HEAD_TYPES = [
  {
    castingNumber: "HL-4471-A",
    engineFamily: "Tarrow 5.8 pushrod V8",
    cylinders: 8,
    valvesPerCylinder: 2,
    boreMm: inch(4.0),
    strokeMm: inch(3.48),
    intakeValveMm: inch(2.02),
    exhaustValveMm: inch(1.6),
    intakeSeatIdMm: inch(1.82),
    exhaustSeatIdMm: inch(1.4),
    notes: "Cathedral intake; water jacket close under the short side on cylinders 3 and 6.",
  },
  {
    castingNumber: "HL-2205-K",
    engineFamily: "Brisk 2.0 twin-cam four",
    cylinders: 4,
    valvesPerCylinder: 4,
    boreMm: 86.0,
    strokeMm: 86.0,
    intakeValveMm: 34.5,
    exhaustValveMm: 29.0,
    intakeSeatIdMm: 31.0,
    exhaustSeatIdMm: 25.5,
    notes: "Siamesed intake runners; thin floor at the divider.",
  },
  {
    castingNumber: "HL-9032-R",
    engineFamily: "Ordway 7.0 big-bore V8",
    cylinders: 8,
    valvesPerCylinder: 2,
    boreMm: inch(4.25),
    strokeMm: inch(4.0),
    intakeValveMm: inch(2.2),
    exhaustValveMm: inch(1.75),
    intakeSeatIdMm: inch(1.98),
    exhaustSeatIdMm: inch(1.53),
    notes: "Rectangular intake; pushrod pinch on the outboard wall.",
  },
];

export function seedLibrary(db: Db) {
  const headTypeIds = DEMO_HEAD_TYPES.map((h) => db.insert(headTypes).values(h).returning({ id: headTypes.id }).get().id);
  const machine = db
    .insert(machines)
    .values({
      name: "Cell 2 — five-axis trunnion",
      description: "Vertical machining centre with a tilting trunnion (A) and rotary table (B).",
      axes: "XYZAB",
      limits: {
        travelMm: { X: { min: -380, max: 380 }, Y: { min: -250, max: 250 }, Z: { min: -450, max: 50 } },
        rotaryDeg: { A: { min: -120, max: 120 }, B: { min: -360, max: 360 } },
        rapidPerMin: { X: 36000, Y: 36000, Z: 30000, A: 9000, B: 12000 },
      },
      maxFeedMmMin: 12000,
      maxSpindleRpm: 24000,
      toolChangeS: 6,
      notes: "Guard interlocks checked every shift. Eye protection inside the yellow line.",
    })
    .returning({ id: machines.id })
    .get().id;
  const plateIds = headTypeIds.map(
    (headTypeId, i) =>
      db
        .insert(fixturePlates)
        .values({
          code: `FP-${DEMO_HEAD_TYPES[i].castingNumber.split("-")[1]}`,
          headTypeId,
          datumDescription: "Two 12 mm dowels in the deck face, head clamped deck-down; datum at the left dowel centre.",
          workOffsets: { G54: { x: -152.4, y: 0, z: -210.0 } },
          portAxisAngles: { intake: { a: -38, b: 0 }, exhaust: { a: -24, b: 180 } },
          // A safe box that holds the ports' sweep and the retract height of the generated programs.
          envelope: { min: { x: -40, y: -60, z: -110 }, max: { x: 110, y: 60, z: 110 } },
          notes: "Check the dowel bores for burrs before every load.",
        })
        .returning({ id: fixturePlates.id })
        .get().id,
  );
  return { headTypeIds, machineId: machine, plateIds };
}
