// What binds at the previewed steer and travel, for naming it on the drawing: the joint past its limit,
// the tie rod unable to reach (over centre), or the steering input at the end of its travel.
import type { AnalysisResult, CornerPose } from "@/engine";
import type { Layout } from "@/contracts/layout";
import { steerInputTravel } from "@/figures/steer-input";

export type PreviewBinding =
  | { readonly kind: "none" }
  | { readonly kind: "joint"; readonly wheel: "left" | "right"; readonly angleDeg: number; readonly limitDeg: number; readonly by: "neck-contact" | "slot-limit" | "rated-angle" }
  | { readonly kind: "tie-rod"; readonly wheel: "left" | "right" }
  | { readonly kind: "input-end"; readonly input: "rack" | "bellcrank" };

/** The wheel whose joint bends more at this pose (the joint section shows it). */
export function worseWheel(pose: CornerPose): "left" | "right" {
  return pose.right.jointAngleDeg > pose.left.jointAngleDeg ? "right" : "left";
}

export function previewBinding(pose: CornerPose, layout: Layout, analysis: AnalysisResult | null): PreviewBinding {
  for (const wheel of ["left", "right"] as const) if (!pose[wheel].steerSolved) return { kind: "tie-rod", wheel };
  if (analysis) {
    const wheel = worseWheel(pose);
    const angle = pose[wheel].jointAngleDeg;
    const limit = analysis.drive.jointLimitDeg;
    if (angle >= limit - 1e-9) return { kind: "joint", wheel, angleDeg: angle, limitDeg: limit, by: analysis.drive.jointLimitBy };
  }
  if (Math.abs(Math.abs(pose.steerInput) - steerInputTravel(layout)) < 1e-9 && pose.steerInput !== 0) return { kind: "input-end", input: layout.topView.steeringInput.kind };
  return { kind: "none" };
}
