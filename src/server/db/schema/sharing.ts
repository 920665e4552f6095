import { sql } from "drizzle-orm";
import { boolean, check, doublePrecision, foreignKey, index, integer, pgTable, text, timestamp, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";
import { kitRevisions, kits } from "./kits";

export const COMMENT_VIEWS = ["front", "top", "joint"] as const;

/**
 * A read-only link to a kit for someone outside the workspace: the kit's head, or one pinned revision.
 * Only the SHA-256 of its token is kept (the token itself is shown once, when the link is made), so a
 * copy of the database opens nothing. Revoked links stay as rows (who made and revoked what) but answer 404.
 */
export const shareLinks = pgTable(
  "share_links",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    // hex SHA-256 of the 256-bit random token
    tokenHash: text("token_hash").notNull().unique(),
    // null: the kit's head, whichever revision that is when the link is opened
    revision: integer("revision"),
    allowComments: boolean("allow_comments").notNull().default(false),
    label: text("label").notNull().default(""),
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("share_links_kit_idx").on(t.kitId, t.createdAt),
    foreignKey({ name: "share_links_revision_fk", columns: [t.kitId, t.revision], foreignColumns: [kitRevisions.kitId, kitRevisions.number] }).onDelete("cascade"),
    check("share_links_revision_positive", sql`${t.revision} is null or ${t.revision} > 0`),
  ],
);

/**
 * A comment pinned to a point of one view of one revision (x, y: the view's drawing plane, mm), or a reply
 * to one (a reply carries its thread's pin). Written by a member (author_id) or, through a share link that
 * allows comments, by a reviewer who gave a display name (share_link_id set, author_id null).
 */
export const kitComments = pgTable(
  "kit_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    view: text("view").notNull(),
    xMm: doublePrecision("x_mm").notNull(),
    yMm: doublePrecision("y_mm").notNull(),
    parentId: uuid("parent_id").references((): AnyPgColumn => kitComments.id, { onDelete: "cascade" }),
    body: text("body").notNull(),
    authorId: text("author_id").references(() => users.id, { onDelete: "set null" }),
    // The name shown: the member's name when written, or the reviewer's display name.
    authorName: text("author_name").notNull(),
    shareLinkId: uuid("share_link_id").references(() => shareLinks.id, { onDelete: "set null" }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    resolvedByName: text("resolved_by_name"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("kit_comments_kit_idx").on(t.kitId, t.createdAt),
    index("kit_comments_parent_idx").on(t.parentId),
    foreignKey({ name: "kit_comments_revision_fk", columns: [t.kitId, t.revision], foreignColumns: [kitRevisions.kitId, kitRevisions.number] }).onDelete("cascade"),
    check("kit_comments_view", sql`${t.view} in ('front', 'top', 'joint')`),
  ],
);
