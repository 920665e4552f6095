/**
 * Engine bench: the full analysis of the demo kit at a 41 travel × 61 steer grid, against a floor
 * measured in the same run — a loop making, for every grid point, the same trigonometric and square-root
 * calls the engine's inner loop makes for one point (see FLOOR_CALLS_PER_POINT). Prints median times and
 * the ratio. Run: npx tsx scripts/bench-engine.ts [--json]
 */
import { analyzeLayout } from "../src/engine/index";
import { TARNWICK_10_BASE } from "../src/contracts/demo-layouts";

const TRAVEL_STEPS = 41;
const STEER_STEPS = 61;
const RUNS = 200;
const WARMUP = 50;

/**
 * Calls per grid point in the engine's evalPoint: sqrt (closure radius), atan2 + acos (knuckle rotation),
 * cos + sin (Rodrigues), sqrt + atan2 (joint angle, atan2(|s × w|, s·w)), atan2 (road-wheel angle),
 * sqrt (shaft length).
 */
const FLOOR_CALLS_PER_POINT = { sqrt: 3, atan2: 3, acos: 1, cos: 1, sin: 1 } as const;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

let sink = 0;

function floorOnce(points: number, seed: number): void {
  let acc = 0;
  let x = 0.1 + seed * 1e-9;
  for (let i = 0; i < points; i++) {
    x += 1e-4;
    const r = Math.sqrt(1 + x * x);
    const a = Math.atan2(x, r) - Math.acos(x / (r + 1));
    const c = Math.cos(a);
    const s = Math.sin(a);
    const j = Math.atan2(Math.sqrt(c * c + x * x + s), c * s + x);
    const d = Math.atan2(s * x + j, c + r);
    acc += j + d + Math.sqrt(c * c + s * s + x);
  }
  sink += acc;
}

function timeMs(fn: () => void): number {
  const t0 = process.hrtime.bigint();
  fn();
  return Number(process.hrtime.bigint() - t0) / 1e6;
}

// The engine solves every travel row plus one static row over the rack grid.
const points = (TRAVEL_STEPS + 1) * STEER_STEPS;
for (let i = 0; i < WARMUP; i++) {
  analyzeLayout(TARNWICK_10_BASE, { travelSteps: TRAVEL_STEPS, steerSteps: STEER_STEPS });
  floorOnce(points, i);
}
const engine: number[] = [];
const floor: number[] = [];
for (let i = 0; i < RUNS; i++) {
  // Interleave so both see the same machine state.
  engine.push(timeMs(() => void analyzeLayout(TARNWICK_10_BASE, { travelSteps: TRAVEL_STEPS, steerSteps: STEER_STEPS })));
  floor.push(timeMs(() => floorOnce(points, i)));
}
const engineMs = median(engine);
const floorMs = median(floor);
const figures = {
  grid: `${TRAVEL_STEPS} travel × ${STEER_STEPS} steer`,
  gridPoints: TRAVEL_STEPS * STEER_STEPS,
  pointsSolved: points,
  medianAnalysisMs: engineMs,
  medianPerGridPointUs: (engineMs * 1000) / (TRAVEL_STEPS * STEER_STEPS),
  floorMs,
  floorCallsPerPoint: FLOOR_CALLS_PER_POINT,
  ratioToFloor: engineMs / floorMs,
  targetMs: 5,
  targetRatio: 4,
};
if (process.argv.includes("--json")) {
  console.log(JSON.stringify(figures));
} else {
  console.log(`engine bench, ${figures.grid} (${figures.gridPoints} grid points, ${points} solved incl. the static row), ${RUNS} runs`);
  console.log(`  median analysis      ${engineMs.toFixed(3)} ms   (target ≤ 5 ms)`);
  console.log(`  median per point     ${figures.medianPerGridPointUs.toFixed(3)} µs`);
  console.log(`  floor (same calls)   ${floorMs.toFixed(3)} ms`);
  console.log(`  ratio to floor       ${figures.ratioToFloor.toFixed(2)}×   (target ≤ 4×)`);
}
if (sink === 42) console.log("");
