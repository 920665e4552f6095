"use client";
// The joint's limit from the live figures, by value: a drag brings a new analysis every pointer move, and
// a view that took the whole analysis would draw twice a move (or a frame late) for a limit that rarely moves.
import { useMemo } from "react";
import type { JointLimit } from "@/drawing/preview-state";
import { useEditor } from "../store/editor-context";

export function useJointLimit(): JointLimit | null {
  const jointLimitDeg = useEditor((s) => s.live.analysis?.drive.jointLimitDeg ?? null);
  const jointLimitBy = useEditor((s) => s.live.analysis?.drive.jointLimitBy ?? null);
  return useMemo(() => (jointLimitDeg !== null && jointLimitBy !== null ? { jointLimitDeg, jointLimitBy } : null), [jointLimitDeg, jointLimitBy]);
}
