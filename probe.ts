import { analyzeLayout } from "@/engine";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
const b = TARNWICK_10_BASE; const t = b.topView;
const rack = analyzeLayout(b, { travelSteps: 9, steerSteps: 21 });
for (const R of [100, 700, 7000, 70000]) {
  const travelDeg = Math.asin(6.5 / R) * 180 / Math.PI;
  const bc: Layout = { ...b, topView: { ...t, steeringInput: { kind: "bellcrank", pivot: { x: t.tieRodInner.x + R, y: t.tieRodInner.y }, travelDeg } } };
  const a = analyzeLayout(bc, { travelSteps: 9, steerSteps: 21 });
  console.log(R, travelDeg, a.steering.leftTurnInputSign, a.steerLock.worst.innerDeg - rack.steerLock.worst.innerDeg, a.steerLock.static.outerDeg - rack.steerLock.static.outerDeg, a.ackermann.atLockPct! - rack.ackermann.atLockPct!, a.steeringStop.stopInnerDeg - rack.steeringStop.stopInnerDeg, R * Math.sin(a.steeringStop.leftTurnStopInput*Math.PI/180), rack.steeringStop.leftTurnStopInput);
}
