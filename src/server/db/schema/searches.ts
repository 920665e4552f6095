import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";
import { kits } from "./kits";

/**
 * A design search of one kit: its question (what may move, the aims, the preference), the layout it
 * searched from, its progress as the batches report, and its answer. The batches run on the pg-boss queue
 * (schema `pgboss`, made by pg-boss itself).
 */
export const designSearches = pgTable(
  "design_searches",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    baseRevision: integer("base_revision").notNull(),
    baseLayout: jsonb("base_layout").$type<unknown>().notNull(),
    question: jsonb("question").$type<unknown>().notNull(),
    status: text("status").notNull().default("running"),
    phase: text("phase").notNull().default("sample"),
    tried: integer("tried").notNull().default(0),
    planned: integer("planned").notNull(),
    batchesDone: integer("batches_done").notNull().default(0),
    batchesTotal: integer("batches_total").notNull(),
    // The best layout so far (updated as batches report), and the answer once done.
    best: jsonb("best").$type<unknown>(),
    answer: jsonb("answer").$type<unknown>(),
    error: text("error"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    index("design_searches_kit_idx").on(t.kitId, t.createdAt),
    index("design_searches_running_idx").on(t.status),
    check("design_searches_status", sql`${t.status} in ('running', 'done', 'cancelled', 'failed')`),
    check("design_searches_phase", sql`${t.phase} in ('sample', 'refine', 'finished')`),
  ],
);

/**
 * One batch of a search: what it is to do (a slice of the sample, or a refinement start), the pg-boss job
 * that carries it, and once done what it found. A retried job finds its batch done and writes nothing twice.
 */
export const designSearchBatches = pgTable(
  "design_search_batches",
  {
    searchId: uuid("search_id").notNull().references(() => designSearches.id, { onDelete: "cascade" }),
    index: integer("index").notNull(),
    phase: text("phase").notNull(),
    plan: jsonb("plan").$type<unknown>().notNull(),
    jobId: uuid("job_id").notNull(),
    status: text("status").notNull().default("queued"),
    tried: integer("tried").notNull().default(0),
    result: jsonb("result").$type<unknown>(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.searchId, t.index] }), check("design_search_batches_status", sql`${t.status} in ('queued', 'done')`)],
);
