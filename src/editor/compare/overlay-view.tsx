"use client";
// The front or top view of two to four layouts drawn over each other, one stroke style per item (colour and
// dash, so they part without colour too), from the same geometry the editor draws (corner-drawing.ts).
import { useId, useMemo } from "react";
import type { ComparedItem } from "@/contracts/compare";
import type { Layout } from "@/contracts/layout";
import { cornerPoseAt, cornerPoser, GeometryError, type CornerPose } from "@/engine";
import { frontBox, frontDrawing, topBox, topDrawing } from "@/drawing/corner-drawing";
import { INK } from "@/drawing/drawing-colours";
import { boxOf, fitBox, planeToScreen, type PlaneBox, type PlanePoint, type ViewTransform } from "@/drawing/view-transform";

/** One style per compared item: colour (each ≥ 4.5:1 on white, as it is also legend text) and dash. */
export const ITEM_STYLES = [
  { colour: "#3d5a73", dash: undefined, pattern: "solid" },
  { colour: "#c2410c", dash: "9 4", pattern: "dashed" },
  { colour: "#15803d", dash: "2 3", pattern: "dotted" },
  { colour: "#6d28d9", dash: "12 3 2 3", pattern: "dash-dot" },
] as const;

export const itemLetter = (i: number) => String.fromCharCode(65 + i);

export type OverlaySteer = "straight" | "lock";

const W = 560;
const H = 360;

interface Posed {
  readonly index: number;
  readonly layout: Layout;
  readonly pose: CornerPose;
}

function poseOf(item: ComparedItem, steer: OverlaySteer): CornerPose | null {
  if (!item.layout) return null;
  try {
    const rack = steer === "lock" && item.analysis ? item.analysis.steerLock.static.rackMm : 0;
    return cornerPoseAt(cornerPoser(item.layout), 0, rack);
  } catch (e) {
    if (e instanceof GeometryError) return null;
    throw e;
  }
}

function union(boxes: PlaneBox[]): PlaneBox | null {
  return boxOf(boxes.flatMap((b) => [[b.minU, b.minV], [b.maxU, b.maxV]] as PlanePoint[]));
}

const pts = (t: ViewTransform, ps: readonly PlanePoint[]) => ps.map((p) => planeToScreen(t, p).map((v) => v.toFixed(1)).join(",")).join(" ");

function Line({ t, points, colour, dash, width, closed }: { t: ViewTransform; points: readonly PlanePoint[]; colour: string; dash?: string; width: number; closed?: boolean }) {
  const Shape = closed ? "polygon" : "polyline";
  return <Shape points={pts(t, points)} fill="none" stroke={colour} strokeWidth={width} strokeDasharray={dash} strokeLinejoin="round" strokeLinecap="round" />;
}

/** A shaft as its outline at the neck diameter (so a thinner neck shows), from joint centre to joint centre. */
function band(a: PlanePoint, b: PlanePoint, widthMm: number): PlanePoint[] {
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
  const n: PlanePoint = [(-(b[1] - a[1]) / len) * (widthMm / 2), ((b[0] - a[0]) / len) * (widthMm / 2)];
  return [[a[0] + n[0], a[1] + n[1]], [b[0] + n[0], b[1] + n[1]], [b[0] - n[0], b[1] - n[1]], [a[0] - n[0], a[1] - n[1]]];
}

function FrontItem({ t, p }: { t: ViewTransform; p: Posed }) {
  const d = frontDrawing(p.pose, p.layout);
  const s = ITEM_STYLES[p.index]!;
  return (
    <g data-item={itemLetter(p.index)}>
      <Line t={t} points={d.tyre} closed colour={s.colour} dash={s.dash} width={1.5} />
      <Line t={t} points={d.lowerArm} colour={s.colour} dash={s.dash} width={2.5} />
      <Line t={t} points={d.upperArm} colour={s.colour} dash={s.dash} width={2.5} />
      <Line t={t} points={d.upright} closed colour={s.colour} dash={s.dash} width={2} />
      <Line t={t} points={band(d.shaft[0], d.shaft[1], p.layout.drive.neckDiameterMm)} closed colour={s.colour} dash={s.dash} width={1.5} />
      <Line t={t} points={d.kingpinAxis} colour={s.colour} dash="1 3" width={1} />
    </g>
  );
}

function TopItem({ t, p }: { t: ViewTransform; p: Posed }) {
  const d = topDrawing(p.pose, p.layout);
  const s = ITEM_STYLES[p.index]!;
  return (
    <g data-item={itemLetter(p.index)}>
      {[d.left, d.right].map((w, k) => (
        <g key={k}>
          <Line t={t} points={w.tyre} closed colour={s.colour} dash={s.dash} width={1.5} />
          <Line t={t} points={w.steeringArm} colour={s.colour} dash={s.dash} width={2.5} />
          <Line t={t} points={w.tieRod} colour={s.colour} dash={s.dash} width={2} />
          <Line t={t} points={band(w.shaft[0], w.shaft[1], p.layout.drive.neckDiameterMm)} closed colour={s.colour} dash={s.dash} width={1.5} />
        </g>
      ))}
      <Line t={t} points={d.rack} colour={s.colour} dash={s.dash} width={3} />
    </g>
  );
}

export function OverlayView({ items, view, steer, labels }: { items: readonly ComparedItem[]; view: "front" | "top"; steer: OverlaySteer; labels: readonly string[] }) {
  const titleId = useId();
  const descId = useId();
  const posed = useMemo(
    () => items.flatMap((it, index) => {
      const pose = poseOf(it, steer);
      return pose && it.layout ? [{ index, layout: it.layout, pose }] : [];
    }),
    [items, steer],
  );
  // The static frame of every layout, widened to take in each wheel as posed (a steered wheel swings out).
  const box = union([
    ...posed.map((p) => (view === "front" ? frontBox(p.layout) : topBox(p.layout))),
    ...posed.flatMap((p) => {
      const drawn = view === "front" ? frontDrawing(p.pose, p.layout).tyre : [...topDrawing(p.pose, p.layout).left.tyre, ...topDrawing(p.pose, p.layout).right.tyre];
      const b = boxOf(drawn);
      return b ? [b] : [];
    }),
  ]);
  const t = box ? fitBox(box, W, H, 18) : null;
  const title = view === "front" ? "Front view, overlaid (seen from ahead; y left →, z up ↑)" : "Top view, overlaid (seen from above; forward is down)";
  const missing = items.map((it, i) => (posed.some((p) => p.index === i) ? null : labels[i])).filter(Boolean);

  return (
    <figure className="rounded-lg border border-ink/10 bg-white p-2" data-testid={`overlay-${view}`}>
      <figcaption id={titleId} className="mb-1 text-sm font-medium">{title}</figcaption>
      {t ? (
        <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-labelledby={titleId} aria-describedby={descId}>
          <desc id={descId}>
            {posed.map((p) => `${itemLetter(p.index)}, ${ITEM_STYLES[p.index]!.pattern} line: ${labels[p.index]}`).join("; ")}
            {steer === "lock" ? ". Each drawn at its own steer lock at ride height (left turn)." : ". Wheels straight ahead, at ride height."}
          </desc>
          {view === "front" ? (
            <>
              <line x1={0} x2={W} y1={planeToScreen(t, [0, 0])[1]} y2={planeToScreen(t, [0, 0])[1]} stroke={INK.ground} strokeWidth={1.2} />
              <line x1={planeToScreen(t, [0, 0])[0]} x2={planeToScreen(t, [0, 0])[0]} y1={0} y2={H} stroke={INK.ghost} strokeDasharray="6 4" />
              {posed.map((p) => <FrontItem key={p.index} t={t} p={p} />)}
            </>
          ) : (
            <>
              <line x1={planeToScreen(t, [0, 0])[0]} x2={planeToScreen(t, [0, 0])[0]} y1={0} y2={H} stroke={INK.ghost} strokeDasharray="6 4" />
              {posed.map((p) => <TopItem key={p.index} t={t} p={p} />)}
            </>
          )}
        </svg>
      ) : (
        <p className="flex h-40 items-center justify-center text-sm text-ink-muted">None of these layouts can be drawn.</p>
      )}
      {missing.length ? <p className="text-xs text-amber-900">Not drawn (the layout cannot be posed): {missing.join(", ")}</p> : null}
    </figure>
  );
}
