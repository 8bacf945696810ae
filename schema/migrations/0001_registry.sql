CREATE TYPE "public"."phase" AS ENUM('g', 'l', 'cr', 'am', 'aq');--> statement-breakpoint
CREATE TYPE "public"."heat_capacity_form" AS ENUM('nasa7', 'shomate');--> statement-breakpoint
CREATE TYPE "public"."revision_kind" AS ENUM('formation_enthalpy', 'heat_capacity', 'transition');--> statement-breakpoint
CREATE TYPE "public"."revision_status" AS ENUM('proposed', 'accepted', 'superseded', 'retired', 'rejected');--> statement-breakpoint
CREATE TYPE "public"."standard_pressure" AS ENUM('1 bar', '1 atm');--> statement-breakpoint
CREATE TYPE "public"."uncertainty_basis" AS ENUM('standard', 'expanded_k2', 'as_stated');--> statement-breakpoint
CREATE TYPE "public"."release_status" AS ENUM('draft', 'published');--> statement-breakpoint
CREATE TABLE "species" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "species_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"key" text NOT NULL,
	"name" text NOT NULL,
	"synonyms" text[] DEFAULT '{}'::text[] NOT NULL,
	"formula" text NOT NULL,
	"charge" integer DEFAULT 0 NOT NULL,
	"cas_rn" text,
	"inchi" text,
	"inchi_key" text,
	"smiles" text,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "species_key_unique" UNIQUE("key"),
	CONSTRAINT "species_key_format" CHECK ("species"."key" ~ '^[a-z0-9][a-z0-9,]*(-[a-z0-9,]+)*$'),
	CONSTRAINT "species_cas_format" CHECK ("species"."cas_rn" is null or "species"."cas_rn" ~ '^[0-9]{2,7}-[0-9]{2}-[0-9]$'),
	CONSTRAINT "species_inchikey_format" CHECK ("species"."inchi_key" is null or "species"."inchi_key" ~ '^[A-Z]{14}-[A-Z]{10}-[A-Z]$')
);
--> statement-breakpoint
CREATE TABLE "species_phases" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "species_phases_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"species_id" integer NOT NULL,
	"phase" "phase" NOT NULL,
	"modification" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "species_phases_identity" UNIQUE NULLS NOT DISTINCT("species_id","phase","modification"),
	CONSTRAINT "species_phases_modification_label" CHECK ("species_phases"."modification" is null or "species_phases"."modification" ~ '^[a-z0-9][a-z0-9 -]*$')
);
--> statement-breakpoint
CREATE TABLE "sources" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "sources_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"key" text,
	"csl" jsonb NOT NULL,
	"citation" text NOT NULL,
	"doi" text,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sources_key_unique" UNIQUE("key"),
	CONSTRAINT "sources_doi_format" CHECK ("sources"."doi" is null or ("sources"."doi" ~ '^10\.[0-9]{4,9}/\S+$' and "sources"."doi" = lower("sources"."doi")))
);
--> statement-breakpoint
CREATE TABLE "heat_capacity_ranges" (
	"revision_id" integer NOT NULL,
	"seq" integer NOT NULL,
	"t_min" numeric NOT NULL,
	"t_max" numeric NOT NULL,
	"coefficients" numeric[] NOT NULL,
	CONSTRAINT "heat_capacity_ranges_revision_id_seq_pk" PRIMARY KEY("revision_id","seq"),
	CONSTRAINT "heat_capacity_ranges_order" CHECK ("heat_capacity_ranges"."t_min" > 0 and "heat_capacity_ranges"."t_min" < "heat_capacity_ranges"."t_max"),
	CONSTRAINT "heat_capacity_ranges_coefficients" CHECK (cardinality("heat_capacity_ranges"."coefficients") between 5 and 7)
);
--> statement-breakpoint
CREATE TABLE "revision_inputs" (
	"revision_id" integer NOT NULL,
	"input_revision_id" integer NOT NULL,
	CONSTRAINT "revision_inputs_revision_id_input_revision_id_pk" PRIMARY KEY("revision_id","input_revision_id"),
	CONSTRAINT "revision_inputs_not_self" CHECK ("revision_inputs"."revision_id" <> "revision_inputs"."input_revision_id")
);
--> statement-breakpoint
CREATE TABLE "revisions" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "revisions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"species_phase_id" integer NOT NULL,
	"kind" "revision_kind" NOT NULL,
	"quantity" text NOT NULL,
	"value" numeric,
	"uncertainty" numeric,
	"uncertainty_basis" "uncertainty_basis",
	"temperature" numeric,
	"to_phase" "phase",
	"to_modification" text,
	"heat_capacity_form" "heat_capacity_form",
	"method" text,
	"standard_pressure" "standard_pressure" DEFAULT '1 bar' NOT NULL,
	"source_id" integer NOT NULL,
	"notes" text,
	"from_memory" boolean DEFAULT false NOT NULL,
	"status" "revision_status" NOT NULL,
	"supersedes_id" integer,
	"derivation" jsonb,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"status_changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "revisions_identity" UNIQUE("id","species_phase_id","quantity"),
	CONSTRAINT "revisions_kind_shape" CHECK (case "revisions"."kind"
        when 'formation_enthalpy' then "revisions"."quantity" = 'formation_enthalpy' and "revisions"."value" is not null
          and "revisions"."heat_capacity_form" is null and "revisions"."temperature" is null and "revisions"."to_phase" is null
        when 'heat_capacity' then "revisions"."quantity" = 'heat_capacity' and "revisions"."value" is null
          and "revisions"."heat_capacity_form" is not null and "revisions"."temperature" is null and "revisions"."to_phase" is null
        when 'transition' then "revisions"."value" is not null and "revisions"."temperature" > 0 and "revisions"."to_phase" is not null
          and "revisions"."heat_capacity_form" is null
          and "revisions"."quantity" = 'transition:' || "revisions"."to_phase" || coalesce(',' || "revisions"."to_modification", '')
      end),
	CONSTRAINT "revisions_uncertainty_nonnegative" CHECK ("revisions"."uncertainty" is null or "revisions"."uncertainty" >= 0),
	CONSTRAINT "revisions_uncertainty_basis" CHECK (("revisions"."uncertainty" is null) = ("revisions"."uncertainty_basis" is null)),
	CONSTRAINT "revisions_not_self_superseding" CHECK ("revisions"."supersedes_id" is distinct from "revisions"."id")
);
--> statement-breakpoint
CREATE TABLE "release_entries" (
	"release_id" integer NOT NULL,
	"species_phase_id" integer NOT NULL,
	"quantity" text NOT NULL,
	"revision_id" integer NOT NULL,
	CONSTRAINT "release_entries_release_id_species_phase_id_quantity_pk" PRIMARY KEY("release_id","species_phase_id","quantity")
);
--> statement-breakpoint
CREATE TABLE "releases" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "releases_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"version" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"status" "release_status" DEFAULT 'draft' NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"published_by" integer,
	"published_at" timestamp with time zone,
	CONSTRAINT "releases_version_unique" UNIQUE("version"),
	CONSTRAINT "releases_version_format" CHECK ("releases"."version" ~ '^[0-9]{4}\.[0-9]{1,3}(-[a-z0-9]+)?$'),
	CONSTRAINT "releases_published_fields" CHECK (("releases"."status" = 'published') = ("releases"."published_at" is not null and "releases"."published_by" is not null))
);
--> statement-breakpoint
ALTER TABLE "species" ADD CONSTRAINT "species_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_phases" ADD CONSTRAINT "species_phases_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sources" ADD CONSTRAINT "sources_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "heat_capacity_ranges" ADD CONSTRAINT "heat_capacity_ranges_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_inputs" ADD CONSTRAINT "revision_inputs_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_inputs" ADD CONSTRAINT "revision_inputs_input_revision_id_revisions_id_fk" FOREIGN KEY ("input_revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_species_phase_id_species_phases_id_fk" FOREIGN KEY ("species_phase_id") REFERENCES "public"."species_phases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_source_id_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."sources"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_supersedes_id_revisions_id_fk" FOREIGN KEY ("supersedes_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_entries" ADD CONSTRAINT "release_entries_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_entries" ADD CONSTRAINT "release_entries_species_phase_id_species_phases_id_fk" FOREIGN KEY ("species_phase_id") REFERENCES "public"."species_phases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "release_entries" ADD CONSTRAINT "release_entries_revision_fk" FOREIGN KEY ("revision_id","species_phase_id","quantity") REFERENCES "public"."revisions"("id","species_phase_id","quantity") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "releases" ADD CONSTRAINT "releases_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "species_formula_idx" ON "species" USING btree ("formula");--> statement-breakpoint
CREATE UNIQUE INDEX "species_cas_rn_idx" ON "species" USING btree ("cas_rn");--> statement-breakpoint
CREATE UNIQUE INDEX "species_inchikey_idx" ON "species" USING btree ("inchi_key");--> statement-breakpoint
CREATE UNIQUE INDEX "sources_doi_idx" ON "sources" USING btree ("doi") WHERE "sources"."doi" is not null;--> statement-breakpoint
CREATE INDEX "revision_inputs_input_idx" ON "revision_inputs" USING btree ("input_revision_id");--> statement-breakpoint
CREATE UNIQUE INDEX "revisions_one_accepted_idx" ON "revisions" USING btree ("species_phase_id","quantity") WHERE "revisions"."status" = 'accepted';--> statement-breakpoint
CREATE INDEX "revisions_species_phase_idx" ON "revisions" USING btree ("species_phase_id","quantity","created_at");--> statement-breakpoint
CREATE INDEX "revisions_status_idx" ON "revisions" USING btree ("status");--> statement-breakpoint
CREATE INDEX "revisions_supersedes_idx" ON "revisions" USING btree ("supersedes_id");--> statement-breakpoint
CREATE INDEX "revisions_source_idx" ON "revisions" USING btree ("source_id");--> statement-breakpoint
CREATE INDEX "release_entries_revision_idx" ON "release_entries" USING btree ("revision_id");--> statement-breakpoint
CREATE INDEX "release_entries_species_phase_idx" ON "release_entries" USING btree ("species_phase_id");--> statement-breakpoint
CREATE INDEX "releases_published_idx" ON "releases" USING btree ("published_at") WHERE "releases"."status" = 'published';