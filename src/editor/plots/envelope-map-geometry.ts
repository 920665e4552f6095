// The joint envelope as a map: cells placed by steer (the left road-wheel angle, + left turn) and travel,
// the contour where the joint angle reaches the joint's limit, the steer lock at each travel, the cells
// the present input travel reaches past the lock, and the proposed steering stop. Pure: the map component
// only draws what this returns.
import type { EnvelopeResult, SteerLockResult } from "@/engine";

/** One solved grid point drawn as a cell: steer from x0 to x1 (deg), travel from y0 to y1 (mm). */
export interface EnvelopeCell {
  readonly i: number;
  readonly j: number;
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
  readonly jointAngleDeg: number;
}

export type MapPoint = readonly [steerDeg: number, travelMm: number];

/** Cell edges along one axis: halfway to each neighbour, the ends as far out as the step beside them. */
function edges(values: readonly (number | null)[], k: number): [number, number] | null {
  const v = values[k];
  if (v === null) return null;
  const prev = k > 0 ? values[k - 1] : null;
  const next = k < values.length - 1 ? values[k + 1] : null;
  const lo = prev !== null && prev !== undefined ? (prev + v) / 2 : next !== null && next !== undefined ? v - (next - v) / 2 : v - 0.5;
  const hi = next !== null && next !== undefined ? (next + v) / 2 : prev !== null && prev !== undefined ? v + (v - prev) / 2 : v + 0.5;
  return [Math.min(lo, hi), Math.max(lo, hi)];
}

/** Every solved grid point as a cell (a point where the tie rod cannot reach has none). */
export function envelopeCells(env: EnvelopeResult): EnvelopeCell[] {
  const cells: EnvelopeCell[] = [];
  for (let i = 0; i < env.travelMm.length; i++) {
    const road = env.leftRoadWheelDeg[i] ?? [];
    const joint = env.jointAngleDeg[i] ?? [];
    const ty = edges(env.travelMm, i);
    if (!ty) continue;
    for (let j = 0; j < road.length; j++) {
      const jv = joint[j];
      const x = edges(road, j);
      if (jv === null || jv === undefined || !Number.isFinite(jv) || !x) continue;
      cells.push({ i, j, x0: x[0], x1: x[1], y0: ty[0], y1: ty[1], jointAngleDeg: jv });
    }
  }
  return cells;
}

/**
 * Where the left wheel's joint angle equals `limitDeg`, as segments: marching squares over the
 * travel × rack grid, each crossing placed by linear interpolation along its grid edge and mapped to
 * (steer, travel) the same way. Squares with an unsolved corner are skipped.
 */
export function limitContour(env: EnvelopeResult, limitDeg: number): [MapPoint, MapPoint][] {
  const out: [MapPoint, MapPoint][] = [];
  const J = env.jointAngleDeg;
  const R = env.leftRoadWheelDeg;
  const T = env.travelMm;
  // Crossing on the edge from grid point a = (ia, ja) to b = (ib, jb).
  const cross = (ia: number, ja: number, ib: number, jb: number): MapPoint => {
    const va = J[ia][ja] as number;
    const vb = J[ib][jb] as number;
    const t = va === vb ? 0.5 : (limitDeg - va) / (vb - va);
    const ra = R[ia][ja] as number;
    const rb = R[ib][jb] as number;
    return [ra + t * (rb - ra), T[ia] + t * (T[ib] - T[ia])];
  };
  for (let i = 0; i + 1 < T.length; i++) {
    for (let j = 0; j + 1 < (J[i]?.length ?? 0); j++) {
      const corners = [J[i][j], J[i][j + 1], J[i + 1][j + 1], J[i + 1][j]];
      const roads = [R[i][j], R[i][j + 1], R[i + 1][j + 1], R[i + 1][j]];
      if (corners.some((v) => v === null || v === undefined) || roads.some((v) => v === null || v === undefined)) continue;
      const above = corners.map((v) => (v as number) >= limitDeg);
      const mask = (above[0] ? 1 : 0) | (above[1] ? 2 : 0) | (above[2] ? 4 : 0) | (above[3] ? 8 : 0);
      if (mask === 0 || mask === 15) continue;
      // Edges: 0 bottom (i, j→j+1), 1 right (j+1, i→i+1), 2 top (i+1, j+1→j), 3 left (j, i+1→i).
      const edge = (e: number): MapPoint =>
        e === 0 ? cross(i, j, i, j + 1) : e === 1 ? cross(i, j + 1, i + 1, j + 1) : e === 2 ? cross(i + 1, j + 1, i + 1, j) : cross(i + 1, j, i, j);
      const crossed = [0, 1, 2, 3].filter((e) => above[e] !== above[(e + 1) % 4]);
      if (crossed.length === 2) out.push([edge(crossed[0]), edge(crossed[1])]);
      else if (crossed.length === 4) {
        // Saddle: decide by the centre value (the mean of the four corners).
        const centreAbove = (corners as number[]).reduce((s, v) => s + v, 0) / 4 >= limitDeg;
        if (centreAbove === above[0]) {
          out.push([edge(0), edge(1)], [edge(2), edge(3)]);
        } else {
          out.push([edge(3), edge(0)], [edge(1), edge(2)]);
        }
      }
    }
  }
  return out;
}

/**
 * The steer lock at each travel as the left wheel sees it: +innerDeg in a left turn (it is the inner
 * wheel), −outerDeg in a right turn (it is the outer one; the right turn mirrors the left).
 */
export function lockLines(perTravel: readonly SteerLockResult[]): { leftTurn: MapPoint[]; rightTurn: MapPoint[] } {
  const rows = [...perTravel].filter((l) => Number.isFinite(l.innerDeg) && Number.isFinite(l.outerDeg)).sort((a, b) => a.travelMm - b.travelMm);
  return { leftTurn: rows.map((l) => [l.innerDeg, l.travelMm]), rightTurn: rows.map((l) => [-l.outerDeg, l.travelMm]) };
}

/**
 * The cells the present input travel reaches beyond the lock at their travel: where the linkage, with no
 * stop, drives the joint past its limit (or on towards the toggle). The lock is one input position for
 * both turns, so a cell past it either way counts.
 */
export function pastLimitCells(cells: readonly EnvelopeCell[], env: EnvelopeResult, perTravel: readonly SteerLockResult[]): EnvelopeCell[] {
  return cells.filter((c) => {
    const lock = perTravel[c.i];
    const q = env.steerInput[c.j];
    if (!lock || q === undefined) return false;
    return Math.abs(q) > Math.abs(lock.steerInput) * (1 + 1e-9) + 1e-12;
  });
}

/** The left wheel's road-wheel angle at input q on row i, by linear interpolation between grid columns; null where unsolved. */
function roadAt(env: EnvelopeResult, i: number, q: number): number | null {
  const xs = env.steerInput;
  const row = env.leftRoadWheelDeg[i] ?? [];
  for (let j = 0; j + 1 < xs.length; j++) {
    const a = xs[j]!;
    const b = xs[j + 1]!;
    if ((q - a) * (q - b) > 0) continue;
    const ra = row[j];
    const rb = row[j + 1];
    if (ra === null || ra === undefined || rb === null || rb === undefined) return null;
    const t = a === b ? 0 : (q - a) / (b - a);
    return ra + t * (rb - ra);
  }
  return null;
}

/** The proposed stop drawn across the travel rows: the left wheel's angle with the input at the stop, each turn. */
export function stopLines(env: EnvelopeResult, leftTurnStopInput: number): { leftTurn: MapPoint[]; rightTurn: MapPoint[] } {
  const line = (q: number): MapPoint[] =>
    env.travelMm.flatMap((t, i) => {
      const r = roadAt(env, i, q);
      return r === null ? [] : [[r, t] as MapPoint];
    });
  return { leftTurn: line(leftTurnStopInput), rightTurn: line(-leftTurnStopInput) };
}
