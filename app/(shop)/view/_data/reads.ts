/**
 * What the view pages read, in one place: a revision with its toolpath analyses and the plate and
 * machine boxes; a scan with its geometry analyses; the flow tests of a revision; the pick lists.
 * Server only (the database); the pages pass plain JSON on to the client views.
 */
import "server-only";
import type { Db } from "@/db/client";
import { getFlowTests, listFlowTests } from "@/db/queries/flow-tests";
import { getMachine, getPlate } from "@/db/queries/library";
import { getRevision, listRevisions } from "@/db/queries/programs";
import { getScan, listScans } from "@/db/queries/scans";
import type { FileView } from "@/db/queries/files";
import { seriesOf, type FlowSeries } from "@/lib/flowtests/read";
import type { SetupContext } from "@/components/viewer/types";

const ALL = { page: 1, pageSize: 200, dir: "desc" as const };

/** Files with a finished analysis first, newest first; `chosen` picks one by file id. */
export function pickAnalysed(files: FileView[], chosen?: number): FileView | null {
  const done = files.filter((f) => f.analysis?.state === "done" && f.analysis.previewFileId);
  if (chosen) return files.find((f) => f.id === chosen) ?? null;
  return done.at(-1) ?? files.at(-1) ?? null;
}

export function revisionView(db: Db, id: number) {
  const data = getRevision(db, id);
  if (!data) return null;
  const toolpaths = data.files.filter((f) => f.role === "toolpath");
  // A revision made from a scan is cut on that scan's plate and machine when it names none itself.
  const scan = data.revision.sourceScanId ? getScan(db, data.revision.sourceScanId) : undefined;
  const plateId = data.revision.plateId ?? scan?.scan.plateId ?? null;
  const machineId = data.revision.machineId ?? scan?.scan.machineId ?? null;
  const plate = plateId ? getPlate(db, plateId)?.plate : undefined;
  const machine = machineId ? getMachine(db, machineId) : undefined;
  const setup: SetupContext = {
    plateCode: plate?.code ?? null,
    plateEnvelope: plate?.envelope ?? null,
    workOffset: plate?.workOffsets?.G54 ?? null,
    machineName: machine?.name ?? null,
    machineTravel: machine?.limits.travelMm ?? null,
  };
  const setupFromScan = !data.revision.plateId && !!plate;
  return { data, toolpaths, setup, setupFromScan };
}

export function scanView(db: Db, id: number) {
  const data = getScan(db, id);
  if (!data) return null;
  return { data, clouds: data.files };
}

/** Flow curves of the tests recorded against a revision, labelled with the revision's letter. */
export function revisionFlowSeries(db: Db, revisionId: number, letter: string): FlowSeries[] {
  const ids = listFlowTests(db, { ...ALL, revisionId }).rows.map((r) => r.id);
  return getFlowTests(db, ids)
    .map((t) => seriesOf(t))
    .filter((s): s is FlowSeries => s !== null)
    .map((s) => ({ ...s, label: `${letter}: ${s.label}` }));
}

/** Everything that can be viewed: scans and revisions, with whether their analysis is done. */
export function viewerIndex(db: Db) {
  const scans = listScans(db, { ...ALL, sort: "scannedOn" }).rows;
  const revisions = listRevisions(db, { ...ALL, sort: "createdAt" }).rows;
  return { scans, revisions };
}
