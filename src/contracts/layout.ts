/**
 * The kit layout document: one kit's left front corner, versioned, in mm and degrees, axes after
 * ISO 8855 (x forward, y left, z up; origin on the ground under the car's centreline on the front axle
 * line). The right corner mirrors the left (y → −y). Stored as revision JSON, sent to /api/analyze, and
 * passed straight to the engine's analyzeLayout (its KitLayout type is structurally the same).
 */
import { z } from "zod";
import type { KitLayout } from "@/engine/kit-layout";
import { shelfRefsSchema } from "./shelf-refs";
import { isStorableText, storableTextMessage } from "./text";

/** Current version of the layout document. */
export const LAYOUT_SCHEMA_VERSION = 2 as const;

function bounded(field: string, unit: string, min: number, max: number) {
  const u = unit ? ` ${unit}` : "";
  return z
    .number({ error: `${field} must be a number${unit ? ` (${unit})` : ""}` })
    .min(min, { error: `${field} must be at least ${min}${u}` })
    .max(max, { error: `${field} must be at most ${max}${u}` });
}

/** A free-text field of the document: stored in jsonb, so no control characters (the field is named). */
function text(field: string, max: number) {
  return z
    .string({ error: `${field} must be text` })
    .min(1, { error: `${field} must not be empty` })
    .max(max, { error: `${field} must be at most ${max} characters` })
    .refine((t) => isStorableText(t), { error: storableTextMessage(field) });
}

const COORD_Y = (field: string) => bounded(field, "mm", -1000, 1000);
const COORD_Z = (field: string) => bounded(field, "mm", -300, 1000);
const COORD_X = (field: string) => bounded(field, "mm", -1000, 1000);

const pointYZ = (name: string) => z.strictObject({ y: COORD_Y(`${name}.y`), z: COORD_Z(`${name}.z`) });
const pointYZX = (name: string) =>
  z.strictObject({ y: COORD_Y(`${name}.y`), z: COORD_Z(`${name}.z`), x: COORD_X(`${name}.x`).optional() });
const pointXYZ = (name: string) =>
  z.strictObject({ x: COORD_X(`${name}.x`), y: COORD_Y(`${name}.y`), z: COORD_Z(`${name}.z`).optional() });

const frontViewSchema = z.strictObject({
  lowerInner: pointYZ("frontView.lowerInner").describe("Lower arm chassis pivot, mm"),
  lowerOuter: pointYZ("frontView.lowerOuter").describe("Lower ball joint on the knuckle, mm"),
  upperInner: pointYZ("frontView.upperInner").describe("Upper arm chassis pivot, mm"),
  upperOuter: pointYZ("frontView.upperOuter").describe("Upper ball joint on the knuckle, mm"),
  wheelCentre: pointYZ("frontView.wheelCentre").describe("Wheel centre at static ride height, mm"),
  tyreRadiusMm: bounded("frontView.tyreRadiusMm", "mm", 5, 400),
  tyreWidthMm: bounded("frontView.tyreWidthMm", "mm", 2, 400),
  staticCamberDeg: bounded("frontView.staticCamberDeg", "°", -15, 15).describe("+ when the wheel top leans outboard"),
  bumpTravelMm: bounded("frontView.bumpTravelMm", "mm", 0, 200).describe("Wheel-centre travel up from static"),
  droopTravelMm: bounded("frontView.droopTravelMm", "mm", 0, 200).describe("Wheel-centre travel down from static"),
});

const sideViewSchema = z.strictObject({
  casterDeg: bounded("sideView.casterDeg", "°", -10, 45).describe("+ when the kingpin axis top leans rearward"),
  casterOffsetMm: bounded("sideView.casterOffsetMm", "mm", -100, 100)
    .optional()
    .describe("Kingpin axis x at wheel-centre height, mm ahead of the wheel centre; absent = 0"),
});

const steeringInputSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({
      kind: z.literal("rack"),
      travelMm: bounded("topView.steeringInput.travelMm", "mm", 0.5, 100).describe("Rack travel each way from centre"),
    }),
    z.strictObject({
      kind: z.literal("bellcrank"),
      pivot: z
        .strictObject({ x: COORD_X("topView.steeringInput.pivot.x"), y: COORD_Y("topView.steeringInput.pivot.y") })
        .describe("Bellcrank pivot (vertical axis), mm"),
      travelDeg: bounded("topView.steeringInput.travelDeg", "°", 0.5, 80).describe("Bellcrank travel each way from centre, + counter-clockwise from above"),
    }),
  ],
  { error: "topView.steeringInput.kind must be rack or bellcrank" },
);

const topViewSchema = z.strictObject({
  steeringArmBall: pointXYZ("topView.steeringArmBall").describe("Steering arm ball at static; z absent = wheel-centre height"),
  tieRodInner: pointXYZ("topView.tieRodInner").describe("Tie-rod inner ball (rack end or bellcrank arm) with the steering centred; z absent = the arm ball's height"),
  steeringInput: steeringInputSchema,
  wheelbaseMm: bounded("topView.wheelbaseMm", "mm", 50, 5000),
  stopMarginDeg: bounded("topView.stopMarginDeg", "°", 0, 10)
    .optional()
    .describe("How far short of the binding limit the proposed steering stop sits, degrees of inner road-wheel angle; absent = 1"),
});

/** Shear allowable rules: S_y/√3 (distortion energy) or S_y/2 (maximum shear, Tresca). */
export const SHEAR_RULES = ["distortion-energy", "tresca"] as const;

export const JOINT_TYPES = ["dogbone", "cvd", "cv-ball", "single-cardan", "double-cardan"] as const;

const driveSchema = z.strictObject({
  inboardJoint: pointYZX("drive.inboardJoint").describe("Inboard joint centre (outdrive), mm; x absent = 0"),
  outboardJoint: pointYZX("drive.outboardJoint").describe("Outboard joint centre at static, mm; x absent = 0"),
  jointType: z.enum(JOINT_TYPES, { error: `drive.jointType must be one of ${JOINT_TYPES.join(", ")}` }),
  ratedAngleDeg: bounded("drive.ratedAngleDeg", "°", 1, 89),
  cupMouthDiameterMm: bounded("drive.cupMouthDiameterMm", "mm", 0.5, 100),
  pivotDepthMm: bounded("drive.pivotDepthMm", "mm", 0, 100).describe("Pivot depth below the mouth plane"),
  neckDiameterMm: bounded("drive.neckDiameterMm", "mm", 0.3, 100),
  boreDiameterMm: bounded("drive.boreDiameterMm", "mm", 0, 99).optional().describe("Bore of a hollow neck; absent = solid"),
  slottedCup: z.boolean({ error: "drive.slottedCup must be true or false" }),
  slotLimitDeg: bounded("drive.slotLimitDeg", "°", 1, 89).optional().describe("Required when slottedCup is true"),
});

const motorSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("torque"), torqueNm: bounded("strength.motor.torqueNm", "N·m", 0.001, 100) }),
  z.strictObject({
    kind: z.literal("kv"),
    kvRpmPerV: bounded("strength.motor.kvRpmPerV", "rpm/V", 50, 50000),
    currentA: bounded("strength.motor.currentA", "A", 0.1, 2000),
    noLoadCurrentA: bounded("strength.motor.noLoadCurrentA", "A", 0, 100).optional(),
  }),
]);

const materialSchema = z.discriminatedUnion("kind", [
  z.strictObject({
    kind: z.literal("catalogue"),
    id: text("strength.material.id", 80),
  }),
  z.strictObject({
    kind: z.literal("custom"),
    name: text("strength.material.name", 120),
    yieldMpa: bounded("strength.material.yieldMpa", "MPa", 1, 5000).describe("Tensile yield (across-layer strength for a printed part)"),
    source: text("strength.material.source", 500),
    printed: z.boolean(),
    derate: bounded("strength.material.derate", "", 0.01, 1).describe("Factor on the yield of a printed part"),
    shearRule: z
      .enum(SHEAR_RULES, { error: `strength.material.shearRule must be one of ${SHEAR_RULES.join(", ")}` })
      .optional()
      .describe("How the shear allowable follows from the yield; absent = distortion-energy"),
  }),
]);

const strengthSchema = z.strictObject({
  motor: motorSchema,
  gearRatios: z
    .array(bounded("strength.gearRatios[]", "", 0.1, 100))
    .min(1, { error: "strength.gearRatios needs at least one ratio" })
    .max(6, { error: "strength.gearRatios takes at most 6 ratios" }),
  efficiency: bounded("strength.efficiency", "", 0.05, 1),
  shaftsSharing: z
    .number({ error: "strength.shaftsSharing must be a number" })
    .int({ error: "strength.shaftsSharing must be a whole number" })
    .min(1, { error: "strength.shaftsSharing must be at least 1" })
    .max(8, { error: "strength.shaftsSharing must be at most 8" }),
  material: materialSchema,
  targetSafetyFactor: bounded("strength.targetSafetyFactor", "", 0.5, 20),
});

const layoutObjectSchema = z.strictObject({
  schema: z.literal(LAYOUT_SCHEMA_VERSION, { error: `schema must be ${LAYOUT_SCHEMA_VERSION}` }),
  frontView: frontViewSchema,
  sideView: sideViewSchema,
  topView: topViewSchema,
  drive: driveSchema,
  strength: strengthSchema,
  // Which workspace shelf items the figures were taken from (the figures themselves stay in the layout).
  shelf: shelfRefsSchema.optional(),
});

/**
 * Every field's type and range, without the checks between fields: what an editor can hold while the
 * designer works (a neck wider than the mouth is a fault to show on the drawing, not a value to refuse).
 */
export const layoutFieldsSchema = layoutObjectSchema;

/**
 * The layout document schema (latest version), with cross-field checks that name the fields involved.
 * A check between fields that each hold a valid value ("a neck wider than the mouth") also names the part
 * that cannot be built, in the engine's words (GeometryError's part names), as the issue's `params.part`.
 */
export const layoutSchema = layoutObjectSchema.superRefine((l, ctx) => {
  const f = l.frontView;
  const fail = (path: (string | number)[], message: string, part?: string) =>
    ctx.addIssue({ code: "custom", path, message, ...(part ? { params: { part } } : {}) });
  if (!(f.lowerOuter.y > f.lowerInner.y)) fail(["frontView", "lowerOuter", "y"], "frontView.lowerOuter.y must be outboard of (greater than) frontView.lowerInner.y", "lower arm");
  if (!(f.upperOuter.y > f.upperInner.y)) fail(["frontView", "upperOuter", "y"], "frontView.upperOuter.y must be outboard of (greater than) frontView.upperInner.y", "upper arm");
  if (!(f.upperOuter.z > f.lowerOuter.z)) fail(["frontView", "upperOuter", "z"], "frontView.upperOuter.z must be above frontView.lowerOuter.z", "upright");
  if (!(f.upperInner.z > f.lowerInner.z)) fail(["frontView", "upperInner", "z"], "frontView.upperInner.z must be above frontView.lowerInner.z", "chassis");
  if (!(f.wheelCentre.y > 0)) fail(["frontView", "wheelCentre", "y"], "frontView.wheelCentre.y must be > 0 (the layout describes the left corner)");
  if (!(f.wheelCentre.z > 0)) fail(["frontView", "wheelCentre", "z"], "frontView.wheelCentre.z must be above the ground (> 0)");
  const d = l.drive;
  if (!(d.neckDiameterMm < d.cupMouthDiameterMm)) fail(["drive", "neckDiameterMm"], "drive.neckDiameterMm must be smaller than drive.cupMouthDiameterMm", "shaft neck");
  if (d.boreDiameterMm !== undefined && !(d.boreDiameterMm < d.neckDiameterMm)) fail(["drive", "boreDiameterMm"], "drive.boreDiameterMm must be smaller than drive.neckDiameterMm", "shaft neck");
  if (d.slottedCup && d.slotLimitDeg === undefined) fail(["drive", "slotLimitDeg"], "drive.slotLimitDeg is required when drive.slottedCup is true");
  if (!(d.outboardJoint.y > d.inboardJoint.y)) fail(["drive", "outboardJoint", "y"], "drive.outboardJoint.y must be outboard of drive.inboardJoint.y", "drive shaft");
  const t = l.topView;
  if (!(t.tieRodInner.y >= 0)) fail(["topView", "tieRodInner", "y"], "topView.tieRodInner.y must be ≥ 0 (the left corner's tie rod)");
  const dx = t.steeringArmBall.x - t.tieRodInner.x;
  const dy = t.steeringArmBall.y - t.tieRodInner.y;
  const dz = (t.steeringArmBall.z ?? f.wheelCentre.z) - (t.tieRodInner.z ?? t.steeringArmBall.z ?? f.wheelCentre.z);
  if (!(Math.hypot(dx, dy, dz) > 1)) fail(["topView", "tieRodInner"], "topView.tieRodInner must be at least 1 mm from topView.steeringArmBall (the tie rod has a length)", "tie rod");
  if (t.steeringInput.kind === "bellcrank") {
    const p = t.steeringInput.pivot;
    if (!(Math.hypot(t.tieRodInner.x - p.x, t.tieRodInner.y - p.y) >= 1)) {
      fail(["topView", "steeringInput", "pivot"], "topView.steeringInput.pivot must be at least 1 mm (in plan) from topView.tieRodInner (the bellcrank arm has a length)", "bellcrank");
    }
  }
});

/** A parsed, valid layout (latest version). */
export type Layout = z.infer<typeof layoutSchema>;

// The contract's parsed type must be accepted by the engine as it is (the engine's is the readonly twin).
type Assignable<A, B> = [A] extends [B] ? true : false;
const layoutFitsEngine: Assignable<Layout, KitLayout> = true;
void layoutFitsEngine;

/** One problem in a layout document: dotted path of the field and a message naming it. */
export interface LayoutIssue {
  readonly path: string;
  readonly message: string;
  /** Set when each field is valid but they do not fit together: the part that cannot be built. */
  readonly part?: string;
}

export type LayoutParseResult =
  | { readonly ok: true; readonly layout: Layout; readonly upgradedFrom: number | null }
  | { readonly ok: false; readonly issues: readonly LayoutIssue[] };

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/**
 * Version of a stored document: its `schema` field, or 0 when the field is missing (the first saved
 * shape). Returns null for something that is not an object or carries an unknown version.
 */
export function layoutDocumentVersion(doc: unknown): number | null {
  if (!isRecord(doc)) return null;
  if (!("schema" in doc)) return 0;
  return typeof doc.schema === "number" && Number.isInteger(doc.schema) && doc.schema >= 0 && doc.schema <= LAYOUT_SCHEMA_VERSION ? doc.schema : null;
}

/**
 * Schema 1 → 2. Schema 2 added the bellcrank steering input and renamed the tie-rod inner ball
 * `topView.rackEnd` → `topView.tieRodInner` (it sits on a bellcrank arm too); nothing else changed, so a
 * schema 1 document analyses exactly as before.
 */
function upgradeFrom1(doc: Record<string, unknown>): Record<string, unknown> {
  let topView = doc.topView;
  if (isRecord(topView) && "rackEnd" in topView && !("tieRodInner" in topView)) {
    const { rackEnd, ...rest } = topView;
    topView = { ...rest, tieRodInner: rackEnd };
  }
  return { ...doc, schema: 2, topView };
}

/**
 * Schema 0 → 1. Schema 0 (no `schema` field) kept caster in the front view (`frontView.casterDeg`,
 * `frontView.casterOffsetMm`), the rack travel as a bare number (`topView.rackTravelMm`) and one overall
 * gear ratio (`strength.gearRatio`). Anything else is carried over unchanged for the schema to judge.
 */
function upgradeFrom0(doc: Record<string, unknown>): Record<string, unknown> {
  const frontView = isRecord(doc.frontView) ? { ...doc.frontView } : doc.frontView;
  const sideView: Record<string, unknown> = {};
  if (isRecord(frontView)) {
    if ("casterDeg" in frontView) sideView.casterDeg = frontView.casterDeg;
    if ("casterOffsetMm" in frontView) sideView.casterOffsetMm = frontView.casterOffsetMm;
    delete frontView.casterDeg;
    delete frontView.casterOffsetMm;
  }
  let topView = doc.topView;
  if (isRecord(topView) && "rackTravelMm" in topView) {
    const { rackTravelMm, ...rest } = topView;
    topView = { ...rest, steeringInput: { kind: "rack", travelMm: rackTravelMm } };
  }
  let strength = doc.strength;
  if (isRecord(strength) && "gearRatio" in strength) {
    const { gearRatio, ...rest } = strength;
    strength = { ...rest, gearRatios: [gearRatio] };
  }
  return { ...doc, schema: 1, frontView, sideView: isRecord(doc.sideView) ? doc.sideView : sideView, topView, strength };
}

const UPGRADES: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = { 0: upgradeFrom0, 1: upgradeFrom1 };

/**
 * Brings a stored document of any known version up to the latest shape, one step at a time, without
 * validating it (parseLayout does that). Documents of unknown version, and non-objects, come back as they are.
 */
export function upgradeLayout(doc: unknown): unknown {
  let version = layoutDocumentVersion(doc);
  if (version === null || !isRecord(doc)) return doc;
  let current: Record<string, unknown> = doc;
  while (version < LAYOUT_SCHEMA_VERSION) {
    current = UPGRADES[version](current);
    version += 1;
  }
  return current;
}

/** Upgrades then validates a layout document; issues carry a dotted field path and a message naming the field. */
export function parseLayout(doc: unknown): LayoutParseResult {
  const version = layoutDocumentVersion(doc);
  if (isRecord(doc) && version === null) {
    return { ok: false, issues: [{ path: "schema", message: `schema must be a layout version from 0 to ${LAYOUT_SCHEMA_VERSION}` }] };
  }
  const result = layoutSchema.safeParse(upgradeLayout(doc));
  if (result.success) return { ok: true, layout: result.data, upgradedFrom: version !== null && version < LAYOUT_SCHEMA_VERSION ? version : null };
  return {
    ok: false,
    issues: result.error.issues.map((i) => {
      const part = i.code === "custom" ? (i.params as { part?: unknown } | undefined)?.part : undefined;
      return { path: i.path.map(String).join("."), message: i.message, ...(typeof part === "string" ? { part } : {}) };
    }),
  };
}

/**
 * The part that cannot be built when every issue is a misfit between valid fields (all carry a part), else
 * null: such a layout is answered as `impossible_geometry` with `part` and `reason`, like the engine's own
 * refusals, rather than as an invalid field.
 */
export function impossibleGeometry(issues: readonly LayoutIssue[]): { part: string; reason: string } | null {
  const first = issues[0];
  if (!first || !issues.every((i) => i.part !== undefined)) return null;
  return { part: first.part!, reason: first.message };
}

/** Layout issues as request-body field issues, their paths under `prefix` (at most 50). */
export function layoutFieldIssues(issues: readonly LayoutIssue[], prefix = "layout"): { path: string; message: string }[] {
  return issues.slice(0, 50).map((i) => ({ path: i.path ? `${prefix}.${i.path}` : prefix, message: i.message }));
}

/** JSON Schema (draft 2020-12) of the latest layout document, for GET /api/layout-schema. */
export function layoutJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(layoutObjectSchema, { target: "draft-2020-12" }) as Record<string, unknown>;
}
