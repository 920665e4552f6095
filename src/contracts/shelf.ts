import { z } from "zod";
import { JOINT_TYPES, SHEAR_RULES, type Layout } from "./layout";
import { SHELF_KINDS, type ShelfKind } from "./shelf-refs";
import { isStorableText, PG_INTEGER_MAX, storableTextMessage } from "./text";

// The workspace shelf: materials, joint kinds and shafts with the source of each figure. A layout takes an
// item's figures (applyShelfItem) and remembers the item (layout.shelf), so editing the item can update
// every kit that uses it, after asking.

export { SHELF_KINDS, type ShelfKind };

function text(field: string, max: number, min = 1) {
  return z
    .string({ error: `${field} must be text` })
    .trim()
    .min(min, { error: min === 1 ? `${field} is required` : `${field} must be at least ${min} characters` })
    .max(max, { error: `${field} must be at most ${max} characters` })
    .refine((t) => isStorableText(t), { error: storableTextMessage(field) });
}

function bounded(field: string, unit: string, min: number, max: number) {
  const u = unit ? ` ${unit}` : "";
  return z
    .number({ error: `${field} must be a number${unit ? ` (${unit})` : ""}` })
    .min(min, { error: `${field} must be at least ${min}${u}` })
    .max(max, { error: `${field} must be at most ${max}${u}` });
}

export const SHEAR_RULE_LABELS: Record<(typeof SHEAR_RULES)[number], string> = {
  "distortion-energy": "Distortion energy, S_sy = S_y/√3 (Shigley's Mechanical Engineering Design 9th ed. §5-5)",
  tresca: "Maximum shear (Tresca), S_sy = S_y/2 (the comparison Shigley's 9th ed. draws beside §5-5)",
};

export const materialSpecSchema = z
  .strictObject({
    printed: z.boolean({ error: "spec.printed must be true or false" }),
    tensileYieldMpa: bounded("spec.tensileYieldMpa", "MPa", 1, 5000).describe("Tensile yield; the across-layer strength for a printed part"),
    yieldSource: text("spec.yieldSource", 500),
    shearRule: z.enum(SHEAR_RULES, { error: `spec.shearRule must be one of ${SHEAR_RULES.join(", ")}` }),
    derate: bounded("spec.derate", "", 0.01, 1).describe("Across-layer derating of a printed part; 1 for a metal"),
    derateSource: text("spec.derateSource", 500, 0),
  })
  .superRefine((m, ctx) => {
    if (m.printed && m.derateSource === "") ctx.addIssue({ code: "custom", path: ["derateSource"], message: "spec.derateSource is required for a printed material" });
    // A metal takes its yield as it is, unless a derate with its source says otherwise (a calibration from test runs).
    if (!m.printed && m.derate !== 1 && m.derateSource === "") ctx.addIssue({ code: "custom", path: ["derate"], message: "spec.derate below 1 on a metal needs its source in spec.derateSource (e.g. a calibration from test runs); else 1" });
  });
export type MaterialSpec = z.infer<typeof materialSpecSchema>;

export const jointSpecSchema = z.strictObject({
  jointType: z.enum(JOINT_TYPES, { error: `spec.jointType must be one of ${JOINT_TYPES.join(", ")}` }),
  ratedAngleDeg: bounded("spec.ratedAngleDeg", "°", 1, 89),
  ratedAngleSource: text("spec.ratedAngleSource", 500),
  /** Axial plunge the joint takes, ± mm; null when no figure is known. */
  plungeMm: bounded("spec.plungeMm", "mm", 0, 50).nullable(),
  plungeSource: text("spec.plungeSource", 500, 0),
});
export type JointSpec = z.infer<typeof jointSpecSchema>;

export const shaftSpecSchema = z
  .strictObject({
    neckDiameterMm: bounded("spec.neckDiameterMm", "mm", 0.3, 100),
    /** 0 = solid. */
    boreDiameterMm: bounded("spec.boreDiameterMm", "mm", 0, 99),
    lengthMm: bounded("spec.lengthMm", "mm", 1, 1000).describe("Between the joint centres"),
    /** A material item of the same shelf, or null for none. */
    materialId: z.string({ error: "spec.materialId must be a shelf material id" }).uuid({ error: "spec.materialId must be a shelf material id (a UUID)" }).nullable(),
  })
  .refine((s) => s.boreDiameterMm < s.neckDiameterMm, { path: ["boreDiameterMm"], message: "spec.boreDiameterMm must be smaller than spec.neckDiameterMm" });
export type ShaftSpec = z.infer<typeof shaftSpecSchema>;

export type ShelfSpec = MaterialSpec | JointSpec | ShaftSpec;
export const SPEC_SCHEMAS = { material: materialSpecSchema, joint: jointSpecSchema, shaft: shaftSpecSchema } as const;

const itemName = text("name", 120);

export const shelfItemCreateBody = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("material"), name: itemName, spec: materialSpecSchema }),
    z.strictObject({ kind: z.literal("joint"), name: itemName, spec: jointSpecSchema }),
    z.strictObject({ kind: z.literal("shaft"), name: itemName, spec: shaftSpecSchema }),
  ],
  { error: `kind must be one of ${SHELF_KINDS.join(", ")}` },
);
export type ShelfItemCreateBody = z.infer<typeof shelfItemCreateBody>;

const version = z.number({ error: "Version must be a number" }).int("Version must be a whole number").min(1, "Version starts at 1").max(PG_INTEGER_MAX - 1, "Version is too large");

/** The kits a shelf edit was confirmed for: each kit's id and the version the person saw. */
export const confirmedKits = z
  .array(z.strictObject({ id: z.string().uuid("kits[].id must be a kit id"), version }), { error: "kits must be a list of { id, version }" })
  .max(5000, "kits lists at most 5000 kits");

/** PATCH …/shelf/{id}: the item's version, what changes (the spec is judged by the item's kind), and the kits confirmed. */
export const shelfItemPatchBody = z
  .strictObject({ version, name: itemName.optional(), spec: z.unknown().optional(), kits: confirmedKits.optional() })
  .refine((b) => b.name !== undefined || b.spec !== undefined, { message: "Send name or spec to change", path: ["name"] });

export interface ShelfItem {
  readonly id: string;
  readonly kind: ShelfKind;
  readonly name: string;
  readonly spec: ShelfSpec;
  readonly catalogueId: string | null;
  readonly version: number;
  readonly updatedByName: string | null;
  readonly updatedAt: string;
  /** How many kits' head layouts take their figures from this item. */
  readonly usedBy: number;
}

export type MaterialItem = ShelfItem & { readonly kind: "material"; readonly spec: MaterialSpec };
export type JointItem = ShelfItem & { readonly kind: "joint"; readonly spec: JointSpec };
export type ShaftItem = ShelfItem & { readonly kind: "shaft"; readonly spec: ShaftSpec };

/** A kit a shelf edit would change, with the version it is at. */
export interface ShelfKitUse {
  readonly id: string;
  readonly name: string;
  readonly version: number;
  readonly headRevision: number;
  readonly archived: boolean;
}

/** The figures a shelf item gives a layout, minus the item's own bookkeeping. */
type ItemFigures = Pick<ShelfItem, "id" | "kind" | "name" | "spec">;

const MAX_SOURCE = 500;
const clip = (t: string) => (t.length <= MAX_SOURCE ? t : `${t.slice(0, MAX_SOURCE - 1)}…`);

/** The layout's material for a shelf material: its figures, with the sources of the yield and of any derate. */
export function layoutMaterialOf(item: Pick<ShelfItem, "name"> & { spec: MaterialSpec }): Layout["strength"]["material"] {
  const m = item.spec;
  const derated = m.printed || m.derate !== 1;
  return {
    kind: "custom",
    name: item.name.slice(0, 120),
    yieldMpa: m.tensileYieldMpa,
    source: clip(derated ? `${m.yieldSource}; derate: ${m.derateSource}` : m.yieldSource),
    printed: m.printed,
    derate: derated ? m.derate : 1,
    shearRule: m.shearRule,
  };
}

/**
 * The layout with a shelf item's figures and a reference to the item. A shaft brings its neck and bore, and
 * its material when `materials` holds it. The result is not validated here (a neck wider than the mouth is a
 * fault the editor shows, and the server refuses).
 */
export function applyShelfItem(layout: Layout, item: ItemFigures, materials: readonly ItemFigures[] = []): Layout {
  const shelf = { ...layout.shelf };
  if (item.kind === "material") {
    shelf.material = item.id;
    return { ...layout, strength: { ...layout.strength, material: layoutMaterialOf(item as ItemFigures & { spec: MaterialSpec }) }, shelf };
  }
  if (item.kind === "joint") {
    const j = item.spec as JointSpec;
    shelf.joint = item.id;
    return { ...layout, drive: { ...layout.drive, jointType: j.jointType, ratedAngleDeg: j.ratedAngleDeg }, shelf };
  }
  const s = item.spec as ShaftSpec;
  shelf.shaft = item.id;
  const { boreDiameterMm: _bore, ...drive } = layout.drive;
  void _bore;
  let next: Layout = { ...layout, drive: { ...drive, neckDiameterMm: s.neckDiameterMm, ...(s.boreDiameterMm > 0 ? { boreDiameterMm: s.boreDiameterMm } : {}) }, shelf };
  const material = s.materialId ? materials.find((m) => m.id === s.materialId && m.kind === "material") : undefined;
  if (material) next = applyShelfItem(next, material);
  return next;
}

/** Whether the layout's figures are still the item's (false once the designer changed one by hand). */
export function layoutMatchesShelfItem(layout: Layout, item: ItemFigures): boolean {
  if (item.kind === "material") return JSON.stringify(layout.strength.material) === JSON.stringify(layoutMaterialOf(item as ItemFigures & { spec: MaterialSpec }));
  if (item.kind === "joint") {
    const j = item.spec as JointSpec;
    return layout.drive.jointType === j.jointType && layout.drive.ratedAngleDeg === j.ratedAngleDeg;
  }
  const s = item.spec as ShaftSpec;
  return layout.drive.neckDiameterMm === s.neckDiameterMm && (layout.drive.boreDiameterMm ?? 0) === s.boreDiameterMm;
}

/** The layout without its reference to an item of this kind (the figures stay as they are). */
export function unlinkShelfItem(layout: Layout, kind: ShelfKind): Layout {
  if (!layout.shelf?.[kind]) return layout;
  const { [kind]: _gone, ...rest } = layout.shelf;
  void _gone;
  const { shelf: _old, ...base } = layout;
  void _old;
  return Object.keys(rest).length ? { ...base, shelf: rest } : base;
}

export const SHELF_KIND_LABELS: Record<ShelfKind, { one: string; many: string }> = {
  material: { one: "material", many: "Materials" },
  joint: { one: "joint kind", many: "Joint kinds" },
  shaft: { one: "shaft", many: "Shafts" },
};
