CREATE TABLE "release_acknowledgements" (
	"release_id" integer NOT NULL,
	"revision_id" integer NOT NULL,
	"acknowledged_by" integer,
	"acknowledged_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "release_acknowledgements_release_id_revision_id_pk" PRIMARY KEY("release_id","revision_id")
);
--> statement-breakpoint
CREATE TABLE "release_exclusions" (
	"release_id" integer NOT NULL,
	"revision_id" integer NOT NULL,
	"excluded_by" integer,
	"excluded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "release_exclusions_release_id_revision_id_pk" PRIMARY KEY("release_id","revision_id")
);
--> statement-breakpoint
ALTER TABLE "releases" ADD COLUMN "base_release_id" integer;--> statement-breakpoint
ALTER TABLE "release_acknowledgements" ADD CONSTRAINT "release_acknowledgements_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_acknowledgements" ADD CONSTRAINT "release_acknowledgements_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_acknowledgements" ADD CONSTRAINT "release_acknowledgements_acknowledged_by_users_id_fk" FOREIGN KEY ("acknowledged_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_exclusions" ADD CONSTRAINT "release_exclusions_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_exclusions" ADD CONSTRAINT "release_exclusions_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_exclusions" ADD CONSTRAINT "release_exclusions_excluded_by_users_id_fk" FOREIGN KEY ("excluded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_base_release_id_releases_id_fk" FOREIGN KEY ("base_release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- What an editor decided about a draft (left-out changes, acknowledged stale values) is part of
-- the release once it is published, and as frozen as its entries.
CREATE FUNCTION registry_refuse_published_draft_part() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF (TG_OP IN ('UPDATE', 'DELETE') AND registry_release_is_published(OLD.release_id))
     OR (TG_OP IN ('INSERT', 'UPDATE') AND registry_release_is_published(NEW.release_id)) THEN
    RAISE EXCEPTION '% of a published release cannot change', TG_TABLE_NAME
      USING ERRCODE = 'P0001';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER release_exclusions_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON release_exclusions
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_published_draft_part();
--> statement-breakpoint
CREATE TRIGGER release_acknowledgements_immutable
  BEFORE INSERT OR UPDATE OR DELETE ON release_acknowledgements
  FOR EACH ROW EXECUTE FUNCTION registry_refuse_published_draft_part();
