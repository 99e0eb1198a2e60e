/** Scans (digitizing runs): the table, the detail with files and geometry, form choices. */
import { aliasedTable, and, count, eq, like, or, sql, type SQL } from "drizzle-orm";
import type { Db } from "../client";
import { fixturePlates, headTypes, machines, masterHeads, scanFiles, scans, users, type Port } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { filesWithAnalyses } from "./files";
import { attachmentsOf } from "./library";
import { likePattern, offsetFor, orderFor } from "./paging";

export type ScanListRow = {
  id: number;
  masterId: number;
  masterLabel: string;
  castingNumber: string;
  port: Port;
  plateCode: string;
  machineName: string;
  operatorName: string | null;
  stylusDiameterMm: number;
  pointSpacingMm: number;
  scannedOn: string;
  fileCount: number;
  analysisState: string | null;
};

const fileCount = sql<number>`(SELECT count(*) FROM scan_files sf WHERE sf.scan_id = ${scans.id})`;
const analysisState = sql<string | null>`(SELECT a.state FROM scan_files sf JOIN analyses a ON a.file_id = sf.file_id WHERE sf.scan_id = ${scans.id} ORDER BY a.id DESC LIMIT 1)`;

export function listScans(db: Db, query: TableQuery & { masterId?: number }): Page<ScanListRow> {
  const operator = aliasedTable(users, "operator");
  const conds: SQL[] = [];
  if (query.q) conds.push(or(like(masterHeads.label, likePattern(query.q)), like(headTypes.castingNumber, likePattern(query.q)), like(fixturePlates.code, likePattern(query.q)))!);
  if (query.masterId) conds.push(eq(scans.masterId, query.masterId));
  const where = conds.length ? and(...conds) : undefined;
  const sortable = { id: scans.id, masterLabel: masterHeads.label, castingNumber: headTypes.castingNumber, port: scans.port, plateCode: fixturePlates.code, machineName: machines.name, operatorName: operator.name, scannedOn: scans.scannedOn, stylusDiameterMm: scans.stylusDiameterMm, pointSpacingMm: scans.pointSpacingMm, fileCount };
  const base = db
    .select({
      id: scans.id,
      masterId: scans.masterId,
      masterLabel: masterHeads.label,
      castingNumber: headTypes.castingNumber,
      port: scans.port,
      plateCode: fixturePlates.code,
      machineName: machines.name,
      operatorName: operator.name,
      stylusDiameterMm: scans.stylusDiameterMm,
      pointSpacingMm: scans.pointSpacingMm,
      scannedOn: scans.scannedOn,
      fileCount,
      analysisState,
    })
    .from(scans)
    .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .innerJoin(fixturePlates, eq(fixturePlates.id, scans.plateId))
    .innerJoin(machines, eq(machines.id, scans.machineId))
    .leftJoin(operator, eq(operator.id, scans.operatorId));
  const rows = base.where(where).orderBy(...orderFor(query, sortable, "scannedOn")).limit(query.pageSize).offset(offsetFor(query)).all();
  const total = db
    .select({ n: count() })
    .from(scans)
    .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .innerJoin(fixturePlates, eq(fixturePlates.id, scans.plateId))
    .where(where)
    .get()!.n;
  return pageOf(rows as ScanListRow[], total, query);
}

export function getScan(db: Db, id: number) {
  const operator = aliasedTable(users, "operator");
  const row = db
    .select({ scan: scans, master: masterHeads, headType: headTypes, plateCode: fixturePlates.code, machineName: machines.name, operatorName: operator.name })
    .from(scans)
    .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
    .innerJoin(headTypes, eq(headTypes.id, masterHeads.headTypeId))
    .innerJoin(fixturePlates, eq(fixturePlates.id, scans.plateId))
    .innerJoin(machines, eq(machines.id, scans.machineId))
    .leftJoin(operator, eq(operator.id, scans.operatorId))
    .where(eq(scans.id, id))
    .get();
  if (!row) return undefined;
  const fileIds = db.select({ fileId: scanFiles.fileId }).from(scanFiles).where(eq(scanFiles.scanId, id)).all().map((r) => r.fileId);
  return { ...row, files: filesWithAnalyses(db, fileIds), photos: attachmentsOf(db, "scan", id) };
}

/** Scans a revision may name as its source: same casting and port. */
export function scanOptions(db: Db, filter: { headTypeId?: number; port?: Port } = {}) {
  const conds: SQL[] = [];
  if (filter.headTypeId) conds.push(eq(masterHeads.headTypeId, filter.headTypeId));
  if (filter.port) conds.push(eq(scans.port, filter.port));
  return db
    .select({ id: scans.id, masterLabel: masterHeads.label, port: scans.port, scannedOn: scans.scannedOn, plateId: scans.plateId, machineId: scans.machineId })
    .from(scans)
    .innerJoin(masterHeads, eq(masterHeads.id, scans.masterId))
    .where(conds.length ? and(...conds) : undefined)
    .orderBy(scans.id)
    .all();
}
