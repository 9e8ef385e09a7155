CREATE TYPE "public"."adjustment_kind" AS ENUM('depth-shift', 'run-rotation');--> statement-breakpoint
CREATE TABLE "reconciliation_adjustments" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"kind" "adjustment_kind" NOT NULL,
	"run_id" integer,
	"value" double precision NOT NULL,
	"previous" double precision DEFAULT 0 NOT NULL,
	"basis" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"undone_by" integer,
	"undone_at" timestamp with time zone,
	CONSTRAINT "reconciliation_adjustments_run" CHECK (("reconciliation_adjustments"."kind" = 'run-rotation') = ("reconciliation_adjustments"."run_id" is not null))
);
--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "error_model" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "beta_rotation_applied" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "depth_shift_applied" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty95" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty_major" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty_minor" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty_axis_trend" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty_axis_plunge" double precision;--> statement-breakpoint
ALTER TABLE "structures" ADD COLUMN "uncertainty_reasons" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "images" ADD COLUMN "depth_shift_applied" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "reconciliation_adjustments" ADD CONSTRAINT "reconciliation_adjustments_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reconciliation_adjustments" ADD CONSTRAINT "reconciliation_adjustments_run_id_core_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."core_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reconciliation_adjustments" ADD CONSTRAINT "reconciliation_adjustments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reconciliation_adjustments" ADD CONSTRAINT "reconciliation_adjustments_undone_by_users_id_fk" FOREIGN KEY ("undone_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reconciliation_adjustments_hole_idx" ON "reconciliation_adjustments" USING btree ("hole_id","created_at");