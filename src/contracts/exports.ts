import { z } from "zod";
import { COMPARE_MAX, COMPARE_MIN, parseCompareItems } from "./compare";
import { LENGTH_UNITS } from "./preferences";
import { PG_INTEGER_MAX } from "./text";

// The kit exports: which files there are and the query parameters each takes. Lengths on a sheet, an SVG
// or a CSV show in the unit asked for (default: the person's preference); the DXF is always 1:1 in mm.
// Every export is of the kit's head revision, or of the revision `?revision=n` pins.

export const EXPORT_FILES = ["sheet.pdf", "views.dxf", "envelope.csv", "travel.csv", "front.svg", "top.svg", "joint.svg"] as const;
export type ExportFile = (typeof EXPORT_FILES)[number];

export function isExportFile(name: string): name is ExportFile {
  return (EXPORT_FILES as readonly string[]).includes(name);
}

export const PAPER_SIZES = ["a4", "letter"] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];
export const ORIENTATIONS = ["portrait", "landscape"] as const;
export type Orientation = (typeof ORIENTATIONS)[number];

/** The envelope CSV's grid may be finer than an analysis request's (one file, not a stream of requests). */
export const EXPORT_GRID_LIMITS = { travelSteps: { min: 2, max: 121 }, steerSteps: { min: 3, max: 121 } } as const;

const unit = z.enum(LENGTH_UNITS, { error: "unit must be mm or in" }).optional();

/** `?revision=n`: a whole number from 1 (a number no revision has is a 404, not a 422). */
const revision = z
  .string()
  .regex(/^[1-9]\d{0,9}$/, "revision must be a whole number from 1")
  .transform(Number)
  .pipe(z.number().max(PG_INTEGER_MAX, `revision must be at most ${PG_INTEGER_MAX}`))
  .optional();

/** A whole number from the query string ("41"), in range, with the parameter named in every message. */
function steps(name: keyof typeof EXPORT_GRID_LIMITS) {
  const { min, max } = EXPORT_GRID_LIMITS[name];
  return z
    .string()
    .regex(/^\d{1,4}$/, `${name} must be a whole number`)
    .transform(Number)
    .pipe(z.number().min(min, `${name} must be at least ${min}`).max(max, `${name} must be at most ${max}`))
    .optional();
}

/** The sheet's own choices: paper, orientation and the unit its lengths show in. */
const sheetOptions = {
  paper: z.enum(PAPER_SIZES, { error: "paper must be a4 or letter" }).optional(),
  orientation: z.enum(ORIENTATIONS, { error: "orientation must be portrait or landscape" }).optional(),
  unit,
};

export const sheetQuery = z.strictObject({ ...sheetOptions, revision });
export const svgQuery = z.strictObject({ unit, revision });
export const dxfQuery = z.strictObject({ revision });
export const envelopeQuery = z.strictObject({ unit, revision, travelSteps: steps("travelSteps"), steerSteps: steps("steerSteps") });
export const travelQuery = z.strictObject({ unit, revision, travelSteps: steps("travelSteps") });

/** Every parameter any export takes (each export's schema allows its own). */
export type ExportQuery = Partial<z.infer<typeof sheetQuery> & z.infer<typeof envelopeQuery>>;

/** The schema of one export's query string. */
export function exportQuerySchema(file: ExportFile): z.ZodType<ExportQuery> {
  switch (file) {
    case "sheet.pdf":
      return sheetQuery;
    case "views.dxf":
      return dxfQuery;
    case "envelope.csv":
      return envelopeQuery;
    case "travel.csv":
      return travelQuery;
    default:
      return svgQuery;
  }
}

/**
 * The comparison's sheet (GET …/compare/sheet.pdf): `items` in the compare page's own syntax (A,B@3), each
 * item's sheet one after another in one PDF, with the kit sheet's choices.
 */
export const compareSheetQuery = z.strictObject({
  items: z.string({ error: `items must name ${COMPARE_MIN} to ${COMPARE_MAX} kits or revisions, comma-separated` }).transform((raw, ctx) => {
    const parsed = parseCompareItems(raw);
    if (parsed.ok) return parsed.items;
    ctx.addIssue({ code: "custom", message: parsed.message });
    return z.NEVER;
  }),
  ...sheetOptions,
});
export type CompareSheetQuery = z.infer<typeof compareSheetQuery>;

/**
 * The query of one export through a share link: the same, without `revision` (a link shows its own
 * revision, so a `revision` parameter is refused as unknown, naming it, rather than silently ignored).
 */
export function sharedExportQuerySchema(file: ExportFile): z.ZodType<ExportQuery> {
  return (exportQuerySchema(file) as z.ZodObject<{ revision: typeof revision }>).omit({ revision: true });
}
