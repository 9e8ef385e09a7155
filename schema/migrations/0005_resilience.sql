CREATE TABLE "idempotency_keys" (
	"user_id" integer NOT NULL,
	"key" text NOT NULL,
	"route" text NOT NULL,
	"request_hash" text NOT NULL,
	"status" integer NOT NULL,
	"body" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "idempotency_keys_user_id_key_pk" PRIMARY KEY("user_id","key")
);
--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "deleted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "deleted_by" integer;--> statement-breakpoint
ALTER TABLE "holes" ADD COLUMN "deleted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "holes" ADD COLUMN "deleted_by" integer;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "attempt" uuid;--> statement-breakpoint
ALTER TABLE "imports" ADD COLUMN "lease_until" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "packs" ADD COLUMN "attempt" uuid;--> statement-breakpoint
ALTER TABLE "packs" ADD COLUMN "lease_until" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "idempotency_keys" ADD CONSTRAINT "idempotency_keys_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;