-- The note and acknowledged failures a reviewer cleared a version with, and the version a re-check
-- version re-checks, belong to what was approved: a cleared version keeps them too (as 0010, plus
-- submit_note, acknowledged_failures and recheck_of_id).
CREATE OR REPLACE FUNCTION holonaut_freeze_cleared_version() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.status IN ('cleared', 'under_review') OR OLD.cleared_at IS NOT NULL THEN
      RAISE EXCEPTION 'sequence version % is % and cannot be deleted', OLD.id, OLD.status USING ERRCODE = 'P0001';
    END IF;
    RETURN OLD;
  END IF;
  IF NEW.target IS DISTINCT FROM OLD.target THEN
    RAISE EXCEPTION 'sequence version % keeps the target it was saved with', OLD.id USING ERRCODE = 'P0001';
  END IF;
  IF OLD.cleared_at IS NOT NULL AND (
       NEW.primitives IS DISTINCT FROM OLD.primitives
    OR NEW.compiled IS DISTINCT FROM OLD.compiled
    OR NEW.profile_version_id IS DISTINCT FROM OLD.profile_version_id
    OR NEW.report IS DISTINCT FROM OLD.report
    OR NEW.engine_version IS DISTINCT FROM OLD.engine_version
    OR NEW.inputs_hash IS DISTINCT FROM OLD.inputs_hash
    OR NEW.cleared_by IS DISTINCT FROM OLD.cleared_by
    OR NEW.cleared_at IS DISTINCT FROM OLD.cleared_at
    OR NEW.sequence_id IS DISTINCT FROM OLD.sequence_id
    OR NEW.version IS DISTINCT FROM OLD.version
    OR NEW.author_id IS DISTINCT FROM OLD.author_id
    OR NEW.submit_note IS DISTINCT FROM OLD.submit_note
    OR NEW.acknowledged_failures IS DISTINCT FROM OLD.acknowledged_failures
    OR NEW.recheck_of_id IS DISTINCT FROM OLD.recheck_of_id
    OR NEW.status NOT IN ('cleared', 'replaced', 'recheck')
  ) THEN
    RAISE EXCEPTION 'sequence version % was cleared and is immutable', OLD.id USING ERRCODE = 'P0001';
  END IF;
  RETURN NEW;
END $$;
