-- The stored export files of a published release never change: no update, no delete, and rows
-- are only added for a release that is published (in its publish transaction, or once for a
-- release published before exports were stored). Content is stored uncompressed out of line so
-- the export route can read it slice by slice.
ALTER TABLE release_exports ALTER COLUMN content SET STORAGE EXTERNAL;
--> statement-breakpoint
CREATE FUNCTION registry_refuse_export_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') THEN
    RAISE EXCEPTION 'the exports of a published release cannot be changed or deleted'
      USING ERRCODE = 'P0001', HINT = 'publish a new release instead';
  END IF;
  IF NOT registry_release_is_published(NEW.release_id) THEN
    RAISE EXCEPTION 'exports are stored only for a published release' USING ERRCODE = 'P0001';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER release_exports_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON release_exports
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_export_change();
--> statement-breakpoint
CREATE TRIGGER release_exports_no_truncate
  BEFORE TRUNCATE ON release_exports
  FOR EACH STATEMENT EXECUTE FUNCTION registry_refuse_truncate();
