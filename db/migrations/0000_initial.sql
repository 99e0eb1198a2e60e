CREATE TABLE `analyses` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`file_id` integer NOT NULL,
	`engine` text NOT NULL,
	`state` text DEFAULT 'queued' NOT NULL,
	`progress` real DEFAULT 0 NOT NULL,
	`result` text,
	`preview_file_id` integer,
	`error` text,
	`started_at` integer,
	`finished_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`file_id`) REFERENCES `stored_files`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`preview_file_id`) REFERENCES `stored_files`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `analyses_file_idx` ON `analyses` (`file_id`);--> statement-breakpoint
CREATE TABLE `attachments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`entity` text NOT NULL,
	`entity_id` integer NOT NULL,
	`file_id` integer NOT NULL,
	`caption` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`file_id`) REFERENCES `stored_files`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `attachments_entity_idx` ON `attachments` (`entity`,`entity_id`);--> statement-breakpoint
CREATE TABLE `audit_events` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`at` integer NOT NULL,
	`actor_id` integer,
	`actor_email` text NOT NULL,
	`action` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text,
	`before` text,
	`after` text,
	`prev_hash` text NOT NULL,
	`hash` text NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `audit_events_hash_unique` ON `audit_events` (`hash`);--> statement-breakpoint
CREATE INDEX `audit_events_entity_idx` ON `audit_events` (`entity`,`entity_id`);--> statement-breakpoint
CREATE INDEX `audit_events_at_idx` ON `audit_events` (`at`);--> statement-breakpoint
CREATE TABLE `customers` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`contact_name` text DEFAULT '' NOT NULL,
	`email` text DEFAULT '' NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`address` text DEFAULT '' NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `cuts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`head_id` integer NOT NULL,
	`job_id` integer NOT NULL,
	`port` text NOT NULL,
	`cylinder` integer,
	`revision_id` integer NOT NULL,
	`toolpath_sha256` text NOT NULL,
	`machine_id` integer NOT NULL,
	`operator_id` integer NOT NULL,
	`started_at` integer NOT NULL,
	`ended_at` integer,
	`outcome` text NOT NULL,
	`reason` text,
	`notes` text DEFAULT '' NOT NULL,
	`flow_test_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`head_id`) REFERENCES `heads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`operator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `cuts_head_idx` ON `cuts` (`head_id`);--> statement-breakpoint
CREATE INDEX `cuts_revision_idx` ON `cuts` (`revision_id`);--> statement-breakpoint
CREATE TABLE `fixture_plates` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`code` text NOT NULL,
	`head_type_id` integer NOT NULL,
	`datum_description` text DEFAULT '' NOT NULL,
	`work_offsets` text NOT NULL,
	`port_axis_angles` text NOT NULL,
	`envelope` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `fixture_plates_code_unique` ON `fixture_plates` (`code`);--> statement-breakpoint
CREATE TABLE `flow_points` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`flow_test_id` integer NOT NULL,
	`lift_mm` real NOT NULL,
	`flow_cfm` real NOT NULL,
	FOREIGN KEY (`flow_test_id`) REFERENCES `flow_tests`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `flow_points_test_idx` ON `flow_points` (`flow_test_id`);--> statement-breakpoint
CREATE TABLE `flow_tests` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`subject` text NOT NULL,
	`head_type_id` integer NOT NULL,
	`master_id` integer,
	`revision_id` integer,
	`head_id` integer,
	`port` text NOT NULL,
	`cylinder` integer,
	`port_number` integer,
	`depression_in_h2o` real NOT NULL,
	`temp_c` real,
	`baro_kpa` real,
	`rh_pct` real,
	`valve_diameter_mm` real NOT NULL,
	`seat_id_mm` real,
	`min_section_mm2` real,
	`entry_radius` integer DEFAULT false NOT NULL,
	`exhaust_pipe` integer DEFAULT false NOT NULL,
	`operator_id` integer,
	`tested_on` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`master_id`) REFERENCES `master_heads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`head_id`) REFERENCES `heads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`operator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `flow_tests_revision_idx` ON `flow_tests` (`revision_id`);--> statement-breakpoint
CREATE INDEX `flow_tests_master_idx` ON `flow_tests` (`master_id`);--> statement-breakpoint
CREATE TABLE `head_types` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`casting_number` text NOT NULL,
	`engine_family` text NOT NULL,
	`cylinders` integer NOT NULL,
	`valves_per_cylinder` integer NOT NULL,
	`bore_mm` real NOT NULL,
	`stroke_mm` real NOT NULL,
	`intake_valve_mm` real NOT NULL,
	`exhaust_valve_mm` real NOT NULL,
	`intake_seat_id_mm` real,
	`exhaust_seat_id_mm` real,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `head_types_casting_number_unique` ON `head_types` (`casting_number`);--> statement-breakpoint
CREATE TABLE `heads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer,
	`head_type_id` integer NOT NULL,
	`serial` text NOT NULL,
	`casting_number` text NOT NULL,
	`source` text NOT NULL,
	`incoming_notes` text DEFAULT '' NOT NULL,
	`state` text DEFAULT 'received' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `heads_serial_unique` ON `heads` (`serial`);--> statement-breakpoint
CREATE INDEX `heads_job_idx` ON `heads` (`job_id`);--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`email` text NOT NULL,
	`role` text NOT NULL,
	`token_hash` text NOT NULL,
	`invited_by_id` integer,
	`expires_at` integer NOT NULL,
	`accepted_at` integer,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`invited_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_hash_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE INDEX `invitations_email_idx` ON `invitations` (`email`);--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`number` text NOT NULL,
	`customer_id` integer NOT NULL,
	`head_type_id` integer NOT NULL,
	`quantity` integer NOT NULL,
	`cut_intake` integer DEFAULT true NOT NULL,
	`cut_exhaust` integer DEFAULT true NOT NULL,
	`intake_revision_id` integer,
	`exhaust_revision_id` integer,
	`machine_id` integer,
	`due_on` text,
	`setup_minutes` real DEFAULT 60 NOT NULL,
	`state` text DEFAULT 'quoted' NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`intake_revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`exhaust_revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `jobs_number_unique` ON `jobs` (`number`);--> statement-breakpoint
CREATE INDEX `jobs_state_idx` ON `jobs` (`state`);--> statement-breakpoint
CREATE TABLE `machine_tokens` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`machine_id` integer NOT NULL,
	`label` text NOT NULL,
	`token_hash` text NOT NULL,
	`created_by_id` integer,
	`last_used_at` integer,
	`revoked_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `machine_tokens_token_hash_unique` ON `machine_tokens` (`token_hash`);--> statement-breakpoint
CREATE TABLE `machines` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`name` text NOT NULL,
	`description` text DEFAULT '' NOT NULL,
	`axes` text NOT NULL,
	`limits` text NOT NULL,
	`max_feed_mm_min` real NOT NULL,
	`max_spindle_rpm` real NOT NULL,
	`tool_change_s` real NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `machines_name_unique` ON `machines` (`name`);--> statement-breakpoint
CREATE TABLE `master_heads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`label` text NOT NULL,
	`head_type_id` integer NOT NULL,
	`porter_id` integer,
	`stage` text DEFAULT 'hand_porting' NOT NULL,
	`started_on` text,
	`finished_on` text,
	`hand_port_notes` text NOT NULL,
	`measurements` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`porter_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `master_heads_label_unique` ON `master_heads` (`label`);--> statement-breakpoint
CREATE INDEX `master_heads_stage_idx` ON `master_heads` (`stage`);--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`user_id` integer NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_resets_token_hash_unique` ON `password_resets` (`token_hash`);--> statement-breakpoint
CREATE TABLE `programs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`head_type_id` integer NOT NULL,
	`port` text NOT NULL,
	`name` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`head_type_id`) REFERENCES `head_types`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `programs_head_port_name_idx` ON `programs` (`head_type_id`,`port`,`name`);--> statement-breakpoint
CREATE TABLE `revision_files` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` integer NOT NULL,
	`file_id` integer NOT NULL,
	`role` text NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`file_id`) REFERENCES `stored_files`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `revision_moves` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`revision_id` integer NOT NULL,
	`from_state` text,
	`to_state` text NOT NULL,
	`by_id` integer,
	`at` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `revisions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`program_id` integer NOT NULL,
	`letter` text NOT NULL,
	`parent_id` integer,
	`source_scan_id` integer,
	`plate_id` integer,
	`machine_id` integer,
	`change_note` text DEFAULT '' NOT NULL,
	`state` text DEFAULT 'draft' NOT NULL,
	`created_by_id` integer,
	`released_by_id` integer,
	`released_at` integer,
	`release_signature` text,
	`release_override_reason` text,
	`end_reason` text,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`program_id`) REFERENCES `programs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`source_scan_id`) REFERENCES `scans`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`plate_id`) REFERENCES `fixture_plates`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`released_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `revisions_program_letter_idx` ON `revisions` (`program_id`,`letter`);--> statement-breakpoint
CREATE INDEX `revisions_state_idx` ON `revisions` (`state`);--> statement-breakpoint
CREATE TABLE `scan_files` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`scan_id` integer NOT NULL,
	`file_id` integer NOT NULL,
	FOREIGN KEY (`scan_id`) REFERENCES `scans`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`file_id`) REFERENCES `stored_files`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `scans` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`master_id` integer NOT NULL,
	`plate_id` integer NOT NULL,
	`machine_id` integer NOT NULL,
	`port` text NOT NULL,
	`operator_id` integer,
	`stylus_diameter_mm` real NOT NULL,
	`point_spacing_mm` real NOT NULL,
	`scanned_on` text NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`master_id`) REFERENCES `master_heads`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`plate_id`) REFERENCES `fixture_plates`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`operator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `scans_master_idx` ON `scans` (`master_id`);--> statement-breakpoint
CREATE TABLE `sign_in_attempts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`email` text NOT NULL,
	`ip` text NOT NULL,
	`succeeded` integer NOT NULL,
	`at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `sign_in_attempts_email_at_idx` ON `sign_in_attempts` (`email`,`at`);--> statement-breakpoint
CREATE INDEX `sign_in_attempts_ip_at_idx` ON `sign_in_attempts` (`ip`,`at`);--> statement-breakpoint
CREATE TABLE `stored_files` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`storage_key` text NOT NULL,
	`original_name` text NOT NULL,
	`content_type` text DEFAULT 'application/octet-stream' NOT NULL,
	`size_bytes` integer NOT NULL,
	`sha256` text,
	`state` text DEFAULT 'uploading' NOT NULL,
	`upload_id` text,
	`uploaded_by_id` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	FOREIGN KEY (`uploaded_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `stored_files_storage_key_unique` ON `stored_files` (`storage_key`);--> statement-breakpoint
CREATE INDEX `stored_files_state_idx` ON `stored_files` (`state`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`password_hash` text,
	`active` integer DEFAULT true NOT NULL,
	`session_version` integer DEFAULT 1 NOT NULL,
	`last_sign_in_at` integer,
	`created_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL,
	`updated_at` integer DEFAULT (unixepoch('subsec') * 1000) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);