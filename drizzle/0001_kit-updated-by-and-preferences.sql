CREATE TABLE "user_preferences" (
	"user_id" text PRIMARY KEY NOT NULL,
	"length_unit" text DEFAULT 'mm' NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "user_preferences_length_unit" CHECK ("user_preferences"."length_unit" in ('mm', 'in'))
);
--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "updated_by" text;--> statement-breakpoint
ALTER TABLE "user_preferences" ADD CONSTRAINT "user_preferences_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kits" ADD CONSTRAINT "kits_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
UPDATE "kits" SET "updated_by" = "created_by" WHERE "updated_by" IS NULL;
