-- The sealed states of the workflow table (lib/review/workflow.ts: issued, superseded, voided) are
-- the signed record. tests/integration/triggers.test.ts tries every state against these triggers.
DROP TRIGGER IF EXISTS revisions_pdf_frozen_after_issue;
--> statement-breakpoint
CREATE TRIGGER revisions_record_sealed
BEFORE UPDATE OF pdf_key, pdf_hash, frozen_at, engineer_id, checker_id, approver_id, checked_at, approved_at, issued_at, reason, submitted_failing, assigned_checker_id, assigned_approver_id, verification_code, created_at ON revisions
WHEN OLD.state IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'issued revision is frozen');
END;
--> statement-breakpoint
CREATE TRIGGER revisions_created_at_fixed
BEFORE UPDATE OF created_at ON revisions
WHEN NEW.created_at IS NOT OLD.created_at
BEGIN
  SELECT RAISE(ABORT, 'revision content is frozen');
END;
--> statement-breakpoint
DROP TRIGGER IF EXISTS revisions_issued_state_forward_only;
--> statement-breakpoint
-- An issued revision is superseded only when a newer revision of the same calc is issued with it,
-- or voided; superseded and voided are final.
CREATE TRIGGER revisions_issued_state_forward_only
BEFORE UPDATE OF state ON revisions
WHEN (OLD.state = 'issued' AND NEW.state NOT IN ('issued', 'superseded', 'voided'))
  OR (OLD.state IN ('superseded', 'voided') AND NEW.state <> OLD.state)
BEGIN
  SELECT RAISE(ABORT, 'issued revision can only be superseded');
END;
--> statement-breakpoint
DROP TRIGGER IF EXISTS revisions_issued_no_delete;
--> statement-breakpoint
CREATE TRIGGER revisions_issued_no_delete
BEFORE DELETE ON revisions
WHEN OLD.state IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'issued revision cannot be deleted');
END;
--> statement-breakpoint
-- Remarks, replies, ticks and confirmations of a sealed revision are part of its record.
CREATE TRIGGER remarks_sealed_insert
BEFORE INSERT ON check_remarks
WHEN (SELECT state FROM revisions WHERE id = NEW.revision_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'remarks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER remarks_sealed_update
BEFORE UPDATE ON check_remarks
WHEN (SELECT state FROM revisions WHERE id = OLD.revision_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'remarks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER remarks_sealed_delete
BEFORE DELETE ON check_remarks
WHEN (SELECT state FROM revisions WHERE id = OLD.revision_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'remarks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER replies_sealed_insert
BEFORE INSERT ON remark_replies
WHEN (SELECT r.state FROM revisions r JOIN check_remarks m ON m.revision_id = r.id WHERE m.id = NEW.remark_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'remarks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER replies_never_change
BEFORE UPDATE ON remark_replies
BEGIN
  SELECT RAISE(ABORT, 'replies are never overwritten');
END;
--> statement-breakpoint
CREATE TRIGGER replies_sealed_delete
BEFORE DELETE ON remark_replies
WHEN (SELECT r.state FROM revisions r JOIN check_remarks m ON m.revision_id = r.id WHERE m.id = OLD.remark_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'remarks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER ticks_sealed_insert
BEFORE INSERT ON step_ticks
WHEN (SELECT state FROM revisions WHERE id = NEW.revision_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'ticks of an issued revision are frozen');
END;
--> statement-breakpoint
CREATE TRIGGER ticks_sealed_delete
BEFORE DELETE ON step_ticks
WHEN (SELECT state FROM revisions WHERE id = OLD.revision_id) IN ('issued', 'superseded', 'voided')
BEGIN
  SELECT RAISE(ABORT, 'ticks of an issued revision are frozen');
END;
--> statement-breakpoint
-- The history itself never changes.
CREATE TRIGGER revision_events_append_only_update
BEFORE UPDATE ON revision_events
BEGIN
  SELECT RAISE(ABORT, 'the history is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER revision_events_append_only_delete
BEFORE DELETE ON revision_events
BEGIN
  SELECT RAISE(ABORT, 'the history is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER audit_events_append_only_update
BEFORE UPDATE ON audit_events
BEGIN
  SELECT RAISE(ABORT, 'the audit trail is append-only');
END;
--> statement-breakpoint
CREATE TRIGGER audit_events_append_only_delete
BEFORE DELETE ON audit_events
BEGIN
  SELECT RAISE(ABORT, 'the audit trail is append-only');
END;
