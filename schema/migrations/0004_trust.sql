CREATE TYPE "public"."convergence_mode" AS ENUM('auto', 'manual');--> statement-breakpoint
CREATE TYPE "public"."analysis_weighting" AS ENUM('terzaghi', 'none');--> statement-breakpoint
CREATE TYPE "public"."contour_method" AS ENUM('kamb', 'exponential');--> statement-breakpoint
ALTER TYPE "public"."import_status" ADD VALUE 'undone';--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "convergence_mode" "convergence_mode" DEFAULT 'auto' NOT NULL;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "four_eyes" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "sha256" text;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "replaced" jsonb;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "undone_by" integer;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "undone_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "intervals" ADD COLUMN "weighting" "analysis_weighting" DEFAULT 'terzaghi' NOT NULL;--> statement-breakpoint
ALTER TABLE "intervals" ADD COLUMN "contour_method" "contour_method" DEFAULT 'kamb' NOT NULL;--> statement-breakpoint
ALTER TABLE "intervals" ADD COLUMN "lateral_limit_deg" double precision DEFAULT 20 NOT NULL;--> statement-breakpoint
ALTER TABLE "intervals" ADD COLUMN "toppling_limit_deg" double precision DEFAULT 30 NOT NULL;--> statement-breakpoint
ALTER TABLE "packs" ADD COLUMN "draft" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_undone_by_users_id_fk" FOREIGN KEY ("undone_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;