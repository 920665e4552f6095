import { z } from "zod";
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

export const kitCreateFields = z.object({
  name: kitName,
  scale: kitScale,
  notes: kitNotes.optional(),
});
export type KitCreateFields = z.infer<typeof kitCreateFields>;

export const kitPatchBody = z
  .object({ version, name: kitName.optional(), scale: kitScale.optional(), notes: kitNotes.optional() })
  .strict()
  .refine((b) => b.name !== undefined || b.scale !== undefined || b.notes !== undefined, {
    message: "Send at least one of name, scale or notes",
    path: ["name"],
  });
export type KitPatchBody = z.infer<typeof kitPatchBody>;

export const kitIdParam = z.string().uuid("Kit id must be a UUID");

export { version as versionField };

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
};

/** A kit with its layout document, as GET /api/workspaces/{w}/kits/{k} returns it. */
export type KitDetail = KitSummary & { workspaceId: string; layout: unknown };
