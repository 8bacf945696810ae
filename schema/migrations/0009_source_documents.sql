CREATE TABLE "source_documents" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "source_documents_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"source_id" integer NOT NULL,
	"key" text NOT NULL,
	"sha256" text NOT NULL,
	"size" bigint NOT NULL,
	"file_name" text NOT NULL,
	"uploaded_by" integer NOT NULL,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "source_documents_key_unique" UNIQUE("key"),
	CONSTRAINT "source_documents_sha256_format" CHECK ("source_documents"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "source_documents_size_positive" CHECK ("source_documents"."size" > 0)
);
--> statement-breakpoint
ALTER TABLE "source_documents" ADD CONSTRAINT "source_documents_source_id_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."sources"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "source_documents" ADD CONSTRAINT "source_documents_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "source_documents_source_idx" ON "source_documents" USING btree ("source_id");