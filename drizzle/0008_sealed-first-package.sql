-- A revision superseded before its package was rendered (saved twice within a moment) still gets
-- its package, once: the render job may write pdf_key and pdf_hash of a sealed row while both are
-- empty and nothing else changes. Every other change of a sealed row is refused as before.
DROP TRIGGER IF EXISTS revisions_record_sealed;
--> statement-breakpoint
CREATE TRIGGER revisions_record_sealed
BEFORE UPDATE OF pdf_key, pdf_hash, frozen_at, engineer_id, checker_id, approver_id, checked_at, approved_at, issued_at, reason, submitted_failing, assigned_checker_id, assigned_approver_id, verification_code, created_at ON revisions
WHEN OLD.state IN ('issued', 'superseded', 'voided')
  AND NOT (
    OLD.pdf_key IS NULL AND OLD.pdf_hash IS NULL AND NEW.pdf_key IS NOT NULL AND NEW.pdf_hash IS NOT NULL
    AND NEW.frozen_at IS OLD.frozen_at AND NEW.engineer_id IS OLD.engineer_id AND NEW.checker_id IS OLD.checker_id
    AND NEW.approver_id IS OLD.approver_id AND NEW.checked_at IS OLD.checked_at AND NEW.approved_at IS OLD.approved_at
    AND NEW.issued_at IS OLD.issued_at AND NEW.reason IS OLD.reason AND NEW.submitted_failing IS OLD.submitted_failing
    AND NEW.assigned_checker_id IS OLD.assigned_checker_id AND NEW.assigned_approver_id IS OLD.assigned_approver_id
    AND NEW.verification_code IS OLD.verification_code AND NEW.created_at IS OLD.created_at
  )
BEGIN
  SELECT RAISE(ABORT, 'issued revision is frozen');
END;
