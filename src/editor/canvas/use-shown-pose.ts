"use client";
// The corner at the previewed steer and travel, solved by the engine for the layout on screen.
import { useMemo } from "react";
import type { Layout } from "@/contracts/layout";
import { cornerPoseAt, cornerPoser, GeometryError, type CornerPose, type CornerPoser } from "@/engine";
import { steerInputTravel } from "@/figures/steer-input";
import { selectShownLayout } from "../store/editor-store";
import { useEditor } from "../store/editor-context";

export interface ShownPose {
  readonly layout: Layout;
  readonly pose: CornerPose | null;
  /** Why the corner cannot be posed (the drawing then shows the layout's points as they are). */
  readonly error: string | null;
}

function poserOf(layout: Layout): { poser: CornerPoser | null; error: string | null } {
  try {
    return { poser: cornerPoser(layout), error: null };
  } catch (e) {
    if (e instanceof GeometryError) return { poser: null, error: e.message };
    throw e;
  }
}

export function useShownPose(): ShownPose {
  const layout = useEditor(selectShownLayout);
  const input = useEditor((s) => s.preview.steerInput);
  const travel = useEditor((s) => s.preview.travelMm);
  const prepared = useMemo(() => poserOf(layout), [layout]);
  return useMemo(() => {
    if (!prepared.poser) return { layout, pose: null, error: prepared.error };
    const f = layout.frontView;
    const t = Math.min(f.bumpTravelMm, Math.max(-f.droopTravelMm, travel));
    const end = steerInputTravel(layout);
    const s = Math.min(end, Math.max(-end, input));
    try {
      return { layout, pose: cornerPoseAt(prepared.poser, t, s), error: null };
    } catch (e) {
      if (e instanceof GeometryError) return { layout, pose: null, error: e.message };
      throw e;
    }
  }, [layout, prepared, input, travel]);
}
