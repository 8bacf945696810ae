CREATE TYPE "public"."proposal_decision" AS ENUM('approve', 'reject', 'request_changes');--> statement-breakpoint
CREATE TYPE "public"."proposal_item_kind" AS ENUM('add_species', 'add_phase', 'add_value', 'supersede_value', 'retire_value', 'derive_value');--> statement-breakpoint
CREATE TYPE "public"."proposal_status" AS ENUM('draft', 'submitted', 'changes_requested', 'approved', 'rejected', 'withdrawn');--> statement-breakpoint
CREATE TABLE "proposal_comments" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "proposal_comments_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"proposal_id" integer NOT NULL,
	"author_id" integer NOT NULL,
	"body" text NOT NULL,
	"decision" "proposal_decision",
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposal_items" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "proposal_items_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"proposal_id" integer NOT NULL,
	"seq" integer NOT NULL,
	"kind" "proposal_item_kind" NOT NULL,
	"input" jsonb NOT NULL,
	"species_key" text,
	"phase" "phase",
	"modification" text,
	"quantity" text,
	"value" numeric,
	"uncertainty" numeric,
	"source_id" integer,
	"target_revision_id" integer,
	"created_revision_id" integer,
	"derivation" jsonb,
	"input_revision_ids" integer[] DEFAULT '{}'::integer[] NOT NULL,
	CONSTRAINT "proposal_items_seq" UNIQUE("proposal_id","seq")
);
--> statement-breakpoint
CREATE TABLE "proposals" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "proposals_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"author_id" integer NOT NULL,
	"rationale" text NOT NULL,
	"status" "proposal_status" DEFAULT 'draft' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"submitted_at" timestamp with time zone,
	"decided_by" integer,
	"decided_at" timestamp with time zone,
	CONSTRAINT "proposals_decided_fields" CHECK (("proposals"."decided_by" is null) = ("proposals"."decided_at" is null)),
	CONSTRAINT "proposals_final_decided" CHECK ("proposals"."status" not in ('approved', 'rejected') or "proposals"."decided_at" is not null),
	CONSTRAINT "proposals_not_own_decision" CHECK ("proposals"."decided_by" is distinct from "proposals"."author_id")
);
--> statement-breakpoint
ALTER TABLE "proposal_comments" ADD CONSTRAINT "proposal_comments_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_comments" ADD CONSTRAINT "proposal_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_items" ADD CONSTRAINT "proposal_items_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_items" ADD CONSTRAINT "proposal_items_source_id_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."sources"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_items" ADD CONSTRAINT "proposal_items_target_revision_id_revisions_id_fk" FOREIGN KEY ("target_revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_items" ADD CONSTRAINT "proposal_items_created_revision_id_revisions_id_fk" FOREIGN KEY ("created_revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "proposal_comments_proposal_idx" ON "proposal_comments" USING btree ("proposal_id","created_at");--> statement-breakpoint
CREATE INDEX "proposal_items_target_idx" ON "proposal_items" USING btree ("target_revision_id");--> statement-breakpoint
CREATE INDEX "proposal_items_species_idx" ON "proposal_items" USING btree ("species_key");--> statement-breakpoint
CREATE INDEX "proposals_status_idx" ON "proposals" USING btree ("status","updated_at");--> statement-breakpoint
CREATE INDEX "proposals_author_idx" ON "proposals" USING btree ("author_id");