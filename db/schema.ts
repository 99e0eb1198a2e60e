/**
 * Portolan's records. One SQLite file; every table here is reachable through Drizzle so a
 * larger shop can move to PostgreSQL by configuration and a regenerated migration.
 *
 * Conventions: integer ids; times as unix epoch milliseconds (`ms`); lengths in mm, angles in
 * degrees, flow in cfm at the test's own depression unless a column says otherwise;
 * JSON columns hold small structured values validated by zod at the edges.
 */
import { sql } from "drizzle-orm";
import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import {
  ANALYSIS_STATES,
  CUT_OUTCOMES,
  FILE_KINDS,
  FILE_STATES,
  FLOW_SUBJECTS,
  HEAD_SOURCES,
  JOB_STATES,
  MASTER_STAGES,
  PORTS,
  REVISION_STATES,
  ROLES,
  type Port,
} from "./enums";

export * from "./enums";



const ms = (name: string) => integer(name, { mode: "number" });
const createdAt = () => ms("created_at").notNull().default(sql`(unixepoch('subsec') * 1000)`);
const updatedAt = () => ms("updated_at").notNull().default(sql`(unixepoch('subsec') * 1000)`);

// ─── People and sign-in ──────────────────────────────────────────────────────

export const users = sqliteTable("users", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  role: text("role", { enum: ROLES }).notNull(),
  /** Null until the invitation is accepted. */
  passwordHash: text("password_hash"),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  /** Bumped on deactivation, role change and password change: older sessions stop working. */
  sessionVersion: integer("session_version").notNull().default(1),
  lastSignInAt: ms("last_sign_in_at"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const invitations = sqliteTable(
  "invitations",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    email: text("email").notNull(),
    role: text("role", { enum: ROLES }).notNull(),
    /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
    tokenHash: text("token_hash").notNull().unique(),
    invitedById: integer("invited_by_id").references(() => users.id),
    expiresAt: ms("expires_at").notNull(),
    acceptedAt: ms("accepted_at"),
    revokedAt: ms("revoked_at"),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_email_idx").on(t.email)],
);

export const passwordResets = sqliteTable("password_resets", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  userId: integer("user_id")
    .notNull()
    .references(() => users.id),
  tokenHash: text("token_hash").notNull().unique(),
  expiresAt: ms("expires_at").notNull(),
  usedAt: ms("used_at"),
  createdAt: createdAt(),
});

/** Every sign-in attempt, for throttling (per account and per address) and for the auditor. */
export const signInAttempts = sqliteTable(
  "sign_in_attempts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    email: text("email").notNull(),
    ip: text("ip").notNull(),
    succeeded: integer("succeeded", { mode: "boolean" }).notNull(),
    at: ms("at").notNull(),
  },
  (t) => [index("sign_in_attempts_email_at_idx").on(t.email, t.at), index("sign_in_attempts_ip_at_idx").on(t.ip, t.at)],
);

// ─── Audit trail (append-only, hash-chained; triggers in a custom migration) ─

export const auditEvents = sqliteTable(
  "audit_events",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: ms("at").notNull(),
    actorId: integer("actor_id"),
    actorEmail: text("actor_email").notNull(),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id"),
    before: text("before", { mode: "json" }),
    after: text("after", { mode: "json" }),
    /** Hash of the previous event ("" for the first). */
    prevHash: text("prev_hash").notNull(),
    /** SHA-256 over prevHash and this event's canonical content. */
    hash: text("hash").notNull().unique(),
  },
  (t) => [index("audit_events_entity_idx").on(t.entity, t.entityId), index("audit_events_at_idx").on(t.at)],
);

// ─── Shop library ────────────────────────────────────────────────────────────

export const headTypes = sqliteTable("head_types", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  castingNumber: text("casting_number").notNull().unique(),
  engineFamily: text("engine_family").notNull(),
  cylinders: integer("cylinders").notNull(),
  valvesPerCylinder: integer("valves_per_cylinder").notNull(),
  boreMm: real("bore_mm").notNull(),
  strokeMm: real("stroke_mm").notNull(),
  intakeValveMm: real("intake_valve_mm").notNull(),
  exhaustValveMm: real("exhaust_valve_mm").notNull(),
  intakeSeatIdMm: real("intake_seat_id_mm"),
  exhaustSeatIdMm: real("exhaust_seat_id_mm"),
  notes: text("notes").notNull().default(""),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

/** Travel and rate limits; the toolpath engine's machine profile is built from these. */
export type MachineLimits = {
  travelMm: Partial<Record<"X" | "Y" | "Z", { min: number; max: number }>>;
  rotaryDeg: Partial<Record<"A" | "B" | "C", { min: number; max: number }>>;
  rapidPerMin: Partial<Record<"X" | "Y" | "Z" | "A" | "B" | "C", number>>;
};

export const machines = sqliteTable("machines", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  name: text("name").notNull().unique(),
  description: text("description").notNull().default(""),
  /** Axis letters present, e.g. "XYZAB". */
  axes: text("axes").notNull(),
  limits: text("limits", { mode: "json" }).$type<MachineLimits>().notNull(),
  maxFeedMmMin: real("max_feed_mm_min").notNull(),
  maxSpindleRpm: real("max_spindle_rpm").notNull(),
  toolChangeS: real("tool_change_s").notNull(),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  notes: text("notes").notNull().default(""),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export type Box = { min: { x: number; y: number; z: number }; max: { x: number; y: number; z: number } };

export const fixturePlates = sqliteTable("fixture_plates", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  code: text("code").notNull().unique(),
  headTypeId: integer("head_type_id")
    .notNull()
    .references(() => headTypes.id),
  datumDescription: text("datum_description").notNull().default(""),
  /** e.g. { "G54": { x, y, z, a?, b? } } */
  workOffsets: text("work_offsets", { mode: "json" }).$type<Record<string, Record<string, number>>>().notNull(),
  /** Port-axis angles per port, degrees. */
  portAxisAngles: text("port_axis_angles", { mode: "json" }).$type<Record<string, { a?: number; b?: number }>>().notNull(),
  /** The safe envelope in work coordinates, checked against every toolpath on this plate. */
  envelope: text("envelope", { mode: "json" }).$type<Box>().notNull(),
  notes: text("notes").notNull().default(""),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});


export type HandPortNotes = Partial<Record<Port, string>>;
export type HandMeasurements = Partial<
  Record<Port, { throatMm?: number; seatIdMm?: number; portVolumeCc?: number; shortSideNote?: string }>
>;

export const masterHeads = sqliteTable(
  "master_heads",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    label: text("label").notNull().unique(),
    headTypeId: integer("head_type_id")
      .notNull()
      .references(() => headTypes.id),
    porterId: integer("porter_id").references(() => users.id),
    stage: text("stage", { enum: MASTER_STAGES }).notNull().default("hand_porting"),
    startedOn: text("started_on"),
    finishedOn: text("finished_on"),
    handPortNotes: text("hand_port_notes", { mode: "json" }).$type<HandPortNotes>().notNull(),
    measurements: text("measurements", { mode: "json" }).$type<HandMeasurements>().notNull(),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("master_heads_stage_idx").on(t.stage)],
);

// ─── Stored files and their analyses ────────────────────────────────────────


export const storedFiles = sqliteTable(
  "stored_files",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    kind: text("kind", { enum: FILE_KINDS }).notNull(),
    /** Our key in the bucket (ids and hashes), never the client's filename. */
    storageKey: text("storage_key").notNull().unique(),
    originalName: text("original_name").notNull(),
    contentType: text("content_type").notNull().default("application/octet-stream"),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256"),
    state: text("state", { enum: FILE_STATES }).notNull().default("uploading"),
    /** Multipart upload id while the browser is still sending parts. */
    uploadId: text("upload_id"),
    uploadedById: integer("uploaded_by_id").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("stored_files_state_idx").on(t.state)],
);


export const analyses = sqliteTable(
  "analyses",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    fileId: integer("file_id")
      .notNull()
      .references(() => storedFiles.id),
    engine: text("engine", { enum: ["toolpath", "geometry"] }).notNull(),
    state: text("state", { enum: ANALYSIS_STATES }).notNull().default("queued"),
    /** 0..1 */
    progress: real("progress").notNull().default(0),
    result: text("result", { mode: "json" }),
    previewFileId: integer("preview_file_id").references(() => storedFiles.id),
    error: text("error"),
    startedAt: ms("started_at"),
    finishedAt: ms("finished_at"),
    createdAt: createdAt(),
  },
  (t) => [index("analyses_file_idx").on(t.fileId)],
);

/** Photos and documents attached to a record (master head, plate, scan, revision, head). */
export const attachments = sqliteTable(
  "attachments",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    entity: text("entity").notNull(),
    entityId: integer("entity_id").notNull(),
    fileId: integer("file_id")
      .notNull()
      .references(() => storedFiles.id),
    caption: text("caption").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("attachments_entity_idx").on(t.entity, t.entityId)],
);

// ─── Digitizing ─────────────────────────────────────────────────────────────

export const scans = sqliteTable(
  "scans",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    masterId: integer("master_id")
      .notNull()
      .references(() => masterHeads.id),
    plateId: integer("plate_id")
      .notNull()
      .references(() => fixturePlates.id),
    machineId: integer("machine_id")
      .notNull()
      .references(() => machines.id),
    port: text("port", { enum: PORTS }).notNull(),
    operatorId: integer("operator_id").references(() => users.id),
    stylusDiameterMm: real("stylus_diameter_mm").notNull(),
    pointSpacingMm: real("point_spacing_mm").notNull(),
    scannedOn: text("scanned_on").notNull(),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("scans_master_idx").on(t.masterId)],
);

export const scanFiles = sqliteTable("scan_files", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  scanId: integer("scan_id")
    .notNull()
    .references(() => scans.id),
  fileId: integer("file_id")
    .notNull()
    .references(() => storedFiles.id),
});

// ─── Programs and revisions ─────────────────────────────────────────────────

export const programs = sqliteTable(
  "programs",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    headTypeId: integer("head_type_id")
      .notNull()
      .references(() => headTypes.id),
    port: text("port", { enum: PORTS }).notNull(),
    name: text("name").notNull(),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("programs_head_port_name_idx").on(t.headTypeId, t.port, t.name)],
);


export const revisions = sqliteTable(
  "revisions",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    programId: integer("program_id")
      .notNull()
      .references(() => programs.id),
    /** A, B, C … AA, AB … */
    letter: text("letter").notNull(),
    parentId: integer("parent_id"),
    sourceScanId: integer("source_scan_id").references(() => scans.id),
    plateId: integer("plate_id").references(() => fixturePlates.id),
    machineId: integer("machine_id").references(() => machines.id),
    changeNote: text("change_note").notNull().default(""),
    state: text("state", { enum: REVISION_STATES }).notNull().default("draft"),
    createdById: integer("created_by_id").references(() => users.id),
    releasedById: integer("released_by_id").references(() => users.id),
    releasedAt: ms("released_at"),
    /** Hash binding the releasing user, time and file checksums (the signature). */
    releaseSignature: text("release_signature"),
    releaseOverrideReason: text("release_override_reason"),
    endReason: text("end_reason"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("revisions_program_letter_idx").on(t.programId, t.letter), index("revisions_state_idx").on(t.state)],
);

export const revisionFiles = sqliteTable("revision_files", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  revisionId: integer("revision_id")
    .notNull()
    .references(() => revisions.id),
  fileId: integer("file_id")
    .notNull()
    .references(() => storedFiles.id),
  role: text("role", { enum: ["toolpath", "setup_sheet"] }).notNull(),
});

export const revisionMoves = sqliteTable("revision_moves", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  revisionId: integer("revision_id")
    .notNull()
    .references(() => revisions.id),
  fromState: text("from_state"),
  toState: text("to_state").notNull(),
  byId: integer("by_id").references(() => users.id),
  at: ms("at").notNull(),
  note: text("note").notNull().default(""),
});

// ─── Customers, jobs, heads and cuts ────────────────────────────────────────

export const customers = sqliteTable("customers", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  name: text("name").notNull(),
  contactName: text("contact_name").notNull().default(""),
  email: text("email").notNull().default(""),
  phone: text("phone").notNull().default(""),
  address: text("address").notNull().default(""),
  notes: text("notes").notNull().default(""),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});


export const jobs = sqliteTable(
  "jobs",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    number: text("number").notNull().unique(),
    customerId: integer("customer_id")
      .notNull()
      .references(() => customers.id),
    headTypeId: integer("head_type_id")
      .notNull()
      .references(() => headTypes.id),
    quantity: integer("quantity").notNull(),
    cutIntake: integer("cut_intake", { mode: "boolean" }).notNull().default(true),
    cutExhaust: integer("cut_exhaust", { mode: "boolean" }).notNull().default(true),
    intakeRevisionId: integer("intake_revision_id").references(() => revisions.id),
    exhaustRevisionId: integer("exhaust_revision_id").references(() => revisions.id),
    machineId: integer("machine_id").references(() => machines.id),
    dueOn: text("due_on"),
    setupMinutes: real("setup_minutes").notNull().default(60),
    /** Ports of each kind cut on one head (one per cylinder on that casting, usually); null = derive from the head type. */
    portsPerHead: integer("ports_per_head"),
    state: text("state", { enum: JOB_STATES }).notNull().default("quoted"),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("jobs_state_idx").on(t.state)],
);


export const heads = sqliteTable(
  "heads",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: integer("job_id").references(() => jobs.id),
    headTypeId: integer("head_type_id")
      .notNull()
      .references(() => headTypes.id),
    serial: text("serial").notNull().unique(),
    castingNumber: text("casting_number").notNull(),
    source: text("source", { enum: HEAD_SOURCES }).notNull(),
    incomingNotes: text("incoming_notes").notNull().default(""),
    state: text("state", { enum: ["received", "cutting", "cut", "scrapped", "shipped"] })
      .notNull()
      .default("received"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("heads_job_idx").on(t.jobId)],
);


export const cuts = sqliteTable(
  "cuts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    headId: integer("head_id")
      .notNull()
      .references(() => heads.id),
    jobId: integer("job_id")
      .notNull()
      .references(() => jobs.id),
    port: text("port", { enum: PORTS }).notNull(),
    cylinder: integer("cylinder"),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => revisions.id),
    /** The toolpath file's checksum when the head was cut (frozen). */
    toolpathSha256: text("toolpath_sha256").notNull(),
    machineId: integer("machine_id")
      .notNull()
      .references(() => machines.id),
    operatorId: integer("operator_id")
      .notNull()
      .references(() => users.id),
    startedAt: ms("started_at").notNull(),
    endedAt: ms("ended_at"),
    outcome: text("outcome", { enum: CUT_OUTCOMES }).notNull(),
    reason: text("reason"),
    notes: text("notes").notNull().default(""),
    flowTestId: integer("flow_test_id"),
    createdAt: createdAt(),
  },
  (t) => [index("cuts_head_idx").on(t.headId), index("cuts_revision_idx").on(t.revisionId)],
);

export const machineTokens = sqliteTable("machine_tokens", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  machineId: integer("machine_id")
    .notNull()
    .references(() => machines.id),
  label: text("label").notNull(),
  tokenHash: text("token_hash").notNull().unique(),
  createdById: integer("created_by_id").references(() => users.id),
  lastUsedAt: ms("last_used_at"),
  revokedAt: ms("revoked_at"),
  createdAt: createdAt(),
});

// ─── Flow bench ─────────────────────────────────────────────────────────────


export const flowTests = sqliteTable(
  "flow_tests",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    subject: text("subject", { enum: FLOW_SUBJECTS }).notNull(),
    headTypeId: integer("head_type_id")
      .notNull()
      .references(() => headTypes.id),
    masterId: integer("master_id").references(() => masterHeads.id),
    revisionId: integer("revision_id").references(() => revisions.id),
    headId: integer("head_id").references(() => heads.id),
    port: text("port", { enum: PORTS }).notNull(),
    cylinder: integer("cylinder"),
    portNumber: integer("port_number"),
    depressionInH2O: real("depression_in_h2o").notNull(),
    tempC: real("temp_c"),
    baroKpa: real("baro_kpa"),
    rhPct: real("rh_pct"),
    valveDiameterMm: real("valve_diameter_mm").notNull(),
    seatIdMm: real("seat_id_mm"),
    minSectionMm2: real("min_section_mm2"),
    entryRadius: integer("entry_radius", { mode: "boolean" }).notNull().default(false),
    exhaustPipe: integer("exhaust_pipe", { mode: "boolean" }).notNull().default(false),
    operatorId: integer("operator_id").references(() => users.id),
    testedOn: text("tested_on").notNull(),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("flow_tests_revision_idx").on(t.revisionId), index("flow_tests_master_idx").on(t.masterId)],
);

export const flowPoints = sqliteTable(
  "flow_points",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    flowTestId: integer("flow_test_id")
      .notNull()
      .references(() => flowTests.id, { onDelete: "cascade" }),
    liftMm: real("lift_mm").notNull(),
    /** Measured at the test's depression. */
    flowCfm: real("flow_cfm").notNull(),
  },
  (t) => [index("flow_points_test_idx").on(t.flowTestId)],
);
