import "server-only";
// The sweeps as CSV, one header row naming each column's unit: the steer × travel envelope of the drive
// joint (both wheels, the right one the mirror of the left at the opposite rack), and the travel sweep.
import { stringify } from "csv-stringify/sync";
import { neckClearanceMm, type AnalysisResult } from "@/engine";
import type { Layout } from "@/contracts/layout";
import { mmToUnit, type LengthUnit } from "@/figures/length-unit";

type Cell = number | string | null;

/** Enough decimals for any use of the figures: 1e-4 in mm and degrees, 1e-5 in inches. */
function lengthCell(mm: number | null, unit: LengthUnit): Cell {
  return mm === null || !Number.isFinite(mm) ? null : Number(mmToUnit(mm, unit).toFixed(unit === "in" ? 5 : 4));
}

function angleCell(deg: number | null): Cell {
  return deg === null || !Number.isFinite(deg) ? null : Number(deg.toFixed(4));
}

function csv(header: readonly string[], rows: readonly Cell[][]): string {
  // Empty cells where a figure does not exist (the tie rod cannot reach, a slotted cup has no neck gap).
  return stringify([header as string[], ...rows], { cast: { number: (n) => String(n) }, record_delimiter: "\n" });
}

export const ENVELOPE_COLUMNS = (unit: LengthUnit) => [
  `travel_${unit}`,
  `rack_${unit}`,
  "left_road_wheel_deg",
  "right_road_wheel_deg",
  "left_joint_angle_deg",
  "right_joint_angle_deg",
  `left_neck_clearance_${unit}`,
  `right_neck_clearance_${unit}`,
] as const;

/**
 * One row per grid point, travel outer (droop to bump), rack inner. Road-wheel angles + left; joint angles
 * ≥ 0; neck clearance (D/2)cos β − a sin β − d/2, + clear (empty for a slotted cup).
 */
export function envelopeCsv(layout: Layout, analysis: AnalysisResult, unit: LengthUnit): string {
  const env = analysis.envelope;
  const d = layout.drive;
  const cup = { mouthDiameterMm: d.cupMouthDiameterMm, neckDiameterMm: d.neckDiameterMm, pivotDepthMm: d.pivotDepthMm };
  const gap = (beta: number | null) => (beta === null || d.slottedCup || beta > 90 ? null : neckClearanceMm(cup, beta));
  const n = env.rackMm.length;
  const rows: Cell[][] = [];
  env.travelMm.forEach((travel, i) => {
    const joints = env.jointAngleDeg[i]!;
    const roads = env.leftRoadWheelDeg[i]!;
    for (let j = 0; j < n; j++) {
      const m = n - 1 - j;
      const rightRoad = roads[m] === null || roads[m] === undefined ? null : -roads[m]!;
      const left = joints[j] ?? null;
      const right = joints[m] ?? null;
      rows.push([lengthCell(travel, unit), lengthCell(env.rackMm[j]!, unit), angleCell(roads[j] ?? null), angleCell(rightRoad), angleCell(left), angleCell(right), lengthCell(gap(left), unit), lengthCell(gap(right), unit)]);
    }
  });
  return csv(ENVELOPE_COLUMNS(unit), rows);
}

export const TRAVEL_COLUMNS = (unit: LengthUnit) => [
  `travel_${unit}`,
  "camber_deg",
  `camber_gain_deg_per_${unit}`,
  `track_change_${unit}`,
  `roll_centre_height_${unit}`,
  `plunge_${unit}`,
  "joint_angle_deg",
  "bump_steer_deg",
  "kingpin_inclination_deg",
  `scrub_radius_${unit}`,
] as const;

/** One row per travel step, rack centred: signs as the API documents them (camber + top outboard, …). */
export function travelCsv(analysis: AnalysisResult, unit: LengthUnit): string {
  const perUnit = unit === "in" ? 25.4 : 1;
  const rows = analysis.travel.map((t): Cell[] => [
    lengthCell(t.travelMm, unit),
    angleCell(t.camberDeg),
    Number((t.camberGainDegPerMm * perUnit).toFixed(6)),
    lengthCell(t.trackChangeMm, unit),
    lengthCell(t.rollCentreHeightMm, unit),
    lengthCell(t.plungeMm, unit),
    angleCell(t.jointAngleDeg),
    angleCell(t.bumpSteerDeg),
    angleCell(t.kingpinInclinationDeg),
    lengthCell(t.scrubRadiusMm, unit),
  ]);
  return csv(TRAVEL_COLUMNS(unit), rows);
}
