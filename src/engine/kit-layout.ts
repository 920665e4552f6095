import type { PointXY, PointXYZ, PointYZ, PointYZX } from "./geometry-types";

/**
 * The engine's input: one kit's front corner, left side (y > 0), in mm and degrees, axes after ISO 8855
 * (x forward, y left, z up; origin on the ground under the centreline on the front axle line). Plain
 * readonly data, structurally identical to the layout contract's parsed type (src/contracts/layout.ts),
 * which is the place where ranges are checked.
 */
export interface KitLayout {
  readonly schema: 2;
  readonly frontView: KitFrontView;
  readonly sideView: KitSideView;
  readonly topView: KitTopView;
  readonly drive: KitDrive;
  readonly strength: KitStrength;
}

export interface KitFrontView {
  readonly lowerInner: PointYZ;
  readonly lowerOuter: PointYZ;
  readonly upperInner: PointYZ;
  readonly upperOuter: PointYZ;
  readonly wheelCentre: PointYZ;
  readonly tyreRadiusMm: number;
  readonly tyreWidthMm: number;
  /** + when the wheel top leans outboard. */
  readonly staticCamberDeg: number;
  /** Wheel-centre travel up from static, mm (≥ 0). */
  readonly bumpTravelMm: number;
  /** Wheel-centre travel down from static, mm (≥ 0). */
  readonly droopTravelMm: number;
}

export interface KitSideView {
  /** + when the top of the kingpin axis leans rearward. */
  readonly casterDeg: number;
  /** Where the kingpin axis passes at wheel-centre height, mm ahead of the wheel centre (+ forward); absent = 0. */
  readonly casterOffsetMm?: number;
}

/**
 * What moves the tie rod's inner ball. A rack slides it along y by ± travelMm. A bellcrank turns it about
 * a vertical axis through `pivot` (x, y) by ± travelDeg (+ counter-clockwise seen from above); the right corner's
 * bellcrank is the mirror of the left one and turns with it through a drag link (both by the same angle,
 * so the right wheel at +θ is the mirror of the left at −θ, as for the rack at ±s).
 */
export type KitSteeringInput =
  | { readonly kind: "rack"; readonly travelMm: number }
  | { readonly kind: "bellcrank"; readonly pivot: PointXY; readonly travelDeg: number };

export interface KitTopView {
  /** Steering arm ball centre on the knuckle at static, mm; z absent = wheel-centre height. */
  readonly steeringArmBall: PointXYZ;
  /** Tie-rod inner ball at centre (on the rack end or the bellcrank arm), mm; z absent = the steering arm ball's height. */
  readonly tieRodInner: PointXYZ;
  readonly steeringInput: KitSteeringInput;
  /** Front to rear axle line, mm. */
  readonly wheelbaseMm: number;
  /** How far short of the binding limit the proposed steering stop sits, in degrees of the inner road wheel; absent = 1°. */
  readonly stopMarginDeg?: number;
}

export type JointType = "dogbone" | "cvd" | "cv-ball" | "single-cardan" | "double-cardan";

export interface KitDrive {
  /** Inboard joint centre (outdrive), fixed to the chassis, mm. */
  readonly inboardJoint: PointYZX;
  /** Outboard joint centre (wheel side), fixed to the knuckle, mm, at static. */
  readonly outboardJoint: PointYZX;
  readonly jointType: JointType;
  /** The joint maker's (or designer's) rated operating angle, degrees. */
  readonly ratedAngleDeg: number;
  readonly cupMouthDiameterMm: number;
  /** Depth of the joint pivot below the cup mouth plane, mm. */
  readonly pivotDepthMm: number;
  readonly neckDiameterMm: number;
  /** Bore of a hollow shaft at the neck, mm; absent = solid. */
  readonly boreDiameterMm?: number;
  /** A slotted cup lets the neck pass the rim; the slot's end then limits the angle. */
  readonly slottedCup: boolean;
  readonly slotLimitDeg?: number;
}

export type KitMotor =
  | { readonly kind: "torque"; readonly torqueNm: number }
  | { readonly kind: "kv"; readonly kvRpmPerV: number; readonly currentA: number; readonly noLoadCurrentA?: number };

export type KitMaterial =
  | { readonly kind: "catalogue"; readonly id: string }
  | {
      readonly kind: "custom";
      readonly name: string;
      readonly yieldMpa: number;
      readonly source: string;
      readonly printed: boolean;
      /** Factor (0, 1] applied to the yield strength of a printed part for layer direction. */
      readonly derate: number;
      /** The shear allowable rule (allowable.ts); absent = distortion energy. */
      readonly shearRule?: "distortion-energy" | "tresca";
    };

export interface KitStrength {
  readonly motor: KitMotor;
  /** Ratios in series (spur/pinion, transmission, …), each output/input speed reduction; overall = product. */
  readonly gearRatios: readonly number[];
  /** Drivetrain efficiency 0–1 (1 = conservative). */
  readonly efficiency: number;
  /** Number of drive shafts that share the torque in the worst case. */
  readonly shaftsSharing: number;
  readonly material: KitMaterial;
  readonly targetSafetyFactor: number;
}
