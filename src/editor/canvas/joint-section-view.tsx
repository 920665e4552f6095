"use client";
// The joint section: the neck in its cup at the articulation of the previewed pose (the wheel whose joint
// bends more), drawn from the shared scene (src/drawing/joint-scene.ts), coloured by clearance.
import { useDeferredValue, useMemo } from "react";
import { jointScene } from "@/drawing/joint-scene";
import { worseWheel } from "@/drawing/preview-state";
import { useEditor } from "../store/editor-context";
import { SceneShapes } from "./scene-shapes";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";

export function JointSectionView() {
  const { layout, pose } = useShownPose();
  const unit = useEditor((s) => s.settings.lengthUnit);
  // Low priority: during a drag the readouts paint first, the drawing's figures follow a frame later.
  const analysis = useDeferredValue(useEditor((s) => s.live.analysis));
  const showDimensions = useEditor((s) => s.settings.show.dimensions);
  const wheel = pose ? worseWheel(pose) : "left";
  const beta = pose ? pose[wheel].jointAngleDeg : 0;
  // The limit goes in by value: a new analysis with the same limit draws nothing new.
  const limitDeg = analysis?.drive.jointLimitDeg ?? null;
  const limitBy = analysis?.drive.jointLimitBy ?? null;
  const scene = useMemo(
    () => jointScene({ layout, betaDeg: beta, wheel, unit, showDimensions, limit: limitDeg !== null && limitBy ? { deg: limitDeg, by: limitBy } : null }),
    [layout, beta, wheel, unit, showDimensions, limitDeg, limitBy],
  );

  return (
    <ViewFrame
      id="joint"
      title={scene.title}
      axes={scene.axes}
      box={scene.box}
      notes={
        <p className="rounded bg-white/90 px-1.5 py-0.5 font-medium" style={{ color: scene.colour }} data-testid="joint-state" data-state={scene.state}>
          {scene.summary}
          {scene.limitText ? <span className="block font-normal text-ink">{scene.limitText}</span> : null}
        </p>
      }
    >
      {(t, size) => <SceneShapes scene={scene} t={t} width={size.width} />}
    </ViewFrame>
  );
}
