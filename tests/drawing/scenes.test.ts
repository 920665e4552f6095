// The views as scenes, the drawing every renderer shares: the parts sit on the layout's own points, the
// figures written on them are the geometry's, and a scene placed on a screen keeps the canvas's sizes.
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE, TARNWICK_10_CARDAN, TARNWICK_10_PRINTED } from "@/contracts/demo-layouts";
import { frontScene } from "@/drawing/front-scene";
import { jointScene } from "@/drawing/joint-scene";
import { kitScenes } from "@/drawing/kit-scenes";
import { SCENE_LAYERS, SHOW_ALL, type Scene, type SceneItem } from "@/drawing/scene";
import { coordinateText } from "@/drawing/scene-text";
import { sceneMarks } from "@/drawing/screen-scene";
import { topScene } from "@/drawing/top-scene";
import { analyzeLayout, cornerPoseAt, cornerPoser, neckClearanceMm } from "@/engine";
import { expectNear } from "../engine/near";

const staticPose = (layout = TARNWICK_10_BASE) => cornerPoseAt(cornerPoser(layout), 0, 0);
const item = (scene: Scene, part: string): SceneItem => {
  const found = scene.items.find((i) => i.part === part);
  if (!found) throw new Error(`${scene.view} has no ${part}`);
  return found;
};

describe("front view scene", () => {
  it("draws the arms from pivot to pivot at ride height, on the arms layer", () => {
    // At ride height and rack centred the solved corner is the layout as given (cornerPoseAt's definition).
    const f = TARNWICK_10_BASE.frontView;
    const scene = frontScene({ layout: TARNWICK_10_BASE, pose: staticPose(), unit: "mm", show: SHOW_ALL });
    const lower = item(scene, "lower-arm");
    expect(lower.type === "path" && lower.layer).toBe("arms");
    if (lower.type !== "path") return;
    expectNear(lower.points[0]![0], f.lowerInner.y, 1e-9, "lower inner y");
    expectNear(lower.points[0]![1], f.lowerInner.z, 1e-9, "lower inner z");
    expectNear(lower.points[1]![0], f.lowerOuter.y, 1e-9, "lower outer y");
    expectNear(lower.points[1]![1], f.lowerOuter.z, 1e-9, "lower outer z");
    // The dimension reads the arm's length: √(80² + 1²) = 80.006 mm, shown to 0.1 mm.
    const dim = item(scene, "lower-arm-length");
    expect(dim.type === "dimension" && dim.text).toBe("80.0 mm");
  });

  it("leaves out what Show… turns off, and adds pivot coordinates and the shaft length on a sheet", () => {
    const pose = staticPose();
    const bare = frontScene({ layout: TARNWICK_10_BASE, pose, unit: "mm", show: { ...SHOW_ALL, instantCentre: false, rollCentre: false, dimensions: false } });
    for (const part of ["instant-centre", "roll-centre", "lower-arm-length", "lower-inner-coordinates"]) expect(bare.items.some((i) => i.part === part), part).toBe(false);
    const sheet = frontScene({ layout: TARNWICK_10_BASE, pose, unit: "mm", show: SHOW_ALL, detail: "sheet" });
    const label = item(sheet, "lower-inner-coordinates");
    expect(label.type === "label" && label.text).toBe("(30.0, 24.0)");
    const shaft = item(sheet, "shaft-length");
    const d = TARNWICK_10_BASE.drive;
    // Static shaft length: the distance between the two joint centres as laid out (x = 0 for both).
    const length = Math.hypot(d.outboardJoint.y - d.inboardJoint.y, d.outboardJoint.z - d.inboardJoint.z);
    expect(shaft.type === "dimension" && shaft.text).toBe(`shaft ${length.toFixed(1)} mm`);
  });

  it("draws only the ground and the centreline when the corner cannot be posed", () => {
    const scene = frontScene({ layout: TARNWICK_10_BASE, pose: null, unit: "mm", show: SHOW_ALL });
    expect(scene.items.map((i) => i.part)).toEqual(["ground", "centreline", "centreline-label"]);
  });

  it("colours the part a fault names", () => {
    const scene = frontScene({ layout: TARNWICK_10_BASE, pose: staticPose(), unit: "mm", show: SHOW_ALL, faultPart: "lowerArm" });
    const lower = item(scene, "lower-arm");
    const upper = item(scene, "upper-arm");
    expect(lower.type === "path" && upper.type === "path" && lower.stroke !== upper.stroke).toBe(true);
  });
});

describe("top view scene", () => {
  it("has both wheels, the steering and the rack; the steering on its own layer", () => {
    const scene = topScene({ layout: TARNWICK_10_BASE, pose: staticPose(), unit: "mm", show: SHOW_ALL });
    for (const part of ["left-tyre", "right-tyre", "left-steering-arm", "right-tie-rod", "rack", "rear-axle-line"]) item(scene, part);
    expect(item(scene, "left-tie-rod").layer).toBe("steering");
    // Straight ahead the wheel axes are parallel: no turn centre, and the note says so.
    expect(scene.items.some((i) => i.part === "turn-centre")).toBe(false);
    expect(scene.notes).toEqual(["Wheel axes parallel (straight ahead)"]);
  });

  it("at full rack the wheel axes meet and the note says where, with the inner and outer angles", () => {
    const pose = cornerPoseAt(cornerPoser(TARNWICK_10_BASE), 0, 4);
    const scene = topScene({ layout: TARNWICK_10_BASE, pose, unit: "mm", show: SHOW_ALL });
    item(scene, "turn-centre");
    const inner = Math.max(Math.abs(pose.left.roadWheelDeg), Math.abs(pose.right.roadWheelDeg));
    expect(scene.notes[0]).toMatch(new RegExp(`^Wheel axes meet \\d+\\.\\d mm (ahead of|behind) the rear axle line · inner ${inner.toFixed(1)}°`));
  });
});

describe("joint section scene", () => {
  it("figures the gap the engine computes at that articulation, in the unit asked", () => {
    const d = TARNWICK_10_BASE.drive;
    const scene = jointScene({ layout: TARNWICK_10_BASE, betaDeg: 20, wheel: "left", unit: "in", showDimensions: true, limit: null });
    // The engine's neck-to-rim gap (D/2)cos β − a sin β − d/2 is the reference (src/engine/drive/neck-contact.ts).
    const gap = neckClearanceMm({ mouthDiameterMm: d.cupMouthDiameterMm, neckDiameterMm: d.neckDiameterMm, pivotDepthMm: d.pivotDepthMm }, 20);
    const label = item(scene, "gap-label");
    expect(label.type === "label" && label.text).toBe(`gap ${(gap / 25.4).toFixed(4)} in`);
    expect(scene.state).toBe(gap < 0.3 ? "close" : "clear");
  });

  it("a slotted cup has no gap but the slot's end; a hollow neck its bore on a sheet", () => {
    const slotted = jointScene({ layout: TARNWICK_10_PRINTED, betaDeg: 33, wheel: null, unit: "mm", showDimensions: true, limit: { deg: 34, by: "slot-limit" } });
    expect(slotted.items.some((i) => i.part === "gap-label")).toBe(false);
    item(slotted, "slot-end");
    // Within 2° of the slot end the drawing calls it close (our own display threshold, slotState).
    expect(slotted.summary).toBe("Joint at 33.0°: slot close, 1.0° to the slot end");
    expect(slotted.limitText).toBe("limit 34.0° (end of the cup slot)");
    const hollow = jointScene({ layout: TARNWICK_10_CARDAN, betaDeg: 10, wheel: null, unit: "mm", showDimensions: true, limit: null, detail: "sheet" });
    const bore = item(hollow, "bore-label");
    expect(bore.type === "label" && bore.text).toBe("bore ⌀2.00 mm");
  });
});

describe("the exports' scenes", () => {
  it.each(DEMO_LAYOUTS.map((d) => [d.key, d.layout] as const))("%s: the joint at its largest angle within lock, every item on a known layer", (_key, layout) => {
    const a = analyzeLayout(layout, { travelSteps: 21, steerSteps: 41 });
    const scenes = kitScenes(layout, a, "mm", "sheet");
    expect(scenes.joint.summary).toContain(`Joint at ${a.drive.maxJointAngleWithinLockDeg.toFixed(1)}°`);
    for (const scene of [scenes.front, scenes.top, scenes.joint]) {
      for (const i of scene.items) expect(SCENE_LAYERS).toContain(i.layer);
      expect(scene.items.every((i) => JSON.stringify(i).match(/NaN|Infinity/) === null)).toBe(true);
    }
  });
});

describe("a scene on a screen", () => {
  const scene = (items: SceneItem[]): Scene => ({ view: "front", title: "", axes: "", box: { minU: 0, maxU: 10, minV: 0, maxV: 10 }, items, notes: [] });
  const t = { scale: 2, ox: 100, oy: 200 };

  it("sets a dimension line off by its offset, square to the measured line, with ticks and its figure", () => {
    const marks = sceneMarks(scene([{ type: "dimension", layer: "dimensions", part: "d", from: [0, 0], to: [10, 0], text: "10.0 mm", offsetPx: 14, colour: "#000" }]), t, { left: 0, width: 400 });
    const [line, tick1, , text] = marks;
    // Plane (0,0)–(10,0) is screen (100,200)–(120,200); the offset is along the screen normal (0, 1).
    expect(line).toMatchObject({ kind: "stroke", points: [[100, 214], [120, 214]], width: 0.75, round: false });
    expect(tick1).toMatchObject({ points: [[100, 210], [100, 218]] });
    expect(text).toMatchObject({ kind: "text", at: [113, 201], text: "10.0 mm", size: 11 });
  });

  it("scales the pixel sizes by k and keeps real sizes real (a band is its width in mm)", () => {
    const items: SceneItem[] = [
      { type: "band", layer: "shaft-joint", part: "shaft", from: [0, 0], to: [10, 0], widthMm: 5, colour: "#000" },
      { type: "path", layer: "arms", part: "arm", points: [[0, 0], [10, 10]], stroke: "#000", widthPx: 4, dashPx: [6, 4] },
      { type: "rule", layer: "construction", part: "ground", v: 0, stroke: "#000", widthPx: 1 },
      { type: "label", layer: "construction", part: "l", at: [5, 5], text: "x", colour: "#000", dxPx: 4, dyPx: 2, sizePx: 10, pinStart: true },
    ];
    const [band, arm, rule, label] = sceneMarks(scene(items), t, { left: 30, width: 300 }, 0.5);
    expect(band).toMatchObject({ width: 10 }); // 5 mm × 2 px/mm
    expect(arm).toMatchObject({ width: 2, dash: [3, 2] });
    expect(rule).toMatchObject({ points: [[30, 200], [330, 200]] });
    expect(label).toMatchObject({ at: [32, 191], size: 5 });
  });
});

describe("coordinate labels", () => {
  it("read one decimal in mm and three in inches, never −0", () => {
    expect(coordinateText([30, 24], "mm")).toBe("(30.0, 24.0)");
    expect(coordinateText([25.4, -0.01], "in")).toBe("(1.000, 0.000)");
  });
});
