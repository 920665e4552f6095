import { sql } from "drizzle-orm";
import { check, doublePrecision, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";

/**
 * A workspace's design-library settings: the targets readouts are judged against. The row is made on first
 * use, and the shelf is seeded from the engine's catalogue in the same transaction (so exactly once).
 */
export const workspaceSettings = pgTable(
  "workspace_settings",
  {
    workspaceId: text("workspace_id").primaryKey().references(() => workspaces.id, { onDelete: "cascade" }),
    minLockDeg: doublePrecision("min_lock_deg").notNull(),
    maxJointAngleDeg: doublePrecision("max_joint_angle_deg").notNull(),
    minSafetyFactor: doublePrecision("min_safety_factor").notNull(),
    ackermannMinPct: doublePrecision("ackermann_min_pct").notNull(),
    ackermannMaxPct: doublePrecision("ackermann_max_pct").notNull(),
    minNeckClearanceMm: doublePrecision("min_neck_clearance_mm").notNull(),
    version: integer("version").notNull().default(1),
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("workspace_settings_ackermann_range", sql`${t.ackermannMinPct} <= ${t.ackermannMaxPct}`)],
);

/** The workspace shelf: materials, joint kinds and shafts a layout can take its figures from. */
export const shelfItems = pgTable(
  "shelf_items",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    name: text("name").notNull(),
    // The figures and their sources, validated by the shelf contract for the kind.
    spec: jsonb("spec").$type<unknown>().notNull(),
    // The engine catalogue entry it was seeded from, if any.
    catalogueId: text("catalogue_id"),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("shelf_items_workspace_kind_name_idx").on(t.workspaceId, t.kind, t.name),
    check("shelf_items_kind", sql`${t.kind} in ('material', 'joint', 'shaft')`),
    check("shelf_items_version_positive", sql`${t.version} > 0`),
  ],
);
