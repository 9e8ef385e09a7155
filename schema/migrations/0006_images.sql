CREATE TYPE "public"."image_azimuth_reference" AS ENUM('north', 'highside');--> statement-breakpoint
CREATE TYPE "public"."image_kind" AS ENUM('amplitude', 'traveltime', 'optical');--> statement-breakpoint
CREATE TYPE "public"."image_north_reference" AS ENUM('magnetic', 'true');--> statement-breakpoint
CREATE TYPE "public"."image_source" AS ENUM('raster', 'las');--> statement-breakpoint
CREATE TYPE "public"."image_status" AS ENUM('processing', 'ready', 'failed');--> statement-breakpoint
CREATE TABLE "image_files" (
	"image_id" integer NOT NULL,
	"seq" integer NOT NULL,
	"bytes" "bytea" NOT NULL,
	CONSTRAINT "image_files_image_id_seq_pk" PRIMARY KEY("image_id","seq")
);
--> statement-breakpoint
CREATE TABLE "image_picks" (
	"structure_id" integer PRIMARY KEY NOT NULL,
	"image_id" integer,
	"points" jsonb NOT NULL,
	"centre_depth" double precision NOT NULL,
	"height_mm" double precision NOT NULL,
	"trough_azimuth" double precision NOT NULL,
	"diameter_mm" double precision NOT NULL,
	"azimuth_reference" "image_azimuth_reference" NOT NULL,
	"north_reference" "image_north_reference",
	"rms_mm" double precision NOT NULL,
	"suggested" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "image_tiles" (
	"image_id" integer NOT NULL,
	"level" integer NOT NULL,
	"tile" integer NOT NULL,
	"rows" integer NOT NULL,
	"bytes" "bytea" NOT NULL,
	CONSTRAINT "image_tiles_image_id_level_tile_pk" PRIMARY KEY("image_id","level","tile")
);
--> statement-breakpoint
CREATE TABLE "images" (
	"id" serial PRIMARY KEY NOT NULL,
	"hole_id" integer NOT NULL,
	"kind" "image_kind" NOT NULL,
	"source" "image_source" NOT NULL,
	"name" text NOT NULL,
	"file_name" text NOT NULL,
	"media_type" text NOT NULL,
	"file_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"top_depth" double precision NOT NULL,
	"bottom_depth" double precision NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"channels" integer NOT NULL,
	"sample_bits" integer NOT NULL,
	"value_min" double precision,
	"value_max" double precision,
	"value_unit" text,
	"left_azimuth" double precision DEFAULT 0 NOT NULL,
	"azimuth_reference" "image_azimuth_reference" NOT NULL,
	"north_reference" "image_north_reference",
	"diameter_mm" double precision NOT NULL,
	"diameter_source" text NOT NULL,
	"tile_rows" integer DEFAULT 256 NOT NULL,
	"levels" integer DEFAULT 0 NOT NULL,
	"status" "image_status" DEFAULT 'processing' NOT NULL,
	"progress" integer DEFAULT 0 NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"attempt" uuid,
	"lease_until" timestamp with time zone,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "images_depth_order" CHECK ("images"."bottom_depth" > "images"."top_depth"),
	CONSTRAINT "images_size" CHECK ("images"."width" > 0 and "images"."height" > 0)
);
--> statement-breakpoint
ALTER TABLE "image_files" ADD CONSTRAINT "image_files_image_id_images_id_fk" FOREIGN KEY ("image_id") REFERENCES "public"."images"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "image_picks" ADD CONSTRAINT "image_picks_structure_id_structures_id_fk" FOREIGN KEY ("structure_id") REFERENCES "public"."structures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "image_picks" ADD CONSTRAINT "image_picks_image_id_images_id_fk" FOREIGN KEY ("image_id") REFERENCES "public"."images"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "image_tiles" ADD CONSTRAINT "image_tiles_image_id_images_id_fk" FOREIGN KEY ("image_id") REFERENCES "public"."images"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "images" ADD CONSTRAINT "images_hole_id_holes_id_fk" FOREIGN KEY ("hole_id") REFERENCES "public"."holes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "images" ADD CONSTRAINT "images_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "image_picks_image_idx" ON "image_picks" USING btree ("image_id");--> statement-breakpoint
CREATE INDEX "images_hole_idx" ON "images" USING btree ("hole_id","created_at");