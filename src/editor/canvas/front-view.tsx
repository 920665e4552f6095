"use client";
import { useDeferredValue, useMemo } from "react";
// The front view (y–z, seen from ahead), drawn from the shared scene (src/drawing/front-scene.ts): the same
// drawing the SVG, DXF and dimension-sheet exports make.
import { frontBox } from "@/drawing/corner-drawing";
import { CLEARANCE_COLOUR, INK } from "@/drawing/drawing-colours";
import { frontScene } from "@/drawing/front-scene";
import { previewBinding } from "@/drawing/preview-state";
import { handlesOf } from "../document/handles";
import { useEditor } from "../store/editor-context";
import { SceneShapes } from "./scene-shapes";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";
import { BindingNote, FaultNote } from "./view-notes";

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
  const binding = pose ? previewBinding(pose, layout, analysis) : null;
  const scene = frontScene({
    layout,
    pose,
    unit,
    show,
    faultPart: fault?.part ?? null,
    shaftColour: binding?.kind === "joint" ? CLEARANCE_COLOUR.touching : INK.shaft,
    ghost: previewing,
  });

  return (
    <ViewFrame
      id="front"
      title={scene.title}
      axes={scene.axes}
      box={box}
      handles={HANDLES}
      notes={<>{fault || error ? <FaultNote message={fault?.message ?? error!} /> : null}{binding ? <BindingNote binding={binding} /> : null}</>}
    >
      {(t, size) => <SceneShapes scene={scene} t={t} width={size.width} />}
    </ViewFrame>
  );
}
