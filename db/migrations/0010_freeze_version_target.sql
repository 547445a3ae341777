-- A version's target is part of what was composed, verified and reviewed: it never changes after
-- the save (any status), and a cleared version keeps its content, bindings and clearance forever;
-- only its status may move on (to replaced or recheck) and stale_since be set.
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
    OR NEW.status NOT IN ('cleared', 'replaced', 'recheck')
  ) THEN
    RAISE EXCEPTION 'sequence version % was cleared and is immutable', OLD.id USING ERRCODE = 'P0001';
  END IF;
  RETURN NEW;
END $$;
