-- Tell every app server, through NOTIFY, when data it keeps in memory for a few seconds changes.
-- The triggers fire whoever writes (the app, better-auth, a clerk at psql), and NOTIFY is sent
-- at commit, never for a rolled-back change.
--
-- gw_access: who is signed in and what they may do. Payload: the user's id, or '*' for everyone.
CREATE OR REPLACE FUNCTION gw_notify_access() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  r record;
BEGIN
  IF TG_OP = 'DELETE' THEN r := OLD; ELSE r := NEW; END IF;
  IF TG_TABLE_NAME = 'user' THEN
    PERFORM pg_notify('gw_access', r.id);
  ELSIF TG_TABLE_NAME = 'organization' THEN
    PERFORM pg_notify('gw_access', '*');
  ELSE
    PERFORM pg_notify('gw_access', r.user_id);
    IF TG_OP = 'UPDATE' AND OLD.user_id IS DISTINCT FROM NEW.user_id THEN
      PERFORM pg_notify('gw_access', OLD.user_id);
    END IF;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER gw_access_session AFTER UPDATE OR DELETE ON "session" FOR EACH ROW EXECUTE FUNCTION gw_notify_access();
--> statement-breakpoint
CREATE TRIGGER gw_access_member AFTER INSERT OR UPDATE OR DELETE ON "member" FOR EACH ROW EXECUTE FUNCTION gw_notify_access();
--> statement-breakpoint
CREATE TRIGGER gw_access_user AFTER UPDATE OR DELETE ON "user" FOR EACH ROW EXECUTE FUNCTION gw_notify_access();
--> statement-breakpoint
CREATE TRIGGER gw_access_organization AFTER UPDATE OR DELETE ON "organization" FOR EACH ROW EXECUTE FUNCTION gw_notify_access();
--> statement-breakpoint
-- gw_chamber: a chamber's rulebook adoptions or its roster of legislators. Payload: the chamber's id.
CREATE OR REPLACE FUNCTION gw_notify_chamber() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    PERFORM pg_notify('gw_chamber', OLD.chamber_id);
  ELSE
    PERFORM pg_notify('gw_chamber', NEW.chamber_id);
    IF TG_OP = 'UPDATE' AND OLD.chamber_id IS DISTINCT FROM NEW.chamber_id THEN
      PERFORM pg_notify('gw_chamber', OLD.chamber_id);
    END IF;
  END IF;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER gw_chamber_adoptions AFTER INSERT OR UPDATE OR DELETE ON "rulebook_adoptions" FOR EACH ROW EXECUTE FUNCTION gw_notify_chamber();
--> statement-breakpoint
CREATE TRIGGER gw_chamber_legislators AFTER INSERT OR UPDATE OR DELETE ON "legislators" FOR EACH ROW EXECUTE FUNCTION gw_notify_chamber();
--> statement-breakpoint
-- TRUNCATE (tests, maintenance): everyone forgets everything.
CREATE OR REPLACE FUNCTION gw_notify_everything() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('gw_access', '*');
  PERFORM pg_notify('gw_chamber', '');
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER gw_truncate_session AFTER TRUNCATE ON "session" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_member AFTER TRUNCATE ON "member" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_user AFTER TRUNCATE ON "user" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_organization AFTER TRUNCATE ON "organization" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_adoptions AFTER TRUNCATE ON "rulebook_adoptions" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
--> statement-breakpoint
CREATE TRIGGER gw_truncate_legislators AFTER TRUNCATE ON "legislators" FOR EACH STATEMENT EXECUTE FUNCTION gw_notify_everything();
