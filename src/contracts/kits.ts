import { z } from "zod";
import { revisionNote } from "./revisions";
import { targetOverridesSchema, type Readouts, type TargetOverrides } from "./targets";
import { isStorableText, PG_INTEGER_MAX, storableTextMessage } from "./text";

// Bodies of the kits API. The layout document itself is validated by ./layout (schema-versioned).

export const KIT_SCALES = ["1:5", "1:6", "1:8", "1:10", "1:12", "1:16", "1:18", "1:24", "other"] as const;

const kitName = z
  .string({ error: "Name must be text" })
  .trim()
  .min(1, "Name is required")
  .max(120, "Name must be at most 120 characters")
  .refine((t) => isStorableText(t), storableTextMessage("Name"));
const kitScale = z.enum(KIT_SCALES, { error: `Scale must be one of ${KIT_SCALES.join(", ")}` });
const kitNotes = z
  .string({ error: "Notes must be text" })
  .max(4000, "Notes must be at most 4000 characters")
  .refine((t) => isStorableText(t, true), storableTextMessage("Notes", true));
const version = z
  .number({ error: "Version must be a number: the version your edit is based on" })
  .int("Version must be a whole number")
  .min(1, "Version starts at 1")
  // The column is a PostgreSQL integer and a write stores version + 1, so the largest a write can be based on
  // is one below the column's maximum.
  .max(PG_INTEGER_MAX - 1, `Version must be at most ${PG_INTEGER_MAX - 1}`);

/** A tag: lower-case letters, digits, spaces and - _ . : / +, 1–32 characters (kept lower-case). */
export const KIT_TAG_PATTERN = /^[\p{Ll}\p{Lo}\p{N}][\p{Ll}\p{Lo}\p{N} _.:/+-]*$/u;
export const MAX_KIT_TAGS = 12;
export const kitTag = z
  .string({ error: "A tag must be text" })
  .trim()
  .toLowerCase()
  .min(1, "A tag must not be empty")
  .max(32, "A tag must be at most 32 characters")
  .regex(KIT_TAG_PATTERN, "A tag may hold letters, digits, spaces and - _ . : / + (starting with a letter or digit)");
const kitTags = z
  .array(kitTag, { error: "Tags must be a list of text" })
  .max(MAX_KIT_TAGS, `A kit takes at most ${MAX_KIT_TAGS} tags`)
  .transform((tags) => [...new Set(tags)]);

export const kitCreateFields = z.object({
  name: kitName,
  scale: kitScale,
  notes: kitNotes.optional(),
  tags: kitTags.optional(),
});
export type KitCreateFields = z.infer<typeof kitCreateFields>;

export const kitPatchBody = z
  .object({
    version,
    name: kitName.optional(),
    scale: kitScale.optional(),
    notes: kitNotes.optional(),
    tags: kitTags.optional(),
    archived: z.boolean({ error: "Archived must be true or false" }).optional(),
    targets: targetOverridesSchema.optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).some((k) => k !== "version"), {
    message: "Send at least one of name, scale, notes, tags, archived or targets",
    path: ["name"],
  });
export type KitPatchBody = z.infer<typeof kitPatchBody>;

export const kitIdParam = z.string().uuid("Kit id must be a UUID");

export { version as versionField };

/** PUT /api/workspaces/{w}/kits/{k}/layout: the layout, the version it was based on, and an optional note. */
export const layoutSaveFields = { version, note: revisionNote.optional() };

/** POST …/revisions/{n}/restore: the kit version the restore is based on, and an optional note. */
export const revisionRestoreBody = z.object({ version, note: revisionNote.optional() }).strict();

/** POST …/kits/{k}/variants: a new kit made from this kit's head (or one revision), remembering where it came from. */
export const variantCreateBody = z
  .object({
    name: kitName,
    revision: z.number({ error: "Revision must be a number" }).int("Revision must be a whole number").min(1, "Revision starts at 1").max(PG_INTEGER_MAX, "Revision is too large").optional(),
    scale: kitScale.optional(),
    notes: kitNotes.optional(),
    tags: kitTags.optional(),
  })
  .strict();

/** A kit as the API lists it (dates as ISO strings). */
export type KitSummary = {
  id: string;
  name: string;
  scale: string;
  notes: string;
  version: number;
  createdBy: string | null;
  createdByName: string | null;
  /** Who wrote the current version (null for a kit written before this was kept, or a deleted account). */
  updatedBy: string | null;
  updatedByName: string | null;
  createdAt: string;
  updatedAt: string;
  tags: string[];
  /** The number of the head revision (the layout the kit shows). */
  headRevision: number;
  archivedAt: string | null;
  /** The kit and revision a variant was made from (the kit id is null once that kit is deleted). */
  originKitId: string | null;
  originKitName: string | null;
  originRevision: number | null;
  targetOverrides: TargetOverrides;
  /** The head revision's key readouts (null where the layout could not be analysed or has no such figure). */
  readouts: Readouts;
  lockLimitedBy: string | null;
};

/** A kit with its layout document, as GET /api/workspaces/{w}/kits/{k} returns it. */
export type KitDetail = KitSummary & { workspaceId: string; layout: unknown };
