CREATE TYPE "public"."declination_mode" AS ENUM('auto', 'manual');--> statement-breakpoint
CREATE TYPE "public"."net_projection" AS ENUM('equal-area', 'equal-angle');--> statement-breakpoint
CREATE TYPE "public"."project_role" AS ENUM('viewer', 'logger', 'engineer', 'lead');--> statement-breakpoint
CREATE TYPE "public"."reference_line" AS ENUM('bottom', 'top');--> statement-breakpoint
CREATE TYPE "public"."azimuth_reference" AS ENUM('magnetic', 'true', 'grid');--> statement-breakpoint
CREATE TYPE "public"."hole_status" AS ENUM('planned', 'drilling', 'complete', 'abandoned');--> statement-breakpoint
CREATE TYPE "public"."import_kind" AS ENUM('survey', 'runs', 'structures', 'picks', 'las');--> statement-breakpoint
CREATE TYPE "public"."import_status" AS ENUM('previewed', 'queued', 'committing', 'committed', 'failed');--> statement-breakpoint
CREATE TYPE "public"."mark_confidence" AS ENUM('good', 'fair', 'poor', 'none');--> statement-breakpoint
CREATE TYPE "public"."structure_source" AS ENUM('core', 'image', 'true');--> statement-breakpoint
CREATE TYPE "public"."structure_type" AS ENUM('joint', 'bedding', 'foliation', 'fault', 'vein', 'shear', 'contact', 'cleavage', 'broken-zone');--> statement-breakpoint
CREATE TYPE "public"."interval_status" AS ENUM('draft', 'checked', 'approved', 'issued');--> statement-breakpoint
CREATE TYPE "public"."set_rule" AS ENUM('cone', 'cluster');--> statement-breakpoint
CREATE TABLE "sessions" (
	"sid" varchar PRIMARY KEY NOT NULL,
	"sess" json NOT NULL,
	"expire" timestamp (6) NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" serial PRIMARY KEY NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"is_admin" boolean DEFAULT false NOT NULL,
	"disabled" boolean DEFAULT false NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"project_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"role" "project_role" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_project_id_user_id_pk" PRIMARY KEY("project_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "projects" (
	"id" serial PRIMARY KEY NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"crs_epsg" integer NOT NULL,
	"declination_mode" "declination_mode" DEFAULT 'manual' NOT NULL,
	"declination_deg" double precision DEFAULT 0 NOT NULL,
	"grid_convergence_deg" double precision DEFAULT 0 NOT NULL,
	"reference_line" "reference_line" DEFAULT 'bottom' NOT NULL,
	"steep_threshold_deg" double precision DEFAULT 85 NOT NULL,
	"net_projection" "net_projection" DEFAULT 'equal-area' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "projects_code_unique" UNIQUE("code")
);
--> statement-breakpoint
CREATE TABLE "holes" (
	"id" serial PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"name" text NOT NULL,
	"collar_east" double precision NOT NULL,
	"collar_north" double precision NOT NULL,
	"collar_elevation" double precision NOT NULL,
	"planned_azimuth" double precision NOT NULL,
	"planned_plunge" double precision NOT NULL,
	"final_depth" double precision NOT NULL,
	"core_size" text DEFAULT 'HQ' NOT NULL,
	"start_date" date,
	"status" "hole_status" DEFAULT 'planned' NOT NULL,
	"survey_revision" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "holes_project_name_unique" UNIQUE("project_id","name"),
	CONSTRAINT "holes_final_depth_positive" CHECK ("holes"."final_depth" > 0),
	CONSTRAINT "holes_planned_plunge_range" CHECK ("holes"."planned_plunge" between -90 and 90)
);
--> statement-breakpoint
CREATE TABLE "survey_stations" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"depth" double precision NOT NULL,
	"azimuth" double precision NOT NULL,
	"plunge" double precision NOT NULL,
	"azimuth_reference" "azimuth_reference" DEFAULT 'true' NOT NULL,
	"azimuth_entered" double precision NOT NULL,
	"declination_applied" double precision DEFAULT 0 NOT NULL,
	"convergence_applied" double precision DEFAULT 0 NOT NULL,
	"plunge_convention" text DEFAULT 'plunge-down' NOT NULL,
	"method" text DEFAULT '' NOT NULL,
	"surveyed_on" date,
	"version" integer DEFAULT 1 NOT NULL,
	CONSTRAINT "survey_stations_hole_depth_unique" UNIQUE("hole_id","depth"),
	CONSTRAINT "survey_stations_depth_nonnegative" CHECK ("survey_stations"."depth" >= 0),
	CONSTRAINT "survey_stations_plunge_range" CHECK ("survey_stations"."plunge" between -90 and 90),
	CONSTRAINT "survey_stations_azimuth_range" CHECK ("survey_stations"."azimuth" >= 0 and "survey_stations"."azimuth" < 360)
);
--> statement-breakpoint
CREATE TABLE "audit_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"project_id" integer,
	"user_id" integer,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text NOT NULL,
	"action" text NOT NULL,
	"before" jsonb,
	"after" jsonb
);
--> statement-breakpoint
CREATE TABLE "imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" integer NOT NULL,
	"hole_id" integer,
	"kind" "import_kind" NOT NULL,
	"status" "import_status" DEFAULT 'previewed' NOT NULL,
	"file_name" text NOT NULL,
	"file" "bytea" NOT NULL,
	"options" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"row_count" integer DEFAULT 0 NOT NULL,
	"error_count" integer DEFAULT 0 NOT NULL,
	"errors" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"progress" integer DEFAULT 0 NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"committed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "core_runs" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"from_depth" double precision NOT NULL,
	"to_depth" double precision NOT NULL,
	"recovered" double precision NOT NULL,
	"solid" double precision NOT NULL,
	"rqd_length" double precision NOT NULL,
	"fracture_count" integer DEFAULT 0 NOT NULL,
	"mark_confidence" "mark_confidence" DEFAULT 'good' NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"import_id" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "core_runs_order" CHECK ("core_runs"."to_depth" > "core_runs"."from_depth")
);
--> statement-breakpoint
CREATE TABLE "structures" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"depth" double precision NOT NULL,
	"type" "structure_type" NOT NULL,
	"source" "structure_source" DEFAULT 'core' NOT NULL,
	"alpha" double precision,
	"beta" double precision,
	"gamma" double precision,
	"gamma_convention" text,
	"reference_line" "reference_line",
	"input_dip" double precision,
	"input_dip_direction" double precision,
	"pick_amplitude" double precision,
	"pick_diameter" double precision,
	"pick_trough_azimuth" double precision,
	"pick_reference" text,
	"pick_azimuth_reference" text,
	"pick_quality" text,
	"dip" double precision,
	"dip_direction" double precision,
	"pole_trend" double precision,
	"pole_plunge" double precision,
	"hole_trend" double precision,
	"hole_plunge" double precision,
	"east" double precision,
	"north" double precision,
	"elevation" double precision,
	"terzaghi_weight" double precision,
	"declination_applied" double precision,
	"survey_revision" integer,
	"flags" text[] DEFAULT '{}'::text[] NOT NULL,
	"roughness" text,
	"jrc" double precision,
	"aperture_mm" double precision,
	"infill_type" text,
	"infill_thickness_mm" double precision,
	"persistence" text,
	"wall_weathering" text,
	"state" text,
	"confidence" text,
	"comment" text DEFAULT '' NOT NULL,
	"import_id" uuid,
	"created_by" integer,
	"updated_by" integer,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "structures_alpha_range" CHECK ("structures"."alpha" is null or "structures"."alpha" between 0 and 90),
	CONSTRAINT "structures_beta_range" CHECK ("structures"."beta" is null or ("structures"."beta" >= 0 and "structures"."beta" <= 360))
);
--> statement-breakpoint
CREATE TABLE "log_curves" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"import_id" uuid,
	"mnemonic" text NOT NULL,
	"unit" text DEFAULT '' NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"source_file" text NOT NULL,
	"depth_shift" double precision DEFAULT 0 NOT NULL,
	"depths" double precision[] NOT NULL,
	"values" double precision[] NOT NULL,
	"min_depth" double precision NOT NULL,
	"max_depth" double precision NOT NULL
);
--> statement-breakpoint
CREATE TABLE "domains" (
	"id" serial PRIMARY KEY NOT NULL,
	"project_id" integer NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	CONSTRAINT "domains_project_name_unique" UNIQUE("project_id","name")
);
--> statement-breakpoint
CREATE TABLE "intervals" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"domain_id" integer,
	"name" text NOT NULL,
	"from_depth" double precision NOT NULL,
	"to_depth" double precision NOT NULL,
	"status" interval_status DEFAULT 'draft' NOT NULL,
	"face_dip" double precision,
	"face_dip_direction" double precision,
	"friction_deg" double precision,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "intervals_order" CHECK ("intervals"."to_depth" > "intervals"."from_depth")
);
--> statement-breakpoint
CREATE TABLE "set_members" (
	"set_id" integer NOT NULL,
	"structure_id" integer NOT NULL,
	CONSTRAINT "set_members_set_id_structure_id_pk" PRIMARY KEY("set_id","structure_id")
);
--> statement-breakpoint
CREATE TABLE "structure_sets" (
	"id" serial PRIMARY KEY NOT NULL,
	"interval_id" integer NOT NULL,
	"name" text NOT NULL,
	"rule" "set_rule" DEFAULT 'cone' NOT NULL,
	"centre_trend" double precision NOT NULL,
	"centre_plunge" double precision NOT NULL,
	"cone_angle" double precision DEFAULT 20 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL
);
--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holes" ADD CONSTRAINT "holes_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "survey_stations" ADD CONSTRAINT "survey_stations_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "core_runs" ADD CONSTRAINT "core_runs_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "core_runs" ADD CONSTRAINT "core_runs_import_id_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."imports"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_import_id_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."imports"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structures" ADD CONSTRAINT "structures_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_curves" ADD CONSTRAINT "log_curves_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_curves" ADD CONSTRAINT "log_curves_import_id_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."imports"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "domains" ADD CONSTRAINT "domains_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intervals" ADD CONSTRAINT "intervals_domain_id_domains_id_fk" FOREIGN KEY ("domain_id") REFERENCES "public"."domains"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_members" ADD CONSTRAINT "set_members_set_id_structure_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."structure_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_members" ADD CONSTRAINT "set_members_structure_id_structures_id_fk" FOREIGN KEY ("structure_id") REFERENCES "public"."structures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "structure_sets" ADD CONSTRAINT "structure_sets_interval_id_intervals_id_fk" FOREIGN KEY ("interval_id") REFERENCES "public"."intervals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sessions_expire_idx" ON "sessions" USING btree ("expire");--> statement-breakpoint
CREATE INDEX "audit_events_project_at_idx" ON "audit_events" USING btree ("project_id","at");--> statement-breakpoint
CREATE INDEX "imports_project_idx" ON "imports" USING btree ("project_id","created_at");--> statement-breakpoint
CREATE INDEX "core_runs_hole_from_idx" ON "core_runs" USING btree ("hole_id","from_depth");--> statement-breakpoint
CREATE INDEX "structures_hole_depth_idx" ON "structures" USING btree ("hole_id","depth");--> statement-breakpoint
CREATE INDEX "log_curves_hole_idx" ON "log_curves" USING btree ("hole_id");