import { analyzeLayout, cornerPoseAt, cornerPoser } from "@/engine";
import { TARNWICK_10_BASE, DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
const withTravel = (l: Layout, t: number): Layout => ({ ...l, topView: { ...l.topView, steeringInput: { kind: "rack", travelMm: t } } });
for (const d of DEMO_LAYOUTS) for (const t of [6, 6.5]) {
  const a = analyzeLayout(withTravel(d.layout, t), { travelSteps: 25, steerSteps: 41 });
  const s = a.steeringStop;
  console.log(d.key, t, s.status, s.limitedBy, s.limitInput.toFixed(3), s.leftTurnStopInput.toFixed(3), s.toggle, a.steerLock.static.limitedBy);
}
const p = cornerPoser(TARNWICK_10_BASE);
for (const s of [-6, -6.5, -7, -7.09]) { const q = cornerPoseAt(p, 14, s); console.log(s, q.left.roadWheelDeg.toFixed(2), q.right.roadWheelDeg.toFixed(2)); }
const bc: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "bellcrank", pivot: { x: -5, y: 35 }, travelDeg: 25 } } };
const a = analyzeLayout(bc, { travelSteps: 25, steerSteps: 41 });
console.log("bellcrank", a.steering.leftTurnInputSign, JSON.stringify(a.steeringStop), a.steerLock.worst, a.ackermann.atLockPct);
const b0 = analyzeLayout(TARNWICK_10_BASE, { travelSteps: 25, steerSteps: 41 });
console.log("rack ack", b0.ackermann.atLockPct, b0.steerLock.static.innerDeg, a.steerLock.static.innerDeg);
