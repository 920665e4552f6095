// The path a sweep plays: steer and travel as two sines of unrelated periods, so over a few cycles the
// preview passes through the whole steer × travel envelope, corners included, and back through straight ahead.

export const SWEEP_STEER_PERIOD_S = 4;
export const SWEEP_TRAVEL_PERIOD_S = 2.7;

export interface SweepRange {
  readonly steerInput: number; // the input's travel each way (rack mm or bellcrank degrees)
  readonly droopMm: number;
  readonly bumpMm: number;
}

/** Steering input and travel at time `tS` seconds into the sweep; both start at 0 (straight ahead, static). */
export function sweepAt(tS: number, r: SweepRange): { steerInput: number; travelMm: number } {
  const s = Math.sin((2 * Math.PI * tS) / SWEEP_STEER_PERIOD_S);
  const v = Math.sin((2 * Math.PI * tS) / SWEEP_TRAVEL_PERIOD_S);
  return { steerInput: s * r.steerInput, travelMm: v >= 0 ? v * r.bumpMm : v * r.droopMm };
}
