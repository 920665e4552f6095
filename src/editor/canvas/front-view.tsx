"use client";
import { useDeferredValue, useMemo } from "react";
// The front view (y–z, seen from ahead): arms, knuckle, kingpin axis to the ground, wheel and tyre, the
// drive shaft between its joints; the instant and roll centres as construction.
import { handlesOf } from "../document/handles";
import { useEditor } from "../store/editor-context";
import { formatLength } from "../units/length-unit";
import { frontBox, frontDrawing } from "./corner-drawing";
import { CLEARANCE_COLOUR, INK } from "./drawing-colours";
import { PlaneBand, PlaneDimension, PlaneDot, PlaneLabel, PlaneLine } from "./plane-shapes";
import { previewBinding } from "./preview-state";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";
import { BindingNote, FaultNote, StaticGhost, faultColour } from "./view-notes";

const HANDLES = handlesOf("front");

export function FrontView() {
  const { layout, pose, error } = useShownPose();
  const show = useEditor((s) => s.settings.show);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const fault = useEditor((s) => s.live.fault);
  // Low priority: during a drag the readouts paint first, the drawing's figures follow a frame later.
  const analysis = useDeferredValue(useEditor((s) => s.live.analysis));
  const previewing = useEditor((s) => s.preview.steerInput !== 0 || s.preview.travelMm !== 0);
  const box = useMemo(() => frontBox(layout), [layout]);
  const d = pose ? frontDrawing(pose, layout) : null;
  const binding = pose ? previewBinding(pose, layout, analysis) : null;
  const shaftColour = binding?.kind === "joint" ? CLEARANCE_COLOUR.touching : INK.shaft;
  const part = fault?.part ?? null;

  return (
    <ViewFrame
      id="front"
      title="Front view"
      axes="y left →, z up ↑ (seen from ahead)"
      box={box}
      handles={HANDLES}
      notes={<>{fault || error ? <FaultNote message={fault?.message ?? error!} /> : null}{binding ? <BindingNote binding={binding} /> : null}</>}
    >
      {(t, size) => {
        const groundZ = d?.groundZ ?? 0;
        const gu0 = -t.ox / t.scale;
        const gu1 = (size.width - t.ox) / t.scale;
        return (
          <>
            <PlaneLine t={t} points={[[gu0, groundZ], [gu1, groundZ]]} stroke={INK.ground} width={1.5} />
            <PlaneLine t={t} points={[[0, -5], [0, Math.max(layout.frontView.upperInner.z, layout.frontView.wheelCentre.z + layout.frontView.tyreRadiusMm) + 10]]} stroke={INK.ghost} width={1} dash={[6, 4]} />
            <PlaneLabel t={t} at={[0, groundZ]} text="centreline" dx={4} dy={4} colour={INK.ground} size={10} />
            {previewing ? <StaticGhost t={t} layout={layout} view="front" /> : null}
            {d ? (
              <>
                <PlaneLine t={t} points={d.tyre} closed fill={INK.tyreFill} stroke={faultColour(part, "wheel", INK.tyreStroke)} width={1.5} />
                <PlaneBand t={t} from={d.shaft[0]} to={d.shaft[1]} widthMm={layout.drive.neckDiameterMm} colour={faultColour(part, "shaft", shaftColour)} opacity={0.85} />
                <PlaneDot t={t} at={d.shaft[0]} radiusPx={4} fill={INK.shaft} />
                <PlaneDot t={t} at={d.shaft[1]} radiusPx={4} fill={INK.shaft} />
                <PlaneLine t={t} points={d.lowerArm} stroke={faultColour(part, "lowerArm", INK.arm)} width={4} />
                <PlaneLine t={t} points={d.upperArm} stroke={faultColour(part, "upperArm", INK.arm)} width={4} />
                <PlaneLine t={t} points={d.upright} closed stroke={faultColour(part, "upright", INK.knuckle)} width={3} />
                <PlaneDot t={t} at={d.wheelCentre} radiusPx={3} />
                {show.kingpinAxis ? (
                  <>
                    <PlaneLine t={t} points={d.kingpinAxis} stroke={faultColour(part, "kingpin", INK.kingpin)} width={1.5} dash={[8, 4]} />
                    <PlaneDot t={t} at={d.kingpinGround} radiusPx={3} fill={INK.kingpin} />
                  </>
                ) : null}
                <PlaneDot t={t} at={d.contactPatch} radiusPx={3} fill={INK.ground} />
                {show.instantCentre && d.instantCentre && Math.abs(d.instantCentre[0]) < 3000 && Math.abs(d.instantCentre[1]) < 3000 ? (
                  <>
                    <PlaneLine t={t} points={[d.lowerArm[0], d.instantCentre]} stroke={INK.construction} width={1} dash={[4, 4]} />
                    <PlaneLine t={t} points={[d.upperArm[0], d.instantCentre]} stroke={INK.construction} width={1} dash={[4, 4]} />
                    <PlaneDot t={t} at={d.instantCentre} radiusPx={3.5} fill={INK.construction} />
                    <PlaneLabel t={t} at={d.instantCentre} text="IC" colour={INK.construction} bold />
                  </>
                ) : null}
                {show.rollCentre && d.rollCentre && d.instantCentre ? (
                  <>
                    <PlaneLine t={t} points={[d.contactPatch, d.rollCentre]} stroke={INK.construction} width={1} dash={[2, 3]} />
                    <PlaneDot t={t} at={d.rollCentre} radiusPx={4} fill="#ffffff" stroke={INK.construction} width={2} />
                    <PlaneLabel t={t} at={d.rollCentre} text={`RC ${formatLength(d.rollCentre[1] - d.groundZ, unit, 1)}`} colour={INK.construction} bold />
                  </>
                ) : null}
                {show.dimensions ? (
                  <>
                    <PlaneDimension t={t} from={d.lowerArm[0]} to={d.lowerArm[1]} text={formatLength(d.lowerArmLengthMm, unit, 1)} offsetPx={14} />
                    <PlaneDimension t={t} from={d.upperArm[0]} to={d.upperArm[1]} text={formatLength(d.upperArmLengthMm, unit, 1)} offsetPx={-14} />
                    <PlaneDimension t={t} from={[d.kingpinGround[0], d.groundZ]} to={[d.contactPatch[0], d.groundZ]} text={`scrub ${formatLength(d.scrubRadiusMm, unit, 1, true)}`} offsetPx={-18} />
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
