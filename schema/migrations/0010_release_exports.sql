CREATE TABLE "release_exports" (
	"release_id" integer NOT NULL,
	"format" text NOT NULL,
	"sha256" text NOT NULL,
	"bytes" integer NOT NULL,
	"content" "bytea" NOT NULL,
	CONSTRAINT "release_exports_release_id_format_pk" PRIMARY KEY("release_id","format"),
	CONSTRAINT "release_exports_format" CHECK ("release_exports"."format" in ('csv', 'json', 'xml')),
	CONSTRAINT "release_exports_sha256" CHECK ("release_exports"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "release_exports_bytes" CHECK ("release_exports"."bytes" = octet_length("release_exports"."content"))
);
--> statement-breakpoint
ALTER TABLE "release_exports" ADD CONSTRAINT "release_exports_release_id_releases_id_fk" FOREIGN KEY ("release_id") REFERENCES "public"."releases"("id") ON DELETE no action ON UPDATE no action;