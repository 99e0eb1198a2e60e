/**
 * The recall list of a revision: every head cut with it, whom it belongs to and how to reach
 * them, and the cut's frozen checksum next to the revision's, so a reader sees at once whether
 * the program that cut the head is the one on record.
 */
import type { RecallRow } from "@/db/queries/trace";
import { CUT_OUTCOME_LABEL, HEAD_SOURCE_LABEL, HEAD_STATE_LABEL, JOB_STATE_LABEL, PORT_LABEL, type HeadState } from "../jobs/words";
import type { JobState } from "@/db/enums";
import type { CsvColumn } from "./csv";

const iso = (ms: number | null) => (ms == null ? "" : new Date(ms).toISOString().replace(".000Z", "Z"));

export function recallColumns(revision: { label: string; sha256: string | null }): CsvColumn<RecallRow>[] {
  return [
    { header: "revision", value: () => revision.label },
    { header: "head_serial", value: (r) => r.headSerial },
    { header: "casting_number", value: (r) => r.castingNumber },
    { header: "head_source", value: (r) => HEAD_SOURCE_LABEL[r.headSource as keyof typeof HEAD_SOURCE_LABEL] ?? r.headSource },
    { header: "head_state", value: (r) => HEAD_STATE_LABEL[r.headState as HeadState] ?? r.headState },
    { header: "port", value: (r) => PORT_LABEL[r.port] },
    { header: "cylinder", value: (r) => r.cylinder },
    { header: "cut_started_utc", value: (r) => iso(r.cutAt) },
    { header: "cut_ended_utc", value: (r) => iso(r.endedAt) },
    { header: "outcome", value: (r) => CUT_OUTCOME_LABEL[r.outcome] },
    { header: "reason", value: (r) => r.reason },
    { header: "machine", value: (r) => r.machineName },
    { header: "operator", value: (r) => r.operatorName },
    { header: "job_number", value: (r) => r.jobNumber },
    { header: "job_state", value: (r) => JOB_STATE_LABEL[r.jobState as JobState] ?? r.jobState },
    { header: "customer", value: (r) => r.customerName },
    { header: "contact", value: (r) => r.contactName },
    { header: "email", value: (r) => r.customerEmail },
    { header: "phone", value: (r) => r.customerPhone },
    { header: "toolpath_sha256_at_cut", value: (r) => r.toolpathSha256 },
    { header: "matches_revision_file", value: (r) => (revision.sha256 == null ? "unknown" : r.toolpathSha256 === revision.sha256 ? "yes" : "NO") },
    { header: "cut_id", value: (r) => r.cutId },
  ];
}

/** `recall-street-intake-B-2026-12-04.csv` */
export function recallFileName(label: string, now = Date.now()): string {
  return `recall-${label.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "")}-${new Date(now).toISOString().slice(0, 10)}.csv`;
}
