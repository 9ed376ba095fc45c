-- gw_measure: a measure, its amendments or the overrides on its tree changed (whoever wrote).
-- Payload: the measure's id. App servers forget what they remember of that measure's tree.
CREATE OR REPLACE FUNCTION gw_notify_measure() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_TABLE_NAME = 'measures' THEN
    PERFORM pg_notify('gw_measure', COALESCE(NEW.id, OLD.id)::text);
  ELSE
    IF TG_OP <> 'INSERT' THEN PERFORM pg_notify('gw_measure', OLD.measure_id::text); END IF;
    IF TG_OP <> 'DELETE' THEN PERFORM pg_notify('gw_measure', NEW.measure_id::text); END IF;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER gw_measure_measures AFTER UPDATE OR DELETE ON "measures" FOR EACH ROW EXECUTE FUNCTION gw_notify_measure();
--> statement-breakpoint
CREATE TRIGGER gw_measure_amendments AFTER INSERT OR UPDATE OR DELETE ON "amendments" FOR EACH ROW EXECUTE FUNCTION gw_notify_measure();
--> statement-breakpoint
CREATE TRIGGER gw_measure_overrides AFTER INSERT OR UPDATE OR DELETE ON "tree_overrides" FOR EACH ROW EXECUTE FUNCTION gw_notify_measure();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_measures AFTER TRUNCATE ON "measures" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_amendments AFTER TRUNCATE ON "amendments" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_overrides AFTER TRUNCATE ON "tree_overrides" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
