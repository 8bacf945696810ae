ALTER TABLE "heat_capacity_ranges" DROP CONSTRAINT "heat_capacity_ranges_coefficients";--> statement-breakpoint
ALTER TABLE "species" ADD COLUMN "notes" text;--> statement-breakpoint
ALTER TABLE "heat_capacity_ranges" ADD CONSTRAINT "heat_capacity_ranges_coefficients" CHECK (cardinality("heat_capacity_ranges"."coefficients") between 5 and 8);