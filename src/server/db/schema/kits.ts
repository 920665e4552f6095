import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";

export const kits = pgTable(
  "kits",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    scale: text("scale").notNull(),
    notes: text("notes").notNull().default(""),
    layout: jsonb("layout").$type<unknown>().notNull(),
    // Optimistic locking: every write names the version it was based on and bumps it.
    version: integer("version").notNull().default(1),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    // Who wrote the current version: a conflicting save names them.
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("kits_workspace_idx").on(t.workspaceId, t.updatedAt), check("kits_version_positive", sql`${t.version} > 0`)],
);
