// The path a sweep plays: steer and travel as two sines of unrelated periods, so over a few cycles the
// preview passes through the whole steer × travel envelope, corners included, and back through straight ahead.

export const SWEEP_STEER_PERIOD_S = 4;
export const SWEEP_TRAVEL_PERIOD_S = 2.7;

export interface SweepRange {
  readonly rackMm: number; // half the rack travel (both ways)
  readonly droopMm: number;
  readonly bumpMm: number;
}

/** Rack and travel at time `tS` seconds into the sweep; both start at 0 (straight ahead, static). */
export function sweepAt(tS: number, r: SweepRange): { rackMm: number; travelMm: number } {
  const s = Math.sin((2 * Math.PI * tS) / SWEEP_STEER_PERIOD_S);
  const v = Math.sin((2 * Math.PI * tS) / SWEEP_TRAVEL_PERIOD_S);
  return { rackMm: s * r.rackMm, travelMm: v >= 0 ? v * r.bumpMm : v * r.droopMm };
}
