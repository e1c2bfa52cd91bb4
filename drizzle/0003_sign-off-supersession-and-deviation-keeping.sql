-- Signatures are append-only: the only change the database accepts is marking
-- a signature superseded by a later run, once (superseded_by_run_id from NULL).
CREATE TRIGGER `sign_offs_only_supersede` BEFORE UPDATE ON `sign_offs` FOR EACH ROW
BEGIN
  IF NOT (OLD.superseded_by_run_id IS NULL AND NEW.superseded_by_run_id IS NOT NULL
      AND NEW.id <=> OLD.id AND NEW.version_id <=> OLD.version_id AND NEW.user_id <=> OLD.user_id
      AND NEW.kind <=> OLD.kind AND NEW.run_ids <=> OLD.run_ids AND NEW.summary <=> OLD.summary
      AND NEW.comment <=> OLD.comment AND NEW.created_at <=> OLD.created_at) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'sign_offs is append-only: a signature can only be marked superseded, once';
  END IF;
END;
--> statement-breakpoint
-- Deviations are never deleted; what was proposed never changes, the state
-- only moves forward (proposed -> approved/rejected/withdrawn, approved ->
-- withdrawn/expired), and a decision once recorded stays as it was.
CREATE TRIGGER `deviations_no_delete` BEFORE DELETE ON `deviations` FOR EACH ROW
  SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'deviations are kept: withdraw a deviation instead of deleting it';
--> statement-breakpoint
CREATE TRIGGER `deviations_forward_only` BEFORE UPDATE ON `deviations` FOR EACH ROW
BEGIN
  IF NOT (NEW.id <=> OLD.id AND NEW.code_id <=> OLD.code_id AND NEW.set_slug <=> OLD.set_slug AND NEW.scope <=> OLD.scope
      AND NEW.case_input_key <=> OLD.case_input_key AND NEW.region <=> OLD.region AND NEW.reason <=> OLD.reason
      AND NEW.proposed_by <=> OLD.proposed_by AND NEW.proposed_at <=> OLD.proposed_at
      AND NEW.expires_at_version <=> OLD.expires_at_version AND NEW.expires_on <=> OLD.expires_on)
    OR NOT ((OLD.state = 'proposed' AND NEW.state IN ('approved', 'rejected', 'withdrawn'))
      OR (OLD.state = 'approved' AND NEW.state IN ('withdrawn', 'expired')))
    OR (OLD.decided_by IS NOT NULL AND NOT (NEW.decided_by <=> OLD.decided_by AND NEW.decided_at <=> OLD.decided_at
      AND NEW.decision_comment <=> OLD.decision_comment)) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'deviations keep their history: only a forward change of state is allowed';
  END IF;
END;
