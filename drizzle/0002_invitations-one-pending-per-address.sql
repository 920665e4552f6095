-- Addresses are compared lower-case; of any pending duplicates only the newest stays pending (hand-added before the index).
UPDATE "workspace_invitations" SET "email" = lower("email") WHERE "email" <> lower("email");--> statement-breakpoint
UPDATE "workspace_invitations" AS i SET "status" = 'canceled' WHERE i."status" = 'pending' AND EXISTS (SELECT 1 FROM "workspace_invitations" AS j WHERE j."status" = 'pending' AND j."workspace_id" = i."workspace_id" AND j."email" = i."email" AND (j."created_at", j."id") > (i."created_at", i."id"));--> statement-breakpoint
CREATE UNIQUE INDEX "workspace_invitations_pending_idx" ON "workspace_invitations" USING btree ("workspace_id","email") WHERE "workspace_invitations"."status" = 'pending';
