CREATE TABLE "kit_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"view" text NOT NULL,
	"x_mm" double precision NOT NULL,
	"y_mm" double precision NOT NULL,
	"parent_id" uuid,
	"body" text NOT NULL,
	"author_id" text,
	"author_name" text NOT NULL,
	"share_link_id" uuid,
	"resolved_at" timestamp with time zone,
	"resolved_by_name" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "kit_comments_view" CHECK ("kit_comments"."view" in ('front', 'top', 'joint'))
);
--> statement-breakpoint
CREATE TABLE "share_links" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" text NOT NULL,
	"kit_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"revision" integer,
	"allow_comments" boolean DEFAULT false NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"expires_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "share_links_token_hash_unique" UNIQUE("token_hash"),
	CONSTRAINT "share_links_revision_positive" CHECK ("share_links"."revision" is null or "share_links"."revision" > 0)
);
--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_parent_id_kit_comments_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."kit_comments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_share_link_id_share_links_id_fk" FOREIGN KEY ("share_link_id") REFERENCES "public"."share_links"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_comments" ADD CONSTRAINT "kit_comments_revision_fk" FOREIGN KEY ("kit_id","revision") REFERENCES "public"."kit_revisions"("kit_id","number") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_links" ADD CONSTRAINT "share_links_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_links" ADD CONSTRAINT "share_links_kit_id_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."kits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_links" ADD CONSTRAINT "share_links_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_links" ADD CONSTRAINT "share_links_revision_fk" FOREIGN KEY ("kit_id","revision") REFERENCES "public"."kit_revisions"("kit_id","number") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "kit_comments_kit_idx" ON "kit_comments" USING btree ("kit_id","created_at");--> statement-breakpoint
CREATE INDEX "kit_comments_parent_idx" ON "kit_comments" USING btree ("parent_id");--> statement-breakpoint
CREATE INDEX "share_links_kit_idx" ON "share_links" USING btree ("kit_id","created_at");