// The three views of a kit as its exports draw them: the corner as laid out (ride height, straight ahead)
// in the front and top views, and the joint section at the largest angle the joint reaches inside the
// steer lock, where its clearance is least (the "least neck clearance" readout).
import type { Layout } from "@/contracts/layout";
import { cornerPoseAt, cornerPoser, type AnalysisResult } from "@/engine";
import type { LengthUnit } from "@/figures/length-unit";
import { frontScene } from "./front-scene";
import { jointScene, type JointScene } from "./joint-scene";
import { SHOW_ALL, type Scene, type SceneDetail } from "./scene";
import { topScene } from "./top-scene";

export interface KitScenes {
  readonly front: Scene;
  readonly top: Scene;
  readonly joint: JointScene;
}

/** Throws the engine's GeometryError when the corner cannot be posed (the analysis would have failed first). */
export function kitScenes(layout: Layout, analysis: AnalysisResult, unit: LengthUnit, detail: SceneDetail = "editor"): KitScenes {
  const pose = cornerPoseAt(cornerPoser(layout), 0, 0);
  return {
    front: frontScene({ layout, pose, unit, show: SHOW_ALL, detail }),
    top: topScene({ layout, pose, unit, show: SHOW_ALL, detail }),
    joint: jointScene({
      layout,
      betaDeg: analysis.drive.maxJointAngleWithinLockDeg,
      wheel: null,
      unit,
      showDimensions: true,
      limit: { deg: analysis.drive.jointLimitDeg, by: analysis.drive.jointLimitBy },
      detail,
    }),
  };
}
