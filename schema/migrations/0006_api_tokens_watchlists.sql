CREATE TABLE "api_tokens" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "api_tokens_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"user_id" integer NOT NULL,
	"name" text NOT NULL,
	"prefix" text NOT NULL,
	"hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "api_tokens_prefix_unique" UNIQUE("prefix"),
	CONSTRAINT "api_tokens_prefix_format" CHECK ("api_tokens"."prefix" ~ '^thp_[0-9a-f]{16}$'),
	CONSTRAINT "api_tokens_hash_format" CHECK ("api_tokens"."hash" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "api_tokens_name_length" CHECK (char_length("api_tokens"."name") between 1 and 100)
);
--> statement-breakpoint
CREATE TABLE "watchlists" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "watchlists_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"owner_id" integer NOT NULL,
	"name" text NOT NULL,
	"reactions" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "watchlists_owner_name" UNIQUE("owner_id","name"),
	CONSTRAINT "watchlists_name_length" CHECK (char_length("watchlists"."name") between 1 and 100),
	CONSTRAINT "watchlists_reactions_array" CHECK (jsonb_typeof("watchlists"."reactions") = 'array' and jsonb_array_length("watchlists"."reactions") <= 1000)
);
--> statement-breakpoint
ALTER TABLE "api_tokens" ADD CONSTRAINT "api_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "watchlists" ADD CONSTRAINT "watchlists_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "api_tokens_user_idx" ON "api_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "watchlists_owner_idx" ON "watchlists" USING btree ("owner_id");