// Every field of the layout document as the property panel shows it: label, kind, unit and group. The
// ranges are read from the layout contract's own JSON Schema, so the panel and the API cannot disagree.
import { z } from "zod";
import { JOINT_TYPES, layoutFieldsSchema } from "@/contracts/layout";
import { MATERIALS } from "@/engine";

export type FieldKind = "length" | "angle" | "number" | "integer" | "boolean" | "choice" | "text";

export interface FieldDef {
  readonly path: string;
  readonly label: string;
  readonly kind: FieldKind;
  /** Unit of a number that is not a length (lengths follow the user's unit). */
  readonly unit?: string;
  /** May be left empty: the layout then uses the default the hint names. */
  readonly optional?: { readonly absentMeans: string };
  readonly choices?: readonly { readonly value: string; readonly label: string }[];
  /** Shown only while another field has this value (the variants of a union). */
  readonly when?: { readonly path: string; readonly equals: string | boolean };
  readonly hint?: string;
}

export interface FieldGroup {
  readonly id: string;
  readonly title: string;
  readonly fields: readonly FieldDef[];
}

const point = (base: string, name: string, axes: ("x" | "y" | "z")[], optional: Partial<Record<"x" | "y" | "z", string>> = {}): FieldDef[] =>
  axes.map((a) => ({
    path: `${base}.${a}`,
    label: `${name} ${a}`,
    kind: "length" as const,
    ...(optional[a] ? { optional: { absentMeans: optional[a]! } } : {}),
  }));

const JOINT_LABELS: Record<(typeof JOINT_TYPES)[number], string> = {
  dogbone: "Dogbone (pin in cup)",
  cvd: "CVD (double joint)",
  "cv-ball": "CV ball joint",
  "single-cardan": "Single cardan",
  "double-cardan": "Double cardan",
};

export const FIELD_GROUPS: readonly FieldGroup[] = [
  {
    id: "front",
    title: "Front view (y–z)",
    fields: [
      ...point("frontView.lowerInner", "Lower arm chassis pivot", ["y", "z"]),
      ...point("frontView.lowerOuter", "Lower ball joint", ["y", "z"]),
      ...point("frontView.upperInner", "Upper arm chassis pivot", ["y", "z"]),
      ...point("frontView.upperOuter", "Upper ball joint", ["y", "z"]),
      ...point("frontView.wheelCentre", "Wheel centre", ["y", "z"]),
      { path: "frontView.tyreRadiusMm", label: "Tyre radius", kind: "length" },
      { path: "frontView.tyreWidthMm", label: "Tyre width", kind: "length" },
      { path: "frontView.staticCamberDeg", label: "Static camber", kind: "angle", hint: "+ top outboard" },
      { path: "frontView.bumpTravelMm", label: "Bump travel", kind: "length" },
      { path: "frontView.droopTravelMm", label: "Droop travel", kind: "length" },
    ],
  },
  {
    id: "side",
    title: "Side view",
    fields: [
      { path: "sideView.casterDeg", label: "Caster", kind: "angle", hint: "+ axis top rearward" },
      { path: "sideView.casterOffsetMm", label: "Caster offset", kind: "length", optional: { absentMeans: "0" }, hint: "axis ahead of the wheel centre at hub height" },
    ],
  },
  {
    id: "top",
    title: "Top view (x–y) and steering",
    fields: [
      ...point("topView.steeringArmBall", "Steering arm ball", ["x", "y", "z"], { z: "wheel-centre height" }),
      ...point("topView.rackEnd", "Rack end (tie-rod inner ball)", ["x", "y", "z"], { z: "the arm ball's height" }),
      { path: "topView.steeringInput.travelMm", label: "Rack travel each way", kind: "length" },
      { path: "topView.wheelbaseMm", label: "Wheelbase", kind: "length" },
    ],
  },
  {
    id: "drive",
    title: "Drive shaft and joint",
    fields: [
      ...point("drive.inboardJoint", "Inboard joint", ["y", "z", "x"], { x: "0" }),
      ...point("drive.outboardJoint", "Outboard joint", ["y", "z", "x"], { x: "0" }),
      { path: "drive.jointType", label: "Joint type", kind: "choice", choices: JOINT_TYPES.map((t) => ({ value: t, label: JOINT_LABELS[t] })) },
      { path: "drive.ratedAngleDeg", label: "Rated joint angle", kind: "angle" },
      { path: "drive.neckDiameterMm", label: "Neck diameter", kind: "length" },
      { path: "drive.boreDiameterMm", label: "Neck bore", kind: "length", optional: { absentMeans: "solid" } },
      { path: "drive.cupMouthDiameterMm", label: "Cup mouth diameter", kind: "length" },
      { path: "drive.pivotDepthMm", label: "Pivot depth below the mouth", kind: "length" },
      { path: "drive.slottedCup", label: "Slotted cup", kind: "boolean" },
      { path: "drive.slotLimitDeg", label: "Slot limit", kind: "angle", when: { path: "drive.slottedCup", equals: true } },
    ],
  },
  {
    id: "strength",
    title: "Torque and material",
    fields: [
      { path: "strength.motor.kind", label: "Motor given by", kind: "choice", choices: [{ value: "torque", label: "Stall torque" }, { value: "kv", label: "Kv and current" }] },
      { path: "strength.motor.torqueNm", label: "Motor torque", kind: "number", unit: "N·m", when: { path: "strength.motor.kind", equals: "torque" } },
      { path: "strength.motor.kvRpmPerV", label: "Motor Kv", kind: "number", unit: "rpm/V", when: { path: "strength.motor.kind", equals: "kv" } },
      { path: "strength.motor.currentA", label: "Motor current", kind: "number", unit: "A", when: { path: "strength.motor.kind", equals: "kv" } },
      { path: "strength.motor.noLoadCurrentA", label: "No-load current", kind: "number", unit: "A", optional: { absentMeans: "0" }, when: { path: "strength.motor.kind", equals: "kv" } },
      { path: "strength.gearRatios", label: "Gear ratios", kind: "number", hint: "each stage, driven / driving" },
      { path: "strength.efficiency", label: "Drivetrain efficiency", kind: "number", hint: "1 is conservative" },
      { path: "strength.shaftsSharing", label: "Shafts sharing the torque", kind: "integer" },
      { path: "strength.material.kind", label: "Material from", kind: "choice", choices: [{ value: "catalogue", label: "Catalogue" }, { value: "custom", label: "My own figures" }] },
      { path: "strength.material.id", label: "Material", kind: "choice", choices: MATERIALS.map((m) => ({ value: m.id, label: m.name })), when: { path: "strength.material.kind", equals: "catalogue" } },
      { path: "strength.material.name", label: "Material name", kind: "text", when: { path: "strength.material.kind", equals: "custom" } },
      { path: "strength.material.yieldMpa", label: "Tensile yield", kind: "number", unit: "MPa", when: { path: "strength.material.kind", equals: "custom" }, hint: "across-layer strength for a printed part" },
      { path: "strength.material.printed", label: "Printed part", kind: "boolean", when: { path: "strength.material.kind", equals: "custom" } },
      { path: "strength.material.derate", label: "Derate factor", kind: "number", when: { path: "strength.material.kind", equals: "custom" } },
      { path: "strength.material.shearRule", label: "Shear rule", kind: "choice", choices: [{ value: "distortion-energy", label: "Distortion energy, S_y/√3" }, { value: "tresca", label: "Maximum shear, S_y/2" }], when: { path: "strength.material.kind", equals: "custom" } },
      { path: "strength.material.source", label: "Source of the figures", kind: "text", when: { path: "strength.material.kind", equals: "custom" } },
      { path: "strength.targetSafetyFactor", label: "Design safety factor", kind: "number", hint: "sizes the smallest neck and the trade-off; the kit's targets judge the readouts" },
    ],
  },
];

export const ALL_FIELDS: readonly FieldDef[] = FIELD_GROUPS.flatMap((g) => g.fields);
const BY_PATH = new Map(ALL_FIELDS.map((f) => [f.path, f]));

export function fieldByPath(path: string): FieldDef | undefined {
  return BY_PATH.get(path);
}

// A dotted layout path as the contract writes it in a message ("drive.neckDiameterMm").
const LAYOUT_PATH = /\b(?:frontView|sideView|topView|drive|strength)(?:\.[A-Za-z0-9]+)+/g;

/**
 * A contract message in the panel's words: every field path it names becomes that field's label
 * ("drive.neckDiameterMm must be smaller than drive.cupMouthDiameterMm" → "Neck diameter must be smaller
 * than cup mouth diameter"). A path with no field of its own (a whole point) takes its first field's
 * label without the axis.
 */
export function layoutMessageInWords(message: string): string {
  let first = true;
  return message.replace(LAYOUT_PATH, (path, offset: number) => {
    const label = BY_PATH.get(path)?.label ?? BY_PATH.get(`${path}.y`)?.label.replace(/ y$/, "") ?? BY_PATH.get(`${path}.x`)?.label.replace(/ x$/, "");
    if (!label) return path;
    const lead = first && offset === 0;
    first = false;
    return lead ? label : label.charAt(0).toLowerCase() + label.slice(1);
  });
}

/** True for fields whose numbers are lengths in mm (converted for display). */
export function isLengthField(path: string): boolean {
  return BY_PATH.get(path)?.kind === "length";
}

type JsonNode = {
  properties?: Record<string, JsonNode>;
  items?: JsonNode;
  anyOf?: JsonNode[];
  oneOf?: JsonNode[];
  minimum?: number;
  maximum?: number;
  maxLength?: number;
};

const SCHEMA = z.toJSONSchema(layoutFieldsSchema) as JsonNode;

function variants(node: JsonNode): JsonNode[] {
  return node.anyOf ?? node.oneOf ?? [node];
}

function findNode(path: string): JsonNode | null {
  let nodes: JsonNode[] = [SCHEMA];
  for (const key of path.split(".")) {
    const next: JsonNode[] = [];
    for (const n of nodes.flatMap(variants)) {
      const child = n.properties?.[key];
      if (child) next.push(...variants(child));
    }
    if (next.length === 0) return null;
    nodes = next;
  }
  const leaf = nodes[0]!;
  return leaf.items ?? leaf;
}

export interface FieldRange {
  readonly min: number;
  readonly max: number;
}

/** The contract's range of a number field, in its stored unit (mm for lengths). */
export function fieldRange(path: string): FieldRange | null {
  const node = findNode(path);
  if (!node || node.minimum === undefined || node.maximum === undefined) return null;
  return { min: node.minimum, max: node.maximum };
}
