-- Published releases never change: the database itself refuses it, whatever the client.
-- A published release row, its entries, the value columns of every revision it pins, and the
-- heat-capacity ranges and derivation inputs of those revisions are frozen. Status columns of a
-- revision (accepted → superseded/retired) stay writable: they describe the registry, not the
-- value a release pinned.

CREATE FUNCTION registry_refuse_published_release() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status = 'published' THEN
    RAISE EXCEPTION 'release % is published and cannot be changed or deleted', OLD.version
      USING ERRCODE = 'P0001', HINT = 'publish a new release instead';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER releases_immutable
  BEFORE UPDATE OR DELETE ON releases
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_published_release();
--> statement-breakpoint
CREATE FUNCTION registry_release_is_published(release integer) RETURNS boolean
LANGUAGE sql AS $$
  -- FOR SHARE waits for a concurrent publish of the same release to commit or roll back.
  SELECT coalesce((SELECT status = 'published' FROM releases WHERE id = release FOR SHARE), false);
$$;
--> statement-breakpoint
CREATE FUNCTION registry_refuse_published_entry() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP IN ('UPDATE', 'DELETE') AND registry_release_is_published(OLD.release_id) THEN
    RAISE EXCEPTION 'entries of a published release cannot be changed or deleted'
      USING ERRCODE = 'P0001';
  END IF;
  IF TG_OP IN ('INSERT', 'UPDATE') AND registry_release_is_published(NEW.release_id) THEN
    RAISE EXCEPTION 'entries cannot be added to a published release' USING ERRCODE = 'P0001';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER release_entries_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON release_entries
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_published_entry();
--> statement-breakpoint
CREATE FUNCTION registry_revision_is_pinned(revision integer) RETURNS boolean
LANGUAGE sql STABLE AS $$
  SELECT EXISTS (
    SELECT 1 FROM release_entries e JOIN releases r ON r.id = e.release_id
    WHERE e.revision_id = revision AND r.status = 'published'
  );
$$;
--> statement-breakpoint
CREATE FUNCTION registry_refuse_pinned_revision() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    IF registry_revision_is_pinned(OLD.id) THEN
      RAISE EXCEPTION 'revision % is pinned by a published release and cannot be deleted', OLD.id
        USING ERRCODE = 'P0001';
    END IF;
    RETURN OLD;
  END IF;
  IF ROW(OLD.id, OLD.species_phase_id, OLD.kind, OLD.quantity, OLD.value, OLD.uncertainty,
         OLD.uncertainty_basis, OLD.temperature, OLD.to_phase, OLD.to_modification,
         OLD.heat_capacity_form, OLD.method, OLD.standard_pressure, OLD.source_id, OLD.notes,
         OLD.from_memory, OLD.supersedes_id, OLD.derivation, OLD.created_by, OLD.created_at)
     IS DISTINCT FROM
     ROW(NEW.id, NEW.species_phase_id, NEW.kind, NEW.quantity, NEW.value, NEW.uncertainty,
         NEW.uncertainty_basis, NEW.temperature, NEW.to_phase, NEW.to_modification,
         NEW.heat_capacity_form, NEW.method, NEW.standard_pressure, NEW.source_id, NEW.notes,
         NEW.from_memory, NEW.supersedes_id, NEW.derivation, NEW.created_by, NEW.created_at)
     AND registry_revision_is_pinned(OLD.id) THEN
    RAISE EXCEPTION 'revision % is pinned by a published release: its value cannot change', OLD.id
      USING ERRCODE = 'P0001', HINT = 'add a revision that supersedes it';
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER revisions_immutable
  BEFORE UPDATE OR DELETE ON revisions
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_pinned_revision();
--> statement-breakpoint
-- Heat-capacity ranges and derivation inputs belong to their revision's value.
CREATE FUNCTION registry_refuse_pinned_revision_part() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF (TG_OP IN ('UPDATE', 'DELETE') AND registry_revision_is_pinned(OLD.revision_id))
     OR (TG_OP IN ('INSERT', 'UPDATE') AND registry_revision_is_pinned(NEW.revision_id)) THEN
    RAISE EXCEPTION '% of a revision pinned by a published release cannot change', TG_TABLE_NAME
      USING ERRCODE = 'P0001';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER heat_capacity_ranges_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON heat_capacity_ranges
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_pinned_revision_part();
--> statement-breakpoint
CREATE TRIGGER revision_inputs_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON revision_inputs
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_pinned_revision_part();
--> statement-breakpoint
-- TRUNCATE skips row triggers: refuse it outright once anything is published.
CREATE FUNCTION registry_refuse_truncate() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF EXISTS (SELECT 1 FROM releases WHERE status = 'published') THEN
    RAISE EXCEPTION '% cannot be truncated while a published release exists', TG_TABLE_NAME
      USING ERRCODE = 'P0001';
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER releases_no_truncate BEFORE TRUNCATE ON releases
  FOR EACH STATEMENT EXECUTE FUNCTION registry_refuse_truncate();
--> statement-breakpoint
CREATE TRIGGER release_entries_no_truncate BEFORE TRUNCATE ON release_entries
  FOR EACH STATEMENT EXECUTE FUNCTION registry_refuse_truncate();
--> statement-breakpoint
CREATE TRIGGER revisions_no_truncate BEFORE TRUNCATE ON revisions
  FOR EACH STATEMENT EXECUTE FUNCTION registry_refuse_truncate();
--> statement-breakpoint
CREATE TRIGGER heat_capacity_ranges_no_truncate BEFORE TRUNCATE ON heat_capacity_ranges
  FOR EACH STATEMENT EXECUTE FUNCTION registry_refuse_truncate();
