"use client";
// The top view (x–y, seen from above, in line with the front view; forward is down the screen): the rack or
// the bellcranks, both wheels and the turning construction, drawn from the shared scene (src/drawing/top-scene.ts): the same drawing the exports make.
import { useDeferredValue, useMemo } from "react";
import { topBox } from "@/drawing/corner-drawing";
import { CLEARANCE_COLOUR, INK } from "@/drawing/drawing-colours";
import { previewBinding } from "@/drawing/preview-state";
import { topScene } from "@/drawing/top-scene";
import { handlesOf } from "../document/handles";
import { useEditor } from "../store/editor-context";
import { SceneShapes } from "./scene-shapes";
import { useShownPose } from "./use-shown-pose";
import { ViewFrame } from "./view-frame";
import { BindingNote, FaultNote } from "./view-notes";


export function TopView() {
  const { layout, pose, error } = useShownPose();
  const show = useEditor((s) => s.settings.show);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const fault = useEditor((s) => s.live.fault);
  // Low priority: during a drag the readouts paint first, the drawing's figures follow a frame later.
  const analysis = useDeferredValue(useEditor((s) => s.live.analysis));
  const previewing = useEditor((s) => s.preview.steerInput !== 0 || s.preview.travelMm !== 0);
  const box = useMemo(() => topBox(layout), [layout]);
  const handles = useMemo(() => handlesOf("top", layout), [layout]);
  const binding = pose ? previewBinding(pose, layout, analysis) : null;
  const scene = topScene({
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
      id="top"
      title={scene.title}
      axes={scene.axes}
      box={box}
      handles={handles}
      notes={
        <>
          {fault || error ? <FaultNote message={fault?.message ?? error!} /> : null}
          {binding ? <BindingNote binding={binding} /> : null}
          {scene.notes.map((note) => <p key={note} className="mt-0.5 rounded bg-white/90 px-1.5 py-0.5 text-ink" data-testid="turn-note">{note}</p>)}
        </>
      }
    >
      {(t, size) => <SceneShapes scene={scene} t={t} width={size.width} />}
    </ViewFrame>
  );
}
