import { db } from "@/db/client";
import { machineOptions, plateOptions } from "@/db/queries/library";
import { revisionOptions } from "@/db/queries/programs";
import { scanOptions } from "@/db/queries/scans";
import type { Port } from "@/db/enums";

/** Choices for a revision of this program: its revisions, scans and plates of its casting and port. */
export function revisionFormOptions(program: { id: number; headTypeId: number; port: Port }) {
  return {
    revisions: revisionOptions(db(), program.id),
    scans: scanOptions(db(), { headTypeId: program.headTypeId, port: program.port }),
    plates: plateOptions(db()).filter((p) => p.headTypeId === program.headTypeId),
    machines: machineOptions(db()).filter((m) => m.active),
  };
}
