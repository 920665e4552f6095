CREATE TABLE "design_search_batches" (
	"search_id" uuid NOT NULL,
	"index" integer NOT NULL,
	"phase" text NOT NULL,
	"plan" jsonb NOT NULL,
	"job_id" uuid NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"tried" integer DEFAULT 0 NOT NULL,
	"result" jsonb,
	"finished_at" timestamp with time zone,
	CONSTRAINT "design_search_batches_search_id_index_pk" PRIMARY KEY("search_id","index"),
	CONSTRAINT "design_search_batches_status" CHECK ("design_search_batches"."status" in ('queued', 'done'))
);
--> statement-breakpoint
CREATE TABLE "design_searches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"base_revision" integer NOT NULL,
	"base_layout" jsonb NOT NULL,
	"question" jsonb NOT NULL,
	"status" text DEFAULT 'running' NOT NULL,
	"phase" text DEFAULT 'sample' NOT NULL,
	"tried" integer DEFAULT 0 NOT NULL,
	"planned" integer NOT NULL,
	"batches_done" integer DEFAULT 0 NOT NULL,
	"batches_total" integer NOT NULL,
	"best" jsonb,
	"answer" jsonb,
	"error" text,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone,
	CONSTRAINT "design_searches_status" CHECK ("design_searches"."status" in ('running', 'done', 'cancelled', 'failed')),
	CONSTRAINT "design_searches_phase" CHECK ("design_searches"."phase" in ('sample', 'refine', 'finished'))
);
--> statement-breakpoint
ALTER TABLE "design_search_batches" ADD CONSTRAINT "design_search_batches_search_id_design_searches_id_fk" FOREIGN KEY ("search_id") REFERENCES "public"."design_searches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_searches" ADD CONSTRAINT "design_searches_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_searches" ADD CONSTRAINT "design_searches_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_searches" ADD CONSTRAINT "design_searches_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "design_searches_kit_idx" ON "design_searches" USING btree ("kit_id","created_at");--> statement-breakpoint
CREATE INDEX "design_searches_running_idx" ON "design_searches" USING btree ("status");