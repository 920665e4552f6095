import { sql } from "drizzle-orm";
import { boolean, check, date, doublePrecision, foreignKey, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users, workspaces } from "./auth";
import { kitRevisions, kits } from "./kits";
import { shelfItems } from "./library";

export const ATTACHMENT_PURPOSES = ["test-photo", "underlay"] as const;
export const TEST_OUTCOMES = ["held", "worn", "broke"] as const;
export const UNDERLAY_VIEWS = ["front", "top"] as const;

/**
 * How each kit revision did on the bench or the track: the set-up as tested, the outcome, and the
 * prediction the engine made for that set-up when the run was logged (kept, so a later change of the
 * layout or the shelf does not rewrite what was predicted).
 */
export const testRuns = pgTable(
  "test_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    // Numbered per kit from 1 ("broke in run 3"), never reused.
    number: integer("number").notNull(),
    revision: integer("revision").notNull(),
    testedOn: date("tested_on", { mode: "string" }).notNull(),
    part: text("part").notNull(),
    // The shelf material the part was made of; its name is kept in case the item is removed later.
    materialItemId: uuid("material_item_id").references(() => shelfItems.id, { onDelete: "set null" }),
    materialName: text("material_name").notNull(),
    // Motor, gearing, steer lock and load as tested (validated by the test-log contract).
    setup: jsonb("setup").$type<unknown>().notNull(),
    outcome: text("outcome").notNull(),
    failureLocation: text("failure_location").notNull().default(""),
    notes: text("notes").notNull().default(""),
    // τ at the neck for the set-up as tested (MPa): calibration re-judges it against the material's figure of today.
    neckShearStressMpa: doublePrecision("neck_shear_stress_mpa"),
    // The prediction when logged: safety factor, allowable and its source (null: the layout could not be solved).
    prediction: jsonb("prediction").$type<unknown>(),
    version: integer("version").notNull().default(1),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("test_runs_kit_number_idx").on(t.kitId, t.number),
    index("test_runs_workspace_material_idx").on(t.workspaceId, t.materialItemId),
    // A run belongs to a revision that exists (revisions are never deleted while the kit lives).
    foreignKey({ name: "test_runs_revision_fk", columns: [t.kitId, t.revision], foreignColumns: [kitRevisions.kitId, kitRevisions.number] }).onDelete("cascade"),
    check("test_runs_number_positive", sql`${t.number} > 0`),
    check("test_runs_outcome", sql`${t.outcome} in ('held', 'worn', 'broke')`),
    check("test_runs_version_positive", sql`${t.version} > 0`),
  ],
);

/**
 * A file kept in object storage: its key (random, never derived from anything a person chose), the type
 * sniffed from its bytes, its size and SHA-256. The bytes live only in the store; a row is written after
 * the object, so a refused or failed upload leaves neither.
 */
export const attachments = pgTable(
  "attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    testRunId: uuid("test_run_id").references(() => testRuns.id, { onDelete: "cascade" }),
    purpose: text("purpose").notNull(),
    objectKey: text("object_key").notNull(),
    contentType: text("content_type").notNull(),
    byteSize: integer("byte_size").notNull(),
    sha256: text("sha256").notNull(),
    fileName: text("file_name").notNull(),
    caption: text("caption").notNull().default(""),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("attachments_object_key_idx").on(t.objectKey),
    index("attachments_kit_idx").on(t.kitId),
    index("attachments_test_run_idx").on(t.testRunId),
    check("attachments_purpose", sql`${t.purpose} in ('test-photo', 'underlay')`),
    check("attachments_byte_size_positive", sql`${t.byteSize} > 0`),
  ],
);

/** A reference picture under one of a kit's views, placed by two picked points a known distance apart. */
export const kitUnderlays = pgTable(
  "kit_underlays",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: text("workspace_id").notNull().references(() => workspaces.id, { onDelete: "cascade" }),
    kitId: uuid("kit_id").notNull().references(() => kits.id, { onDelete: "cascade" }),
    view: text("view").notNull(),
    attachmentId: uuid("attachment_id").notNull().references(() => attachments.id, { onDelete: "cascade" }),
    // Where the picture sits (validated by the underlay contract): scale, turn, anchor and the two picks.
    placement: jsonb("placement").$type<unknown>().notNull(),
    opacity: doublePrecision("opacity").notNull().default(0.5),
    visible: boolean("visible").notNull().default(true),
    version: integer("version").notNull().default(1),
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("kit_underlays_kit_view_idx").on(t.kitId, t.view),
    check("kit_underlays_view", sql`${t.view} in ('front', 'top')`),
    check("kit_underlays_opacity", sql`${t.opacity} >= 0.05 and ${t.opacity} <= 1`),
  ],
);
