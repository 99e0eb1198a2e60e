/** Fixed vocabularies of the records, as plain constants (importable by browser code). */
export const ROLES = ["porter", "machinist", "lead", "auditor", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const PORTS = ["intake", "exhaust"] as const;
export type Port = (typeof PORTS)[number];

export const MASTER_STAGES = ["hand_porting", "ready_to_digitize", "digitized", "retired"] as const;
export type MasterStage = (typeof MASTER_STAGES)[number];

export const FILE_KINDS = ["toolpath", "point_cloud", "photo", "setup_sheet", "toolpath_preview", "cloud_preview"] as const;
export type FileKind = (typeof FILE_KINDS)[number];
export const FILE_STATES = ["uploading", "stored", "failed"] as const;

export const ANALYSIS_STATES = ["queued", "running", "done", "failed"] as const;

export const REVISION_STATES = ["draft", "proving", "released", "superseded", "withdrawn"] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

export const JOB_STATES = ["quoted", "scheduled", "on_machine", "in_inspection", "shipped", "cancelled"] as const;
export type JobState = (typeof JOB_STATES)[number];

export const HEAD_SOURCES = ["customer_core", "shop_stock"] as const;
export const CUT_OUTCOMES = ["good", "rework", "scrap"] as const;
export const FLOW_SUBJECTS = ["master", "revision", "head", "baseline"] as const;
