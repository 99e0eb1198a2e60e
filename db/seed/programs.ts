/**
 * The invented shop's library in motion: masters at each stage, scans with generated point
 * clouds, and programs whose revisions carry generated multi-tool 5-axis toolpaths — all
 * uploaded to the local bucket and analysed by the real engines, so the demo shows real figures.
 * Labels are fixed: the flow and jobs steps after this one look them up.
 */
import { eq } from "drizzle-orm";
import type { Db } from "../client";
import { fixturePlates, headTypes, machines, users, type Role } from "../schema";
import { runAnalysis } from "@/lib/analysis/runner";
import type { Actor } from "@/lib/auth/guard";
import { intakePortShape, sampleTubeCloud } from "@/lib/geometry/generate";
import { writePly } from "@/lib/geometry/writers";
import { createMaster, moveMaster } from "@/lib/library/masters";
import { createScan } from "@/lib/library/scans";
import type { Mailer } from "@/lib/mail";
import { createProgram } from "@/lib/programs/programs";
import { createRevision, moveRevision, releaseRevision } from "@/lib/programs/revisions";
import { storage, type Storage } from "@/lib/storage";
import { generatePortProgram } from "@/lib/toolpath";
import { ingestFile } from "@/lib/uploads/ingest";
import { DEMO_USERS } from "./people";

type Ctx = { people: Record<Role, number>; library: { headTypeIds: number[]; machineId: number; plateIds: number[] } };

/** The demo's notices are not sent: the inbox should hold only what a person does in the demo. */
const quietMailer: Mailer = {
  config: { host: "none", port: 0, secure: false, from: "seed@portolan.invalid", connectTimeoutMs: 1 },
  send: async () => ({ messageId: "seed", accepted: [] }),
  check: async () => ({ ok: true }),
  close: () => undefined,
};

function actor(db: Db, id: number): Actor {
  const u = db.select({ id: users.id, email: users.email, name: users.name, role: users.role }).from(users).where(eq(users.id, id)).get();
  if (!u) throw new Error(`seed: user ${id} is missing`);
  return u;
}

const passwordOf = (role: Role) => DEMO_USERS.find((u) => u.role === role)!.password;

async function analyse(db: Db, store: Storage, analysisId: number, what: string) {
  const out = await runAnalysis(db, store, analysisId);
  if (out.state !== "done") throw new Error(`seed: the analysis of ${what} failed: ${out.error}`);
}

async function addToolpath(db: Db, store: Storage, who: Actor, revisionId: number, fileName: string, opts: { port: "intake" | "exhaust"; seed: number; lines: number }) {
  const { analysisId } = await ingestFile(db, store, who, { kind: "toolpath", fileName, revisionId, source: generatePortProgram({ lines: opts.lines, tools: 3, seed: opts.seed, port: opts.port }) });
  await analyse(db, store, analysisId, fileName);
}

// Runner entries wider than the throat, so the smallest section sits at the throat as in a real port.
async function addCloud(db: Db, store: Storage, who: Actor, scanId: number, fileName: string, shape: Parameters<typeof intakePortShape>[0], seed: number) {
  const cloud = sampleTubeCloud(intakePortShape(shape), { points: 240_000, seed, noiseMm: 0.01 });
  const { analysisId } = await ingestFile(db, store, who, { kind: "point_cloud", fileName, scanId, source: writePly({ positions: cloud.positions, count: cloud.count }) });
  await analyse(db, store, analysisId, fileName);
}

export async function seedPrograms(db: Db, ctx: Ctx, store: Storage = storage()): Promise<void> {
  const porter = actor(db, ctx.people.porter);
  const machinist = actor(db, ctx.people.machinist);
  const lead = actor(db, ctx.people.lead);
  const opts = { mailer: quietMailer };
  const [ht4471, ht2205, ht9032] = ctx.library.headTypeIds;
  const [plate4471, , plate9032] = ctx.library.plateIds;

  const valves = db.select().from(headTypes).where(eq(headTypes.id, ht4471)).get()!;

  // ── HL-4471-A: a digitized master, its scans, and two programs in production ──
  const m4471 = createMaster(db, porter, {
    label: "M-4471-01",
    headTypeId: ht4471,
    porterId: porter.id,
    startedOn: "2025-01-20",
    finishedOn: "2025-02-18",
    handPortNotes: {
      intake: "Opened the bowl under the seat, laid back the short-side turn by about 2 mm, blended the guide boss to a knife edge; roof left alone. Cylinders 3 and 6 kept 1 mm shy under the short side (water jacket).",
      exhaust: "Cleaned the bowl, straightened the floor, radiused the short side; guide boss trimmed flush.",
    },
    measurements: {
      intake: { throatMm: 45.2, seatIdMm: 46.2, portVolumeCc: 196, shortSideNote: "Laid back ~2 mm; checked 3.1 mm wall on cyl 3 by ultrasound." },
      exhaust: { throatMm: 35.0, seatIdMm: 35.6, portVolumeCc: 88, shortSideNote: "Radiused, 2.5 mm radius gauge." },
    },
    notes: "Master for the street program; bench-tested on 2025-02-20.",
  });
  await moveMaster(db, porter, m4471.id, { to: "ready_to_digitize" }, opts);
  const scanIn = createScan(db, machinist, { masterId: m4471.id, plateId: plate4471, machineId: ctx.library.machineId, port: "intake", stylusDiameterMm: 2, pointSpacingMm: 0.25, scannedOn: "2025-02-24", notes: "Cylinder 1 intake; stylus calibrated on the ring gauge before the run." });
  const scanEx = createScan(db, machinist, { masterId: m4471.id, plateId: plate4471, machineId: ctx.library.machineId, port: "exhaust", stylusDiameterMm: 2, pointSpacingMm: 0.25, scannedOn: "2025-02-25", notes: "Cylinder 1 exhaust." });
  await addCloud(db, store, machinist, scanIn.id, "M-4471-01 intake cyl1.ply", { valveDiameterMm: valves.intakeValveMm, throatPercent: 88, bendDeg: 68, entryWidthMm: 54, entryHeightMm: 44 }, 41);
  await addCloud(db, store, machinist, scanEx.id, "M-4471-01 exhaust cyl1.ply", { valveDiameterMm: valves.exhaustValveMm, throatPercent: 86, bendDeg: 55, entryWidthMm: 42, entryHeightMm: 35, runnerMm: 30 }, 42);

  const streetIn = createProgram(db, machinist, { headTypeId: ht4471, port: "intake", name: "Street intake", notes: "Street/strip port for the 5.8 pushrod V8." });
  const inA = createRevision(db, machinist, streetIn.id, { sourceScanId: scanIn.id, changeNote: "First program from scan of M-4471-01; roughing with the 10 mm ball, finish with the 6 mm lollipop." });
  await addToolpath(db, store, machinist, inA.id, "4471 street intake A.nc", { port: "intake", seed: 101, lines: 100_000 });
  await moveRevision(db, machinist, inA.id, { to: "proving" }, opts);
  await releaseRevision(db, lead, inA.id, { password: passwordOf("lead"), overrideReason: "First-article port measured within 0.05 mm of the master; bench was being recalibrated that week." }, opts);

  const inB = createRevision(db, machinist, streetIn.id, { parentId: inA.id, sourceScanId: scanIn.id, changeNote: "Short-side pass moved 0.4 mm away from the water jacket on cylinders 3 and 6; finer stepover in the bowl." });
  await addToolpath(db, store, machinist, inB.id, "4471 street intake B.nc", { port: "intake", seed: 102, lines: 110_000 });
  await moveRevision(db, machinist, inB.id, { to: "proving" }, opts);
  await releaseRevision(db, lead, inB.id, { password: passwordOf("lead"), overrideReason: "Flows within 1 % of A on the first cut; bench sheets are being entered." }, opts);

  const streetEx = createProgram(db, machinist, { headTypeId: ht4471, port: "exhaust", name: "Street exhaust" });
  const exA = createRevision(db, machinist, streetEx.id, { sourceScanId: scanEx.id, changeNote: "First exhaust program from scan of M-4471-01." });
  await addToolpath(db, store, machinist, exA.id, "4471 street exhaust A.nc", { port: "exhaust", seed: 201, lines: 90_000 });
  await moveRevision(db, machinist, exA.id, { to: "proving" }, opts);
  await releaseRevision(db, lead, exA.id, { password: passwordOf("lead"), overrideReason: "Exhaust follows the master within 0.05 mm at every checked station." }, opts);

  // ── HL-2205-K: a master waiting for the machinists ──
  const m2205 = createMaster(db, porter, {
    label: "M-2205-01",
    headTypeId: ht2205,
    porterId: porter.id,
    startedOn: "2025-03-03",
    handPortNotes: { intake: "Siamesed runners: divider sharpened, floor left thick (thin casting there)." },
    measurements: { intake: { throatMm: 30.2, portVolumeCc: 141 } },
  });
  await moveMaster(db, porter, m2205.id, { to: "ready_to_digitize" }, opts);

  // ── HL-9032-R: a master still on the bench, and a race program being proven ──
  createMaster(db, porter, {
    label: "M-9032-01",
    headTypeId: ht9032,
    porterId: porter.id,
    startedOn: "2025-03-10",
    handPortNotes: { intake: "Roughed the bowl; pushrod pinch still to do on the outboard wall." },
    measurements: {},
  });
  const race = createProgram(db, machinist, { headTypeId: ht9032, port: "intake", name: "Race intake" });
  const raceA = createRevision(db, machinist, race.id, { plateId: plate9032, machineId: ctx.library.machineId, changeNote: "Race port carried over from the previous casting's program; to be proven on a scrap head." });
  await addToolpath(db, store, machinist, raceA.id, "9032 race intake A.nc", { port: "intake", seed: 301, lines: 80_000 });
  await moveRevision(db, machinist, raceA.id, { to: "proving" }, opts);
}
