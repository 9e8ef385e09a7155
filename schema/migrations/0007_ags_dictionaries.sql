CREATE TABLE "ags_dictionaries" (
	"edition" text PRIMARY KEY NOT NULL,
	"file_name" text NOT NULL,
	"file_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"group_count" integer NOT NULL,
	"heading_count" integer NOT NULL,
	"loaded_by" integer,
	"loaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "ags_dictionaries_edition_form" CHECK ("ags_dictionaries"."edition" ~ '^4\.[0-9]{1,2}(\.[0-9]{1,2})?$')
);
--> statement-breakpoint
CREATE TABLE "ags_dictionary_groups" (
	"edition" text NOT NULL,
	"name" text NOT NULL,
	"position" integer NOT NULL,
	"parent" text,
	"title" text NOT NULL,
	"headings" jsonb NOT NULL,
	CONSTRAINT "ags_dictionary_groups_edition_name_pk" PRIMARY KEY("edition","name")
);
--> statement-breakpoint
ALTER TABLE "ags_dictionaries" ADD CONSTRAINT "ags_dictionaries_loaded_by_users_id_fk" FOREIGN KEY ("loaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "ags_dictionary_groups" ADD CONSTRAINT "ags_dictionary_groups_edition_ags_dictionaries_edition_fk" FOREIGN KEY ("edition") REFERENCES "public"."ags_dictionaries"("edition") ON DELETE cascade ON UPDATE no action;