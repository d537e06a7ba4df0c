-- A committed gait version never changes its content; only its review state
-- (and who reviews it) may move. Enforced here so no code path can forget.
CREATE FUNCTION gait_versions_refuse_content_change() RETURNS trigger AS $$
BEGIN
  IF NEW.gait_id IS DISTINCT FROM OLD.gait_id
     OR NEW.number IS DISTINCT FROM OLD.number
     OR NEW.message IS DISTINCT FROM OLD.message
     OR NEW.author_id IS DISTINCT FROM OLD.author_id
     OR NEW.robot_revision_id IS DISTINCT FROM OLD.robot_revision_id
     OR NEW.sequence IS DISTINCT FROM OLD.sequence
     OR NEW.summary IS DISTINCT FROM OLD.summary
     OR NEW.content_hash IS DISTINCT FROM OLD.content_hash
     OR NEW.created_at IS DISTINCT FROM OLD.created_at THEN
    RAISE EXCEPTION 'gait version % of gait % is immutable: only its review state may change', OLD.number, OLD.gait_id
      USING ERRCODE = 'integrity_constraint_violation';
  END IF;
  RETURN NEW;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER gait_versions_immutable BEFORE UPDATE ON gait_versions
  FOR EACH ROW EXECUTE FUNCTION gait_versions_refuse_content_change();
--> statement-breakpoint
-- Robot revisions are immutable too: a save makes a new one.
CREATE FUNCTION robot_revisions_refuse_change() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'robot revision % of robot % is immutable: save a new revision instead', OLD.number, OLD.robot_id
    USING ERRCODE = 'integrity_constraint_violation';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER robot_revisions_immutable BEFORE UPDATE ON robot_revisions
  FOR EACH ROW EXECUTE FUNCTION robot_revisions_refuse_change();
