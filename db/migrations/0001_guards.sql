-- Trainees are linked to the crew member they are.
ALTER TABLE "users" ADD CONSTRAINT "users_crew_member_id_fk" FOREIGN KEY ("crew_member_id") REFERENCES "crew_members"("id");
--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_crew_member_id_fk" FOREIGN KEY ("crew_member_id") REFERENCES "crew_members"("id");
--> statement-breakpoint
-- The audit log is append-only.
CREATE FUNCTION holonaut_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION '% rows are append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'P0001';
END $$;
--> statement-breakpoint
CREATE TRIGGER audit_events_append_only BEFORE UPDATE OR DELETE ON "audit_events"
  FOR EACH ROW EXECUTE FUNCTION holonaut_refuse_change();
--> statement-breakpoint
-- Profile versions are immutable once saved.
CREATE TRIGGER profile_versions_immutable BEFORE UPDATE OR DELETE ON "profile_versions"
  FOR EACH ROW EXECUTE FUNCTION holonaut_refuse_change();
--> statement-breakpoint
-- A cleared (approved) sequence version keeps its content, bindings and clearance forever;
-- only its status may move on (to replaced or recheck) and stale_since be set.
CREATE FUNCTION holonaut_freeze_cleared_version() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF OLD.status IN ('cleared', 'under_review') OR OLD.cleared_at IS NOT NULL THEN
      RAISE EXCEPTION 'sequence version % is % and cannot be deleted', OLD.id, OLD.status USING ERRCODE = 'P0001';
    END IF;
    RETURN OLD;
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
--> statement-breakpoint
CREATE TRIGGER sequence_versions_freeze_cleared BEFORE UPDATE OR DELETE ON "sequence_versions"
  FOR EACH ROW EXECUTE FUNCTION holonaut_freeze_cleared_version();
