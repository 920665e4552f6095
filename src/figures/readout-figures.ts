// The live readouts as label, figure and hint, from one analysis: the figures a designer watches while
// dragging. Each names its methods entry (the label links to it and explains itself on hover and focus).
// Pure (tested without a page); a missing figure is a dash or words saying why, never NaN.
import type { AnalysisResult } from "@/engine";
import { methodByKey } from "@/engine/methods/method-entries";
import { fmt, limitLabel, signed } from "./format";
import { formatLength, type LengthUnit } from "./length-unit";
import { formatSteerInput, steerInputWord } from "./steer-input";

export interface Readout {
  readonly id: string;
  readonly label: string;
  readonly value: string;
  readonly hint?: string;
  readonly tone?: "good" | "bad";
  /** Key of the figure's methods entry (an anchor of /methods). */
  readonly method: string;
  /** One line on hover and focus: the entry's own unless the readout needs its own words. */
  readonly explain: string;
}

export interface ReadoutGroup {
  readonly id: string;
  readonly title: string;
  readonly readouts: readonly Readout[];
  /** A caution that stands beside the group's figures. */
  readonly note?: string;
}

/** The caution the strength figures carry wherever they are shown (DESIGN.md's cautions). */
export const STRENGTH_CAUTION = "An estimate: printed parts vary with layer direction, infill, temperature and moisture. Guard a drivetrain spun up on the bench and wear eye protection.";

function r(id: string, label: string, value: string, method: string, extra: { hint?: string; tone?: "good" | "bad"; explain?: string } = {}): Readout {
  return { id, label, value, method, explain: extra.explain ?? methodByKey(method).explain, ...(extra.hint ? { hint: extra.hint } : {}), ...(extra.tone ? { tone: extra.tone } : {}) };
}

export function travelWords(mm: number, unit: LengthUnit): string {
  if (Math.abs(mm) < 1e-6) return "ride height";
  return mm > 0 ? `${formatLength(mm, unit, 1)} bump` : `${formatLength(-mm, unit, 1)} droop`;
}

/** What binds, in words, for the layout's input ("end of rack travel", "tie rod over centre (toggle)"). */
export function bindsText(a: AnalysisResult, reason: string): string {
  if (reason === "input-travel") return `end of ${steerInputWord(a.steering.input.kind)} travel`;
  return limitLabel(reason);
}

/** A sentence for a lock of zero: the joint is past its limit before the wheels turn at all. */
export function zeroLockNote(a: AnalysisResult, unit: LengthUnit): string | null {
  const w = a.steerLock.worst;
  if (w.steerInput !== 0 || w.limitedBy === "input-travel" || w.limitedBy === "toggle") return null;
  return `At ${travelWords(w.travelMm, unit)} the drive joint is already at ${fmt(w.jointAngleDeg, 1, "°")} with the wheels straight (steering centred, bump steer included), past its ${fmt(a.drive.jointLimitDeg, 1, "°")} limit: there is no steer lock there, so the lock reads 0°.`;
}

/** Why the Ackermann figure at lock is blank, or null when it is not. */
export function ackermannBlankReason(a: AnalysisResult): string | null {
  if (a.ackermann.atLockPct !== null) return null;
  return `blank: the lock is under ${fmt(a.ackermann.minReportingAngleDeg, 1, "°")} of steer, where the percentage is 0/0`;
}

/** The steering stop as three or four readouts (see steeringStop in the engine). */
function stopReadouts(a: AnalysisResult, unit: LengthUnit): Readout[] {
  const s = a.steeringStop;
  const kind = a.steering.input.kind;
  const word = steerInputWord(kind);
  const pos = (v: number, signedValue = false) => formatSteerInput(v, kind, unit, 2, signedValue);
  const out: Readout[] = [];
  if (s.status === "needed") {
    out.push(
      r("steering-stop", "Stop, each side", pos(Math.abs(s.leftTurnStopInput)), "steering-stop", {
        hint: `left turn ${pos(s.leftTurnStopInput, true)}, right ${pos(s.rightTurnStopInput, true)} · ${bindsText(a, s.limitedBy)} at ${pos(Math.abs(s.limitInput))} (${travelWords(s.worstTravelMm, unit)})`,
      }),
      r("stop-overrun", `${word[0]!.toUpperCase()}${word.slice(1)} travel past the limit`, pos(s.overrun), "steering-stop", {
        hint: `the ${word} as drawn runs ±${pos(a.steering.input.travel)}: without the stop it drives the joint past its limit`,
        tone: "bad",
      }),
    );
  } else if (s.status === "not-needed") {
    out.push(
      r("steering-stop", "Stop, each side", "none needed", "steering-stop", {
        hint: `the ${word}'s ±${pos(a.steering.input.travel)} ends before anything binds`,
        tone: "good",
      }),
    );
  } else {
    out.push(
      r("steering-stop", "Stop, each side", "no position", "steering-stop", {
        hint: `the joint is past its limit with the wheels straight at ${travelWords(s.worstTravelMm, unit)}: no stop can help`,
        tone: "bad",
      }),
    );
  }
  out.push(
    r("stop-angle-margin", s.status === "not-needed" ? "Angle margin at full travel" : "Angle margin at the stop", fmt(s.angleMarginDeg, 1, "°"), "steering-stop", {
      hint: `joint ${fmt(s.jointAngleAtStopDeg, 1, "°")} of its ${fmt(a.drive.jointLimitDeg, 1, "°")} limit, worst travel`,
      tone: s.angleMarginDeg < 0 ? "bad" : undefined,
      explain: "The joint angle still free before contact (or the rated angle) with the input at the stop, at the worst travel position.",
    }),
    r("stop-clearance", s.status === "not-needed" ? "Neck clearance at full travel" : "Neck clearance at the stop", s.clearanceAtStopMm === null ? "slotted cup" : formatLength(s.clearanceAtStopMm, unit, 2), "neck-clearance", {
      hint: s.clearanceAtStopMm === null ? `the slot's end limits it at ${fmt(a.drive.slotLimitDeg, 1, "°")}` : "neck to mouth rim, worst travel",
      tone: s.clearanceAtStopMm !== null && s.clearanceAtStopMm < 0 ? "bad" : undefined,
    }),
  );
  if (s.toggle) {
    out.push(
      r("stop-toggle", "Tie rod over centre at", pos(Math.abs(s.toggle.steerInput)), "toggle", {
        hint: `at ${travelWords(s.toggle.travelMm, unit)}: inside the ${word}'s travel, so the stop must also keep it from there`,
        tone: "bad",
      }),
    );
  }
  return out;
}

export function readoutGroups(a: AnalysisResult, unit: LengthUnit): ReadoutGroup[] {
  const worst = a.steerLock.worst;
  const stat = a.steerLock.static;
  const bump = a.travel[a.travel.length - 1]!;
  const droop = a.travel[0]!;
  const s = a.strength;
  const kind = a.steering.input.kind;
  const ackBlank = ackermannBlankReason(a);
  return [
    {
      id: "lock",
      title: "Steer lock",
      readouts: [
        r("steer-lock-worst", "Lock, worst over travel", fmt(worst.innerDeg, 1, "°"), "steer-lock", { hint: `inner wheel; outer ${fmt(worst.outerDeg, 1, "°")} · ${bindsText(a, worst.limitedBy)} at ${travelWords(worst.travelMm, unit)}` }),
        r("steer-lock-static", "Lock at ride height", fmt(stat.innerDeg, 1, "°"), "steer-lock", { hint: `outer ${fmt(stat.outerDeg, 1, "°")} · ${bindsText(a, stat.limitedBy)}` }),
        r("lock-limit", "What binds", bindsText(a, worst.limitedBy), worst.limitedBy === "toggle" ? "toggle" : worst.limitedBy === "input-travel" ? "steering-input" : "joint-limit"),
      ],
    },
    { id: "stop", title: "Steering stop", readouts: stopReadouts(a, unit) },
    {
      id: "joint",
      title: "Drive joint",
      readouts: [
        r("joint-max", "Largest joint angle within lock", fmt(a.drive.maxJointAngleWithinLockDeg, 1, "°"), "joint-angle", { hint: `limit ${fmt(a.drive.jointLimitDeg, 1, "°")} (${limitLabel(a.drive.jointLimitBy)})` }),
        r("joint-max-envelope", "Largest over the envelope", fmt(a.drive.maxJointAngleDeg, 1, "°"), "envelope", {
          hint: `at ${travelWords(a.drive.maxJointAngleAtTravelMm, unit)}, ${steerInputWord(kind)} ${formatSteerInput(a.drive.maxJointAngleAtSteerInput, kind, unit, 1, true)}`,
        }),
      ],
    },
    {
      id: "suspension",
      title: "Suspension",
      readouts: [
        r("camber-bump", "Camber at full bump", signed(bump.camberDeg, 2, "°"), "camber", { hint: `at ${travelWords(bump.travelMm, unit)}; + top outboard` }),
        r("camber-droop", "Camber at full droop", signed(droop.camberDeg, 2, "°"), "camber", { hint: `at ${travelWords(droop.travelMm, unit)}` }),
        r("camber-gain", "Camber gain", `${signed(a.atStatic.camberGainDegPerMm * (unit === "in" ? 25.4 : 1), unit === "in" ? 2 : 3)} °/${unit}`, "camber-gain", { hint: "at ride height" }),
        r("roll-centre", "Roll centre height", formatLength(a.atStatic.rollCentreHeightMm, unit, 1), "roll-centre", { hint: a.atStatic.rollCentreHeightMm === null ? "none: the arms are parallel" : "above the ground, ride height" }),
      ],
    },
    {
      id: "steering",
      title: "Steering axis",
      readouts: [
        r("ackermann", "Ackermann at lock", fmt(a.ackermann.atLockPct, 0, "%"), "ackermann", { hint: ackBlank ?? "100 % = axes meet on the rear axle line" }),
        r("kpi", "Kingpin inclination", fmt(a.steerAxis.kingpinInclinationDeg, 1, "°"), "kingpin-inclination"),
        r("caster", "Caster", fmt(a.steerAxis.casterDeg, 1, "°"), "caster"),
        r("scrub", "Scrub radius", formatLength(a.steerAxis.scrubRadiusMm, unit, 1, true), "scrub-radius", { hint: "+ axis meets the ground inboard" }),
        r("trail", "Caster trail", formatLength(a.steerAxis.casterTrailMm, unit, 1, true), "caster-trail", { hint: "+ axis meets the ground ahead" }),
      ],
    },
    {
      id: "strength",
      title: "Shaft strength",
      readouts: [
        r("safety-factor", "Safety factor at the neck", fmt(s.safetyFactor, 2), "safety-factor", { hint: `target ${fmt(s.targetSafetyFactor, 1)} · ${fmt(s.shearStressMpa, 0, "MPa")} of ${fmt(s.allowableShearMpa, 0, "MPa")}`, tone: s.meetsTarget ? "good" : "bad" }),
      ],
      note: STRENGTH_CAUTION,
    },
  ];
}
