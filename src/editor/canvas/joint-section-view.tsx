"use client";
// The joint section: the neck in its cup at the articulation of the previewed pose (the wheel whose
// joint bends more), coloured by clearance, with the contact point and the gap figured on the drawing.
import { useDeferredValue, useMemo } from "react";
import { fmt, limitLabel } from "@/lib/format";
import { useEditor } from "../store/editor-context";
import { formatLength } from "../units/length-unit";
import { CLEARANCE_COLOUR, CLEARANCE_LABEL, INK } from "./drawing-colours";
import { jointSection } from "./joint-section-geometry";
import { PlaneDimension, PlaneDot, PlaneLabel, PlaneLine } from "./plane-shapes";
import { worseWheel } from "./preview-state";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";

export function JointSectionView() {
  const { layout, pose } = useShownPose();
  const unit = useEditor((s) => s.settings.lengthUnit);
  // Low priority: during a drag the readouts paint first, the drawing's figures follow a frame later.
  const analysis = useDeferredValue(useEditor((s) => s.live.analysis));
  const show = useEditor((s) => s.settings.show.dimensions);
  const d = layout.drive;
  const wheel = pose ? worseWheel(pose) : "left";
  const beta = pose ? pose[wheel].jointAngleDeg : 0;
  const valid = d.neckDiameterMm < d.cupMouthDiameterMm;
  const section = useMemo(
    () => jointSection({ mouthDiameterMm: d.cupMouthDiameterMm, pivotDepthMm: d.pivotDepthMm, neckDiameterMm: Math.min(d.neckDiameterMm, d.cupMouthDiameterMm), boreDiameterMm: d.boreDiameterMm, betaDeg: beta, slotted: d.slottedCup, slotLimitDeg: d.slotLimitDeg }),
    [d.cupMouthDiameterMm, d.pivotDepthMm, d.neckDiameterMm, d.boreDiameterMm, d.slottedCup, d.slotLimitDeg, beta],
  );
  const box = useMemo(() => ({ ...section.extent, maxV: Math.max(section.extent.maxV, d.cupMouthDiameterMm * 1.4) }), [section.extent, d.cupMouthDiameterMm]);
  const colour = CLEARANCE_COLOUR[valid ? section.state : "touching"];
  const limit = analysis?.drive.jointLimitDeg ?? null;
  const state = valid ? CLEARANCE_LABEL[section.state] : "wider than the mouth";
  const summary = section.clearanceMm !== null
    ? `${wheel} wheel, joint at ${fmt(beta, 1, "°")}: neck ${state}, gap ${formatLength(section.clearanceMm, unit, 2)}`
    : `${wheel} wheel, joint at ${fmt(beta, 1, "°")}: slot ${state}, ${fmt((d.slotLimitDeg ?? 0) - beta, 1, "°")} to the slot end`;

  return (
    <ViewFrame
      id="joint"
      title="Joint section"
      axes="through the plane of articulation"
      box={box}
      notes={
        <p className={`rounded bg-white/90 px-1.5 py-0.5 font-medium`} style={{ color: colour }} data-testid="joint-state" data-state={valid ? section.state : "touching"}>
          {summary}
          {limit !== null && analysis ? <span className="block font-normal text-ink">limit {fmt(limit, 1, "°")} ({limitLabel(analysis.drive.jointLimitBy)})</span> : null}
        </p>
      }
    >
      {(t) => (
        <>
          <PlaneLine t={t} points={[[section.extent.minU, 0], [section.extent.maxU, 0]]} stroke={INK.ghost} width={1} dash={[6, 4]} />
          {section.cupWalls.map((wall, i) => (
            <PlaneLine key={i} t={t} points={wall} closed fill="#cbd5e1" stroke={colour} width={1.5} />
          ))}
          <PlaneLine t={t} points={section.neck} closed fill={colour} stroke={colour} width={1} opacity={0.55} />
          {section.bore ? <PlaneLine t={t} points={section.bore} closed fill="#ffffff" stroke={colour} width={1} /> : null}
          <PlaneLine t={t} points={section.neckAxis} stroke={INK.knuckle} width={1} dash={[4, 3]} />
          {section.slotLine ? <PlaneLine t={t} points={section.slotLine} stroke={INK.fault} width={1.5} dash={[6, 3]} /> : null}
          <PlaneDot t={t} at={[0, 0]} radiusPx={Math.max(3, section.pivotRadiusMm * t.scale)} fill={INK.shaft} />
          {section.clearanceMm !== null ? (
            <>
              <PlaneLine t={t} points={[section.rim, section.neckSurfaceNearRim]} stroke={colour} width={2} />
              <PlaneDot t={t} at={section.rim} radiusPx={3.5} fill={colour} />
              <PlaneLabel t={t} at={section.rim} text={`gap ${formatLength(section.clearanceMm, unit, 2)}`} colour={colour} dx={6} dy={-(section.wallMm * t.scale) - 16} bold />
            </>
          ) : null}
          {show ? (
            <>
              {/* Clear of the part: the mouth just outside its plane with its figure under the cup's corner,
                  the pivot depth under the lower wall, β inside the cup beside the pivot. */}
              <PlaneDimension t={t} from={[-d.pivotDepthMm, -d.cupMouthDiameterMm / 2]} to={[-d.pivotDepthMm, d.cupMouthDiameterMm / 2]} text={`mouth ⌀${formatLength(d.cupMouthDiameterMm, unit, 2)}`} offsetPx={-10} label="outside-from" />
              <PlaneDimension t={t} from={[0, -d.cupMouthDiameterMm / 2]} to={[-d.pivotDepthMm, -d.cupMouthDiameterMm / 2]} text={`pivot depth ${formatLength(d.pivotDepthMm, unit, 2)}`} offsetPx={-(section.wallMm * t.scale + 8)} label="under" />
              <PlaneLabel t={t} at={section.neckAxis[1]} text={`neck ⌀${formatLength(d.neckDiameterMm, unit, 2)}`} dx={-20} dy={-24} />
              <PlaneLabel t={t} at={[0, 0]} text={`β ${fmt(beta, 1, "°")}`} dx={Math.max(3, section.pivotRadiusMm * t.scale) + 4} dy={-5} bold />
            </>
          ) : null}
        </>
      )}
    </ViewFrame>
  );
}
