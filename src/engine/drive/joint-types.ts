/**
 * The kinds of outboard drive joint a small car uses, with a typical rated operating angle and where that
 * figure comes from (by citation key). These are catalogue-style guides: the geometric limit from the neck in
 * the cup (neck-contact.ts) is the figure to trust (common practice).
 */
import { GeometryError } from "../errors";
import type { FigureSource } from "../provenance";

export type DriveJointKind = "dogbone" | "cvd" | "cv-ball" | "single-cardan" | "double-cardan";

export const DRIVE_JOINT_KINDS: readonly DriveJointKind[] = ["dogbone", "cvd", "cv-ball", "single-cardan", "double-cardan"];

export interface DriveJointType {
  readonly kind: DriveJointKind;
  readonly label: string;
  /** A single typical rated operating angle for defaults, degrees. */
  readonly typicalRatedAngleDeg: number;
  /** The range the source gives, degrees. */
  readonly ratedAngleRangeDeg: readonly [number, number];
  readonly ratedAngleSource: FigureSource;
  /** True when the joint lets the shaft slide axially (takes up plunge). */
  readonly plunges: boolean;
  /** True when the output speed fluctuates over a revolution at an operating angle (not constant-velocity). */
  readonly hasSpeedFluctuation: boolean;
  readonly note: string;
}

const NO_SOURCE_RC: FigureSource = { note: "no published source found; RC practice as recalled", cites: ["common-practice"] };

/** The joint kinds and their figures. */
export const DRIVE_JOINT_TYPES: Readonly<Record<DriveJointKind, DriveJointType>> = {
  dogbone: {
    kind: "dogbone",
    label: "Dogbone (ball or barrel end with cross pin in a slotted cup)",
    typicalRatedAngleDeg: 30,
    ratedAngleRangeDeg: [25, 35],
    ratedAngleSource: NO_SOURCE_RC,
    plunges: true,
    hasSpeedFluctuation: true,
    note: "each end acts like a cardan joint; binding or the bone leaving the cup depends on cup depth and plunge",
  },
  cvd: {
    kind: "cvd",
    label: "CVD (cross pin inside a cup plus a separate stub-axle joint)",
    typicalRatedAngleDeg: 40,
    ratedAngleRangeDeg: [40, 45],
    ratedAngleSource: NO_SOURCE_RC,
    plunges: true,
    hasSpeedFluctuation: false,
    note: "near constant-velocity; plunge is taken at the inboard cup (common practice)",
  },
  "cv-ball": {
    kind: "cv-ball",
    label: "Fixed ball-type CV joint (Rzeppa)",
    typicalRatedAngleDeg: 45,
    ratedAngleRangeDeg: [45, 48],
    ratedAngleSource: { note: "Wikipedia 'Constant-velocity joint', citing NTN Technical Review No. 75 (2007): 45–48° typical, 54° special", cites: ["cv-joint-wikipedia"] },
    plunges: false,
    hasSpeedFluctuation: false,
    note: "fixed type; plunging ball joints exist but are not this kind",
  },
  "single-cardan": {
    kind: "single-cardan",
    label: "Single cardan (universal) joint",
    typicalRatedAngleDeg: 40,
    ratedAngleRangeDeg: [40, 45],
    ratedAngleSource: NO_SOURCE_RC,
    plunges: false,
    hasSpeedFluctuation: true,
    note:
      "industrial guidance is lower: about 45° absolute maximum and ~15° best for wear (sallei-universal-joint); " +
      "design practice keeps it lower still (common-practice)",
  },
  "double-cardan": {
    kind: "double-cardan",
    label: "Double cardan (high-angle universal) joint",
    typicalRatedAngleDeg: 50,
    ratedAngleRangeDeg: [50, 60],
    ratedAngleSource: NO_SOURCE_RC,
    plunges: false,
    hasSpeedFluctuation: false,
    note: "constant-velocity only while the centring keeps both half-angles equal; automotive ≈ 45–50°, a value from memory (common-practice)",
  },
};

/** The figures of one joint kind; throws GeometryError ("drive joint") for an unknown kind. */
export function driveJointType(kind: DriveJointKind): DriveJointType {
  const found = (DRIVE_JOINT_TYPES as Record<string, DriveJointType | undefined>)[kind];
  if (!found || !Object.hasOwn(DRIVE_JOINT_TYPES, kind)) throw new GeometryError("drive joint", `unknown joint kind "${String(kind)}"`);
  return found;
}
