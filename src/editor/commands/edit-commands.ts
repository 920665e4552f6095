// Edits of the layout document as pure functions: each takes the layout and returns the next one. The
// store applies them (one undo step each); tools, the panel and the plots only ever call these.
import type { Layout } from "@/contracts/layout";
import { fieldRange } from "@/figures/layout-fields";
import { getAt, setAt } from "@/figures/layout-paths";
import { handleById, handlePlanePoint, withHandleAt } from "../document/handles";

function clampToField(path: string, v: number): number {
  const r = fieldRange(path);
  return r ? Math.min(r.max, Math.max(r.min, v)) : v;
}

/** The layout with a handle moved to plane point (u, v), mm, each coordinate kept inside its contract range. */
export function moveHandle(layout: Layout, handleId: string, u: number, v: number): Layout {
  const h = handleById(handleId);
  if (!h) throw new Error(`unknown handle ${handleId}`);
  const cu = h.u.sign * clampToField(h.u.path, h.u.sign * u);
  const cv = h.v.sign * clampToField(h.v.path, h.v.sign * v);
  return withHandleAt(layout, h, cu, cv);
}

/** The layout with a handle moved by (du, dv) in its view's plane, mm. */
export function nudgeHandle(layout: Layout, handleId: string, du: number, dv: number): Layout {
  const h = handleById(handleId);
  if (!h) throw new Error(`unknown handle ${handleId}`);
  const [u, v] = handlePlanePoint(layout, h);
  return moveHandle(layout, handleId, roundMm(u + du), roundMm(v + dv));
}

/** The layout with one field set (undefined removes an optional field). */
export function setField(layout: Layout, path: string, value: unknown): Layout {
  return setAt(layout, path, value);
}

/** The layout with a new neck diameter, mm (the neck trade-off plot picks one). */
export function setNeckDiameter(layout: Layout, neckMm: number): Layout {
  return setField(layout, "drive.neckDiameterMm", clampToField("drive.neckDiameterMm", roundMm(neckMm)));
}

/** A value read back from the layout (for readouts of what a command changed). */
export function fieldValue(layout: Layout, path: string): unknown {
  return getAt(layout, path);
}

/** Rounds away binary noise from sums of steps (0.1 + 0.2), to 1e-6 mm. */
export function roundMm(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}
