CREATE TABLE "attachments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"test_run_id" uuid,
	"purpose" text NOT NULL,
	"object_key" text NOT NULL,
	"content_type" text NOT NULL,
	"byte_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"file_name" text NOT NULL,
	"caption" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "attachments_purpose" CHECK ("attachments"."purpose" in ('test-photo', 'underlay')),
	CONSTRAINT "attachments_byte_size_positive" CHECK ("attachments"."byte_size" > 0)
);
--> statement-breakpoint
CREATE TABLE "kit_underlays" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"view" text NOT NULL,
	"attachment_id" uuid NOT NULL,
	"placement" jsonb NOT NULL,
	"opacity" double precision DEFAULT 0.5 NOT NULL,
	"visible" boolean DEFAULT true NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "kit_underlays_view" CHECK ("kit_underlays"."view" in ('front', 'top')),
	CONSTRAINT "kit_underlays_opacity" CHECK ("kit_underlays"."opacity" >= 0.05 and "kit_underlays"."opacity" <= 1)
);
--> statement-breakpoint
CREATE TABLE "test_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"revision" integer NOT NULL,
	"tested_on" date NOT NULL,
	"part" text NOT NULL,
	"material_item_id" uuid,
	"material_name" text NOT NULL,
	"setup" jsonb NOT NULL,
	"outcome" text NOT NULL,
	"failure_location" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"neck_shear_stress_mpa" double precision,
	"prediction" jsonb,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" text,
	"updated_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "test_runs_number_positive" CHECK ("test_runs"."number" > 0),
	CONSTRAINT "test_runs_outcome" CHECK ("test_runs"."outcome" in ('held', 'worn', 'broke')),
	CONSTRAINT "test_runs_version_positive" CHECK ("test_runs"."version" > 0)
);
--> statement-breakpoint
ALTER TABLE "attachments" ADD CONSTRAINT "attachments_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachments" ADD CONSTRAINT "attachments_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachments" ADD CONSTRAINT "attachments_test_run_id_test_runs_id_fk" FOREIGN KEY ("test_run_id") REFERENCES "public"."test_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachments" ADD CONSTRAINT "attachments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_underlays" ADD CONSTRAINT "kit_underlays_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_underlays" ADD CONSTRAINT "kit_underlays_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_underlays" ADD CONSTRAINT "kit_underlays_attachment_id_attachments_id_fk" FOREIGN KEY ("attachment_id") REFERENCES "public"."attachments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_underlays" ADD CONSTRAINT "kit_underlays_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_material_item_id_shelf_items_id_fk" FOREIGN KEY ("material_item_id") REFERENCES "public"."shelf_items"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "test_runs" ADD CONSTRAINT "test_runs_revision_fk" FOREIGN KEY ("kit_id","revision") REFERENCES "public"."kit_revisions"("kit_id","number") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "attachments_object_key_idx" ON "attachments" USING btree ("object_key");--> statement-breakpoint
CREATE INDEX "attachments_kit_idx" ON "attachments" USING btree ("kit_id");--> statement-breakpoint
CREATE INDEX "attachments_test_run_idx" ON "attachments" USING btree ("test_run_id");--> statement-breakpoint
CREATE UNIQUE INDEX "kit_underlays_kit_view_idx" ON "kit_underlays" USING btree ("kit_id","view");--> statement-breakpoint
CREATE UNIQUE INDEX "test_runs_kit_number_idx" ON "test_runs" USING btree ("kit_id","number");--> statement-breakpoint
CREATE INDEX "test_runs_workspace_material_idx" ON "test_runs" USING btree ("workspace_id","material_item_id");