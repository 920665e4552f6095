// A view's mapping from its plane (mm, v up) to the screen (px, y down): screen = (u·s + ox, −v·s + oy).
// Zoom keeps the point under the pointer still; fit frames a box with a margin.

export interface ViewTransform {
  /** Pixels per millimetre. */
  readonly scale: number;
  readonly ox: number;
  readonly oy: number;
}

export type PlanePoint = readonly [number, number];
export type ScreenPoint = readonly [number, number];

export interface PlaneBox {
  readonly minU: number;
  readonly maxU: number;
  readonly minV: number;
  readonly maxV: number;
}

export const MIN_SCALE = 0.2;
export const MAX_SCALE = 400;

export function planeToScreen(t: ViewTransform, p: PlanePoint): ScreenPoint {
  return [p[0] * t.scale + t.ox, -p[1] * t.scale + t.oy];
}

export function screenToPlane(t: ViewTransform, s: ScreenPoint): PlanePoint {
  return [(s[0] - t.ox) / t.scale, -(s[1] - t.oy) / t.scale];
}

/** Zoom by `factor` about a screen point, within [MIN_SCALE, MAX_SCALE] px/mm. */
export function zoomAt(t: ViewTransform, at: ScreenPoint, factor: number): ViewTransform {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, t.scale * factor));
  const p = screenToPlane(t, at);
  return { scale, ox: at[0] - p[0] * scale, oy: at[1] + p[1] * scale };
}

export function panBy(t: ViewTransform, dx: number, dy: number): ViewTransform {
  return { ...t, ox: t.ox + dx, oy: t.oy + dy };
}

/** The transform that shows `box` centred in a width × height screen, `margin` px clear on every side. */
export function fitBox(box: PlaneBox, width: number, height: number, margin = 24): ViewTransform {
  const w = Math.max(box.maxU - box.minU, 1e-3);
  const h = Math.max(box.maxV - box.minV, 1e-3);
  const availW = Math.max(width - 2 * margin, 10);
  const availH = Math.max(height - 2 * margin, 10);
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, Math.min(availW / w, availH / h)));
  const cu = (box.minU + box.maxU) / 2;
  const cv = (box.minV + box.maxV) / 2;
  return { scale, ox: width / 2 - cu * scale, oy: height / 2 + cv * scale };
}

/** The smallest box holding all points (null for none). */
export function boxOf(points: readonly PlanePoint[]): PlaneBox | null {
  if (points.length === 0) return null;
  let minU = Infinity;
  let maxU = -Infinity;
  let minV = Infinity;
  let maxV = -Infinity;
  for (const [u, v] of points) {
    if (!Number.isFinite(u) || !Number.isFinite(v)) continue;
    if (u < minU) minU = u;
    if (u > maxU) maxU = u;
    if (v < minV) minV = v;
    if (v > maxV) maxV = v;
  }
  return minU <= maxU ? { minU, maxU, minV, maxV } : null;
}

/**
 * Grid spacing to draw, mm: the smallest of step × {1, 2, 5, 10, 20, 50, …} that is at least minPx
 * apart on screen, so the snap grid shows when it is large enough to see.
 */
export function gridSpacingMm(scale: number, stepMm: number, minPx = 8): number {
  const factors = [1, 2, 5];
  for (let decade = 1; decade < 1e7; decade *= 10) {
    for (const f of factors) {
      const s = stepMm * f * decade;
      if (s * scale >= minPx) return s;
    }
  }
  return stepMm * 1e7;
}

/** A round scale-bar length in mm (1, 2 or 5 × 10ⁿ) about `targetPx` long on screen. */
export function scaleBarMm(scale: number, targetPx = 80): number {
  const raw = targetPx / scale;
  const p = 10 ** Math.floor(Math.log10(raw));
  for (const f of [5, 2, 1]) if (f * p <= raw) return f * p;
  return p;
}
