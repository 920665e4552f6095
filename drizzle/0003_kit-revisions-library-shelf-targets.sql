CREATE TABLE "kit_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kit_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"layout" jsonb NOT NULL,
	"summary" jsonb,
	"note" text DEFAULT '' NOT NULL,
	"kind" text DEFAULT 'save' NOT NULL,
	"restored_from" integer,
	"author_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "kit_revisions_number_positive" CHECK ("kit_revisions"."number" > 0),
	CONSTRAINT "kit_revisions_kind" CHECK ("kit_revisions"."kind" in ('create', 'save', 'restore', 'variant', 'shelf', 'migrated'))
);
--> statement-breakpoint
CREATE TABLE "shelf_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kind" text NOT NULL,
	"name" text NOT NULL,
	"spec" jsonb NOT NULL,
	"catalogue_id" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" text,
	"updated_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "shelf_items_kind" CHECK ("shelf_items"."kind" in ('material', 'joint', 'shaft')),
	CONSTRAINT "shelf_items_version_positive" CHECK ("shelf_items"."version" > 0)
);
--> statement-breakpoint
CREATE TABLE "workspace_settings" (
	"workspace_id" text PRIMARY KEY NOT NULL,
	"min_lock_deg" double precision NOT NULL,
	"max_joint_angle_deg" double precision NOT NULL,
	"min_safety_factor" double precision NOT NULL,
	"ackermann_min_pct" double precision NOT NULL,
	"ackermann_max_pct" double precision NOT NULL,
	"min_neck_clearance_mm" double precision NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "workspace_settings_ackermann_range" CHECK ("workspace_settings"."ackermann_min_pct" <= "workspace_settings"."ackermann_max_pct")
);
--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "tags" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "head_revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "origin_kit_id" uuid;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "origin_revision" integer;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "target_overrides" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "lock_deg" double precision;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "lock_limited_by" text;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "max_joint_angle_deg" double precision;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "ackermann_pct" double precision;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "safety_factor" double precision;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "neck_clearance_mm" double precision;--> statement-breakpoint
ALTER TABLE "kits" ADD COLUMN "shelf_refs" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "kit_revisions" ADD CONSTRAINT "kit_revisions_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_revisions" ADD CONSTRAINT "kit_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_items" ADD CONSTRAINT "shelf_items_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_items" ADD CONSTRAINT "shelf_items_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shelf_items" ADD CONSTRAINT "shelf_items_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "workspace_settings" ADD CONSTRAINT "workspace_settings_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "workspace_settings" ADD CONSTRAINT "workspace_settings_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "kit_revisions_kit_number_idx" ON "kit_revisions" USING btree ("kit_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "shelf_items_workspace_kind_name_idx" ON "shelf_items" USING btree ("workspace_id","kind","name");--> statement-breakpoint
ALTER TABLE "kits" ADD CONSTRAINT "kits_origin_kit_id_kits_id_fk" FOREIGN KEY ("origin_kit_id") REFERENCES "public"."kits"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "kits_workspace_name_idx" ON "kits" USING btree ("workspace_id",lower("name"));--> statement-breakpoint
CREATE INDEX "kits_workspace_lock_idx" ON "kits" USING btree ("workspace_id","lock_deg");--> statement-breakpoint
CREATE INDEX "kits_workspace_joint_idx" ON "kits" USING btree ("workspace_id","max_joint_angle_deg");--> statement-breakpoint
CREATE INDEX "kits_workspace_ackermann_idx" ON "kits" USING btree ("workspace_id","ackermann_pct");--> statement-breakpoint
CREATE INDEX "kits_workspace_safety_idx" ON "kits" USING btree ("workspace_id","safety_factor");--> statement-breakpoint
CREATE INDEX "kits_workspace_clearance_idx" ON "kits" USING btree ("workspace_id","neck_clearance_mm");--> statement-breakpoint
CREATE INDEX "kits_tags_idx" ON "kits" USING gin ("tags");--> statement-breakpoint
CREATE INDEX "kits_shelf_refs_idx" ON "kits" USING gin ("shelf_refs");--> statement-breakpoint
-- Every kit saved before revisions were kept becomes revision 1 of itself, carrying the layout the kit row
-- held; its summary is computed by the engine right after the migrations (scripts/migrate.ts backfills
-- every revision without one). Then the layout lives only in kit_revisions.
INSERT INTO "kit_revisions" ("kit_id", "number", "layout", "note", "kind", "author_id", "created_at")
SELECT "id", 1, "layout", '', 'migrated', COALESCE("updated_by", "created_by"), "updated_at" FROM "kits";--> statement-breakpoint
ALTER TABLE "kits" DROP COLUMN "layout";--> statement-breakpoint
ALTER TABLE "kits" ADD CONSTRAINT "kits_head_revision_positive" CHECK ("kits"."head_revision" > 0);