-- A revision's content never changes once saved: a new revision is made instead.
CREATE TRIGGER revisions_content_immutable
BEFORE UPDATE OF calc_id, label, inputs, result, engine_version, template_version, content_hash ON revisions
BEGIN
  SELECT RAISE(ABORT, 'revision content is frozen');
END;
--> statement-breakpoint
-- The PDF of an issued or superseded revision is the signed record.
CREATE TRIGGER revisions_pdf_frozen_after_issue
BEFORE UPDATE OF pdf_key, pdf_hash, frozen_at, engineer_id, checker_id, approver_id, checked_at, approved_at, issued_at ON revisions
WHEN OLD.state IN ('issued', 'superseded')
BEGIN
  SELECT RAISE(ABORT, 'issued revision is frozen');
END;
--> statement-breakpoint
CREATE TRIGGER revisions_issued_state_forward_only
BEFORE UPDATE OF state ON revisions
WHEN (OLD.state = 'issued' AND NEW.state NOT IN ('issued', 'superseded'))
  OR (OLD.state = 'superseded' AND NEW.state <> 'superseded')
BEGIN
  SELECT RAISE(ABORT, 'issued revision can only be superseded');
END;
--> statement-breakpoint
CREATE TRIGGER revisions_issued_no_delete
BEFORE DELETE ON revisions
WHEN OLD.state IN ('issued', 'superseded')
BEGIN
  SELECT RAISE(ABORT, 'issued revision cannot be deleted');
END;
