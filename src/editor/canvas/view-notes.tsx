"use client";
// What the views say over the drawing: the fault (the part to blame, in red), what binds at the previewed
// steer and travel, and the layout at ride height shown faintly while previewing elsewhere.
import type { Layout } from "@/contracts/layout";
import { limitLabel, fmt } from "@/lib/format";
import type { PartId } from "../document/handles";
import { frontOf, topOf } from "./corner-drawing";
import { INK } from "./drawing-colours";
import { PlaneLine } from "./plane-shapes";
import type { PreviewBinding } from "./preview-state";
import type { ViewTransform } from "./view-transform";

/** The part's colour, or the fault colour when the fault is on this part. */
export function faultColour(faultPart: PartId | null, part: PartId, normal: string): string {
  return faultPart === part ? INK.fault : normal;
}

export function FaultNote({ message }: { message: string }) {
  return <p className="rounded bg-red-50/95 px-1.5 py-0.5 font-medium text-red-800" data-testid="view-fault">{message}</p>;
}

export function bindingText(b: PreviewBinding): string | null {
  switch (b.kind) {
    case "joint":
      return `Binds (${b.wheel} wheel): ${limitLabel(b.by)} at ${fmt(b.limitDeg, 1, "°")} — joint at ${fmt(b.angleDeg, 1, "°")}`;
    case "tie-rod":
      return `Binds (${b.wheel} wheel): the tie rod is over centre (in line with the steering arm) here`;
    case "input-end":
      return `End of ${b.input} travel`;
    default:
      return null;
  }
}

export function BindingNote({ binding }: { binding: PreviewBinding }) {
  const text = bindingText(binding);
  if (!text) return null;
  const tone = binding.kind === "input-end" ? "text-ink bg-white/90" : "text-red-800 bg-red-50/95";
  return <p className={`mt-0.5 rounded px-1.5 py-0.5 font-medium ${tone}`} data-testid="view-binding">{text}</p>;
}

/** The corner as laid out (ride height, straight ahead), faint, behind the previewed pose. */
export function StaticGhost({ t, layout, view }: { t: ViewTransform; layout: Layout; view: "front" | "top" }) {
  const f = layout.frontView;
  if (view === "front") {
    const p = (q: { y: number; z: number }) => frontOf([0, q.y, q.z]);
    return (
      <>
        <PlaneLine t={t} points={[p(f.lowerInner), p(f.lowerOuter), p(f.upperOuter), p(f.upperInner)]} stroke={INK.ghost} width={1} dash={[3, 3]} />
        <PlaneLine t={t} points={[p(f.lowerOuter), p(f.wheelCentre), p(f.upperOuter)]} stroke={INK.ghost} width={1} dash={[3, 3]} />
      </>
    );
  }
  const tv = layout.topView;
  const ball = topOf([tv.steeringArmBall.x, tv.steeringArmBall.y, 0]);
  const inner = topOf([tv.tieRodInner.x, tv.tieRodInner.y, 0]);
  const wheel = topOf([0, f.wheelCentre.y, 0]);
  return <PlaneLine t={t} points={[inner, ball, wheel]} stroke={INK.ghost} width={1} dash={[3, 3]} />;
}
