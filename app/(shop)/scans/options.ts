import { db } from "@/db/client";
import { machineOptions, masterOptions, peopleOptions, plateOptions } from "@/db/queries/library";

/** Choices for the scan form: masters handed over for digitizing, plates, machines in service. */
export function scanFormOptions() {
  return {
    masters: masterOptions(db(), { digitizable: true }),
    plates: plateOptions(db()),
    machines: machineOptions(db()).filter((m) => m.active),
    operators: peopleOptions(db(), "machinist"),
  };
}
