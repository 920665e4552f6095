import { z } from "zod";

// Part of the layout document: which workspace shelf items its figures were taken from. The layout keeps
// the figures as well, so it analyses on its own; the references let a shelf edit find the kits it changes.

const ref = (field: string) => z.string({ error: `shelf.${field} must be a shelf item id` }).uuid({ error: `shelf.${field} must be a shelf item id (a UUID)` });

export const SHELF_KINDS = ["material", "joint", "shaft"] as const;
export type ShelfKind = (typeof SHELF_KINDS)[number];

export const shelfRefsSchema = z.strictObject({
  material: ref("material").optional().describe("Shelf material the strength figures came from"),
  joint: ref("joint").optional().describe("Shelf joint kind the joint type and rated angle came from"),
  shaft: ref("shaft").optional().describe("Shelf shaft the neck and bore came from"),
});

export type ShelfRefs = z.infer<typeof shelfRefsSchema>;
