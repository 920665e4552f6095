"use client";
// The top view (x–y, seen from above, drawn in line with the front view so y runs the same way; forward
// is down the screen): both front wheels at the previewed steer, steering arms, tie rods and the rack,
// the shafts, and the turning construction (the wheel axes, where they meet, and the rear axle line).
import { useDeferredValue, useMemo } from "react";
import { fmt } from "@/lib/format";
import { handlesOf } from "../document/handles";
import { useEditor } from "../store/editor-context";
import { formatLength } from "../units/length-unit";
import { topBox, topDrawing, type TopWheelDrawing } from "./corner-drawing";
import { CLEARANCE_COLOUR, INK } from "./drawing-colours";
import { PlaneBand, PlaneDimension, PlaneDot, PlaneLabel, PlaneLine } from "./plane-shapes";
import { previewBinding } from "./preview-state";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";
import { BindingNote, FaultNote, StaticGhost, faultColour } from "./view-notes";
import type { ViewTransform } from "./view-transform";
import type { PartId } from "../document/handles";

const HANDLES = handlesOf("top");

function Wheel({ t, w, neckMm, part, shaftColour }: { t: ViewTransform; w: TopWheelDrawing; neckMm: number; part: PartId | null; shaftColour: string }) {
  return (
    <>
      <PlaneLine t={t} points={w.tyre} closed fill={INK.tyreFill} stroke={faultColour(part, "wheel", INK.tyreStroke)} width={1.5} />
      <PlaneBand t={t} from={w.shaft[0]} to={w.shaft[1]} widthMm={neckMm} colour={faultColour(part, "shaft", shaftColour)} opacity={0.85} />
      <PlaneLine t={t} points={[w.kingpinGround, w.wheelCentre]} stroke={INK.knuckle} width={3} />
      <PlaneLine t={t} points={w.steeringArm} stroke={faultColour(part, "steeringArm", INK.knuckle)} width={3} />
      <PlaneLine t={t} points={w.tieRod} stroke={faultColour(part, "tieRod", INK.arm)} width={2.5} />
      <PlaneDot t={t} at={w.kingpinGround} radiusPx={3} fill={INK.kingpin} />
      <PlaneDot t={t} at={w.contactPatch} radiusPx={2.5} fill={INK.ground} />
    </>
  );
}

export function TopView() {
  const { layout, pose, error } = useShownPose();
  const show = useEditor((s) => s.settings.show);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const fault = useEditor((s) => s.live.fault);
  // Low priority: during a drag the readouts paint first, the drawing's figures follow a frame later.
  const analysis = useDeferredValue(useEditor((s) => s.live.analysis));
  const previewing = useEditor((s) => s.preview.rackMm !== 0 || s.preview.travelMm !== 0);
  const box = useMemo(() => topBox(layout), [layout]);
  const d = pose ? topDrawing(pose, layout) : null;
  const binding = pose ? previewBinding(pose, layout, analysis) : null;
  const shaftColour = binding?.kind === "joint" ? CLEARANCE_COLOUR.touching : INK.shaft;
  const part = fault?.part ?? null;
  const ahead = d?.turnCentreAheadOfRearAxleMm ?? null;
  const turnNote = d && show.ackermann
    ? ahead === null
      ? "Wheel axes parallel (straight ahead)"
      : `Wheel axes meet ${formatLength(Math.abs(ahead), unit, 1)} ${ahead >= 0 ? "ahead of" : "behind"} the rear axle line · inner ${fmt(Math.max(Math.abs(d.left.roadWheelDeg), Math.abs(d.right.roadWheelDeg)), 1, "°")}, outer ${fmt(Math.min(Math.abs(d.left.roadWheelDeg), Math.abs(d.right.roadWheelDeg)), 1, "°")}`
    : null;

  return (
    <ViewFrame
      id="top"
      title="Top view"
      axes="y left →, x forward ↓ (seen from above)"
      box={box}
      handles={HANDLES}
      notes={
        <>
          {fault || error ? <FaultNote message={fault?.message ?? error!} /> : null}
          {binding ? <BindingNote binding={binding} /> : null}
          {turnNote ? <p className="mt-0.5 rounded bg-white/90 px-1.5 py-0.5 text-ink" data-testid="turn-note">{turnNote}</p> : null}
        </>
      }
    >
      {(t, size) => {
        const u0 = -t.ox / t.scale;
        const u1 = (size.width - t.ox) / t.scale;
        return (
          <>
            <PlaneLine t={t} points={[[0, -layout.frontView.tyreRadiusMm * 2], [0, layout.topView.wheelbaseMm + 10]]} stroke={INK.ghost} width={1} dash={[6, 4]} />
            <PlaneLine t={t} points={[[u0, 0], [u1, 0]]} stroke={INK.ghost} width={1} dash={[2, 4]} />
            <PlaneLabel t={t} at={[0, 0]} text="front axle line" dx={4} dy={4} colour={INK.ground} size={10} />
            {show.ackermann ? (
              <>
                <PlaneLine t={t} points={[[u0, layout.topView.wheelbaseMm], [u1, layout.topView.wheelbaseMm]]} stroke={INK.construction} width={1.5} />
                <PlaneLabel t={t} at={[u0, layout.topView.wheelbaseMm]} text="rear axle line" dx={4} dy={2} colour={INK.construction} size={10} />
              </>
            ) : null}
            {previewing ? <StaticGhost t={t} layout={layout} view="top" /> : null}
            {d ? (
              <>
                {show.ackermann && d.turnCentre ? (
                  <>
                    <PlaneLine t={t} points={[d.left.wheelCentre, d.turnCentre]} stroke={INK.construction} width={1} dash={[5, 4]} />
                    <PlaneLine t={t} points={[d.right.wheelCentre, d.turnCentre]} stroke={INK.construction} width={1} dash={[5, 4]} />
                    <PlaneDot t={t} at={d.turnCentre} radiusPx={4} fill="#ffffff" stroke={INK.construction} width={2} />
                  </>
                ) : null}
                <PlaneLine t={t} points={d.rack} stroke={faultColour(part, "tieRod", INK.arm)} width={5} opacity={0.6} />
                <Wheel t={t} w={d.left} neckMm={layout.drive.neckDiameterMm} part={part} shaftColour={shaftColour} />
                <Wheel t={t} w={d.right} neckMm={layout.drive.neckDiameterMm} part={null} shaftColour={INK.shaft} />
                {show.dimensions ? (
                  <>
                    {/* The figures go ahead of the tyre, where the drawing is empty: beside the small parts they
                        would cover the linkage or run off the view. */}
                    <PlaneDimension t={t} from={d.left.kingpinGround} to={[d.left.contactPatch[0], d.left.kingpinGround[1]]} text="" offsetPx={16} />
                    <PlaneDimension t={t} from={d.left.steeringArm[0]} to={d.left.steeringArm[1]} text="" offsetPx={-14} />
                    <PlaneLabel t={t} at={[d.left.wheelCentre[0], -layout.frontView.tyreRadiusMm]} text={`arm ${formatLength(d.steeringArmLengthMm, unit, 1)}\ntrail ${formatLength(d.trailMm, unit, 1, true)}`} dx={0} dy={6} align="center" />
                    <PlaneLabel t={t} at={d.left.wheelCentre} text={`${fmt(d.left.roadWheelDeg, 1, "°")}`} dx={8} dy={-20} bold />
                    <PlaneLabel t={t} at={d.right.wheelCentre} text={`${fmt(d.right.roadWheelDeg, 1, "°")}`} dx={-36} dy={-20} bold />
                  </>
                ) : null}
              </>
            ) : null}
          </>
        );
      }}
    </ViewFrame>
  );
}
