// The live readouts as label, figure and hint, from one analysis: the figures a designer watches while
// dragging. Pure (tested without a page); a missing figure is a dash, never NaN.
import type { AnalysisResult } from "@/engine";
import { fmt, limitLabel, signed } from "./format";
import { formatLength, type LengthUnit } from "./length-unit";

export interface Readout {
  readonly id: string;
  readonly label: string;
  readonly value: string;
  readonly hint?: string;
  readonly tone?: "good" | "bad";
}

export interface ReadoutGroup {
  readonly id: string;
  readonly title: string;
  readonly readouts: readonly Readout[];
}

function travelWords(mm: number, unit: LengthUnit): string {
  if (Math.abs(mm) < 1e-6) return "ride height";
  return mm > 0 ? `${formatLength(mm, unit, 1)} bump` : `${formatLength(-mm, unit, 1)} droop`;
}

/** A sentence for a lock of zero: the joint is past its limit before the wheels turn at all. */
export function zeroLockNote(a: AnalysisResult, unit: LengthUnit): string | null {
  const w = a.steerLock.worst;
  if (w.rackMm !== 0 || w.limitedBy === "rack-travel" || w.limitedBy === "linkage") return null;
  return `At ${travelWords(w.travelMm, unit)} the drive joint is already at ${fmt(w.jointAngleDeg, 1, "°")} with the wheels straight, past its ${fmt(a.drive.jointLimitDeg, 1, "°")} limit: there is no steer lock there.`;
}

export function readoutGroups(a: AnalysisResult, unit: LengthUnit): ReadoutGroup[] {
  const worst = a.steerLock.worst;
  const stat = a.steerLock.static;
  const bump = a.travel[a.travel.length - 1]!;
  const droop = a.travel[0]!;
  const s = a.strength;
  const clearance = a.drive.minNeckClearanceMm;
  return [
    {
      id: "lock",
      title: "Steer lock",
      readouts: [
        { id: "steer-lock-worst", label: "Lock, worst over travel", value: fmt(worst.innerDeg, 1, "°"), hint: `inner wheel; outer ${fmt(worst.outerDeg, 1, "°")} · ${limitLabel(worst.limitedBy)} at ${travelWords(worst.travelMm, unit)}` },
        { id: "steer-lock-static", label: "Lock at ride height", value: fmt(stat.innerDeg, 1, "°"), hint: `outer ${fmt(stat.outerDeg, 1, "°")} · ${limitLabel(stat.limitedBy)}` },
        { id: "lock-limit", label: "What binds", value: limitLabel(worst.limitedBy) },
      ],
    },
    {
      id: "joint",
      title: "Drive joint",
      readouts: [
        { id: "joint-max", label: "Largest joint angle within lock", value: fmt(a.drive.maxJointAngleWithinLockDeg, 1, "°"), hint: `limit ${fmt(a.drive.jointLimitDeg, 1, "°")} (${limitLabel(a.drive.jointLimitBy)})` },
        { id: "joint-max-envelope", label: "Largest over the envelope", value: fmt(a.drive.maxJointAngleDeg, 1, "°"), hint: `at ${travelWords(a.drive.maxJointAngleAtTravelMm, unit)}, rack ${formatLength(a.drive.maxJointAngleAtRackMm, unit, 1, true)}` },
        {
          id: "neck-clearance",
          label: "Least neck clearance",
          value: clearance === null ? "slotted cup" : formatLength(clearance, unit, 2),
          hint: clearance === null ? `slot limit ${fmt(a.drive.slotLimitDeg, 1, "°")}` : "neck to mouth rim, inside the lock",
          tone: clearance !== null && clearance < 0.05 ? "bad" : undefined,
        },
      ],
    },
    {
      id: "suspension",
      title: "Suspension",
      readouts: [
        { id: "camber-bump", label: "Camber at full bump", value: signed(bump.camberDeg, 2, "°"), hint: `at ${travelWords(bump.travelMm, unit)}; + top outboard` },
        { id: "camber-droop", label: "Camber at full droop", value: signed(droop.camberDeg, 2, "°"), hint: `at ${travelWords(droop.travelMm, unit)}` },
        { id: "camber-gain", label: "Camber gain", value: `${signed(a.atStatic.camberGainDegPerMm * (unit === "in" ? 25.4 : 1), unit === "in" ? 2 : 3)} °/${unit}`, hint: "at ride height" },
        { id: "roll-centre", label: "Roll centre height", value: formatLength(a.atStatic.rollCentreHeightMm, unit, 1), hint: "above the ground, ride height" },
      ],
    },
    {
      id: "steering",
      title: "Steering axis",
      readouts: [
        { id: "ackermann", label: "Ackermann at lock", value: fmt(a.ackermann.atLockPct, 0, "%"), hint: "100 % = axes meet on the rear axle line" },
        { id: "kpi", label: "Kingpin inclination", value: fmt(a.steerAxis.kingpinInclinationDeg, 1, "°") },
        { id: "caster", label: "Caster", value: fmt(a.steerAxis.casterDeg, 1, "°") },
        { id: "scrub", label: "Scrub radius", value: formatLength(a.steerAxis.scrubRadiusMm, unit, 1, true), hint: "+ axis meets the ground inboard" },
        { id: "trail", label: "Caster trail", value: formatLength(a.steerAxis.casterTrailMm, unit, 1, true), hint: "+ axis meets the ground ahead" },
      ],
    },
    {
      id: "strength",
      title: "Shaft strength",
      readouts: [
        { id: "safety-factor", label: "Safety factor at the neck", value: fmt(s.safetyFactor, 2), hint: `target ${fmt(s.targetSafetyFactor, 1)} · ${fmt(s.shearStressMpa, 0, "MPa")} of ${fmt(s.allowableShearMpa, 0, "MPa")}`, tone: s.meetsTarget ? "good" : "bad" },
      ],
    },
  ];
}
