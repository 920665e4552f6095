import { sql } from "drizzle-orm";
import { check, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";

export const kits = pgTable(
  "kits",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    scale: text("scale").notNull(),
    notes: text("notes").notNull().default(""),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    // The layout lives in kit_revisions; the kit names its latest (head) revision.
    headRevision: integer("head_revision").notNull().default(1),
    // Optimistic locking: every write names the version it was based on and bumps it.
    version: integer("version").notNull().default(1),
    // Archived kits leave the library's default view; nothing is deleted.
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    // A variant remembers the kit and revision it was made from (the origin may be deleted later).
    originKitId: uuid("origin_kit_id").references((): AnyPgColumn => kits.id, { onDelete: "set null" }),
    originRevision: integer("origin_revision"),
    // Per-kit targets that replace the workspace's (only the keys set).
    targetOverrides: jsonb("target_overrides").$type<Record<string, number>>().notNull().default({}),
    // The head revision's key readouts, copied from its cached summary so the library sorts on columns.
    lockDeg: doublePrecision("lock_deg"),
    lockLimitedBy: text("lock_limited_by"),
    maxJointAngleDeg: doublePrecision("max_joint_angle_deg"),
    ackermannPct: doublePrecision("ackermann_pct"),
    safetyFactor: doublePrecision("safety_factor"),
    neckClearanceMm: doublePrecision("neck_clearance_mm"),
    // The shelf items the head layout takes figures from (layout.shelf's ids), so a shelf edit finds its kits by index.
    shelfRefs: text("shelf_refs").array().notNull().default(sql`'{}'::text[]`),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    // Who wrote the current version: a conflicting save names them.
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("kits_workspace_idx").on(t.workspaceId, t.updatedAt),
    // One index per sortable column of the library, led by the workspace: a page of 50 in order is an index walk.
    index("kits_workspace_name_idx").on(t.workspaceId, sql`lower(${t.name})`),
    index("kits_workspace_lock_idx").on(t.workspaceId, t.lockDeg),
    index("kits_workspace_joint_idx").on(t.workspaceId, t.maxJointAngleDeg),
    index("kits_workspace_ackermann_idx").on(t.workspaceId, t.ackermannPct),
    index("kits_workspace_safety_idx").on(t.workspaceId, t.safetyFactor),
    index("kits_workspace_clearance_idx").on(t.workspaceId, t.neckClearanceMm),
    index("kits_tags_idx").using("gin", t.tags),
    index("kits_shelf_refs_idx").using("gin", t.shelfRefs),
    check("kits_version_positive", sql`${t.version} > 0`),
    check("kits_head_revision_positive", sql`${t.headRevision} > 0`),
  ],
);

export const REVISION_KINDS = ["create", "save", "restore", "variant", "shelf", "migrated"] as const;

/** Every saved layout of a kit, numbered from 1; never changed or deleted while the kit lives. */
export const kitRevisions = pgTable(
  "kit_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    layout: jsonb("layout").$type<unknown>().notNull(),
    // Key readouts of this layout, computed by the engine when it was saved (null until computed).
    summary: jsonb("summary").$type<unknown>(),
    note: text("note").notNull().default(""),
    kind: text("kind").notNull().default("save"),
    // For a restore: the revision whose layout this one brought back.
    restoredFrom: integer("restored_from"),
    authorId: text("author_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("kit_revisions_kit_number_idx").on(t.kitId, t.number),
    check("kit_revisions_number_positive", sql`${t.number} > 0`),
    check("kit_revisions_kind", sql`${t.kind} in ('create', 'save', 'restore', 'variant', 'shelf', 'migrated')`),
  ],
);
