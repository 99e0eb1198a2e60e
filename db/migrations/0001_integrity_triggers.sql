-- Rules the database itself enforces, so no code path (API, CLI, a hand-run UPDATE) can bypass them.

-- The audit trail is append-only.
CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events
BEGIN SELECT RAISE(ABORT, 'audit events are append-only'); END;
--> statement-breakpoint
CREATE TRIGGER audit_events_no_delete BEFORE DELETE ON audit_events
BEGIN SELECT RAISE(ABORT, 'audit events are append-only'); END;
--> statement-breakpoint

-- A released revision is immutable: only its move to superseded or withdrawn (with a reason) is allowed.
CREATE TRIGGER revisions_released_immutable BEFORE UPDATE ON revisions
WHEN OLD.state = 'released' AND (
  NEW.state NOT IN ('superseded', 'withdrawn')
  OR NEW.program_id IS NOT OLD.program_id OR NEW.letter IS NOT OLD.letter OR NEW.parent_id IS NOT OLD.parent_id
  OR NEW.source_scan_id IS NOT OLD.source_scan_id OR NEW.plate_id IS NOT OLD.plate_id OR NEW.machine_id IS NOT OLD.machine_id
  OR NEW.change_note IS NOT OLD.change_note OR NEW.created_by_id IS NOT OLD.created_by_id
  OR NEW.released_by_id IS NOT OLD.released_by_id OR NEW.released_at IS NOT OLD.released_at
  OR NEW.release_signature IS NOT OLD.release_signature OR NEW.release_override_reason IS NOT OLD.release_override_reason
)
BEGIN SELECT RAISE(ABORT, 'a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER revisions_ended_immutable BEFORE UPDATE ON revisions
WHEN OLD.state IN ('superseded', 'withdrawn')
BEGIN SELECT RAISE(ABORT, 'a superseded or withdrawn revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER revisions_released_no_delete BEFORE DELETE ON revisions
WHEN OLD.state IN ('released', 'superseded', 'withdrawn')
BEGIN SELECT RAISE(ABORT, 'a released revision cannot be deleted'); END;
--> statement-breakpoint

-- Its file list, files and analyses are frozen with it.
CREATE TRIGGER revision_files_frozen_insert BEFORE INSERT ON revision_files
WHEN (SELECT state FROM revisions WHERE id = NEW.revision_id) IN ('released', 'superseded', 'withdrawn')
BEGIN SELECT RAISE(ABORT, 'a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER revision_files_frozen_update BEFORE UPDATE ON revision_files
WHEN (SELECT state FROM revisions WHERE id = OLD.revision_id) IN ('released', 'superseded', 'withdrawn')
BEGIN SELECT RAISE(ABORT, 'a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER revision_files_frozen_delete BEFORE DELETE ON revision_files
WHEN (SELECT state FROM revisions WHERE id = OLD.revision_id) IN ('released', 'superseded', 'withdrawn')
BEGIN SELECT RAISE(ABORT, 'a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER stored_files_frozen_update BEFORE UPDATE ON stored_files
WHEN EXISTS (SELECT 1 FROM revision_files rf JOIN revisions r ON r.id = rf.revision_id
             WHERE rf.file_id = OLD.id AND r.state IN ('released', 'superseded', 'withdrawn'))
BEGIN SELECT RAISE(ABORT, 'a file of a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER stored_files_frozen_delete BEFORE DELETE ON stored_files
WHEN EXISTS (SELECT 1 FROM revision_files rf JOIN revisions r ON r.id = rf.revision_id
             WHERE rf.file_id = OLD.id AND r.state IN ('released', 'superseded', 'withdrawn'))
BEGIN SELECT RAISE(ABORT, 'a file of a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER analyses_frozen_update BEFORE UPDATE ON analyses
WHEN EXISTS (SELECT 1 FROM revision_files rf JOIN revisions r ON r.id = rf.revision_id
             WHERE rf.file_id = OLD.file_id AND r.state IN ('released', 'superseded', 'withdrawn'))
BEGIN SELECT RAISE(ABORT, 'the analysis of a released revision is immutable'); END;
--> statement-breakpoint
CREATE TRIGGER analyses_frozen_delete BEFORE DELETE ON analyses
WHEN EXISTS (SELECT 1 FROM revision_files rf JOIN revisions r ON r.id = rf.revision_id
             WHERE rf.file_id = OLD.file_id AND r.state IN ('released', 'superseded', 'withdrawn'))
BEGIN SELECT RAISE(ABORT, 'the analysis of a released revision is immutable'); END;
--> statement-breakpoint

-- A cut's frozen checksum never changes.
CREATE TRIGGER cuts_hash_frozen BEFORE UPDATE OF toolpath_sha256, revision_id ON cuts
BEGIN SELECT RAISE(ABORT, 'a cut''s revision and file checksum are frozen'); END;
