import { describe, expect, it } from "vitest";
import { degToRad } from "@/engine/math/angle";
import { kingpinAxisFromAnglesDeg, kingpinAxisFromBallJoints, steerAxisFigures, steeredWheel, spinAxisFromCamberDeg } from "@/engine/steering/steer-axis";
import { DEG_TOL, expectNear, expectRel } from "../near";

// REFERENCES §5.3 [D]: exact steer camber by rotating the spin axis about the steering axis (left wheel;
// the outer wheel of a left turn is the mirror, i.e. the left wheel at −δk).
const STEER_CAMBER: [number, number, number, "inner" | "outer", number, number][] = [
  [10, 6, 20, "inner", 2.6031, 19.6686],
  [10, 6, 20, "outer", -1.4331, -19.5526],
  [12, 25, 30, "inner", 13.2999, 27.1263],
  [12, 25, 30, "outer", -10.6576, -26.0423],
  [0, 5, 30, "inner", 2.4976, 29.8764],
  [0, 5, 30, "outer", -2.4976, -29.8764],
];

describe("camber change with steer, exact Rodrigues method (REFERENCES §5.3)", () => {
  it.each(STEER_CAMBER)("σ %d°, τ %d°, δk %d° %s → Δγ %d°, δroad %d°", (kpi, caster, dk, wheel, dGamma, road) => {
    const k = kingpinAxisFromAnglesDeg(kpi, caster);
    const w = steeredWheel(k, [0, 1, 0], degToRad(wheel === "inner" ? dk : -dk));
    expectNear(w.camberDeg, dGamma, DEG_TOL, "Δγ");
    expectNear(w.roadWheelAngleDeg, road, DEG_TOL, "road-wheel angle");
  });

  it("KPI only, 8° at 90° of knuckle rotation: +7.9216° either way, road angle ±90° (REFERENCES §5.3)", () => {
    const k = kingpinAxisFromAnglesDeg(8, 0);
    for (const s of [1, -1]) {
      const w = steeredWheel(k, [0, 1, 0], degToRad(90 * s));
      expectNear(w.camberDeg, 7.9216, DEG_TOL, "Δγ");
      expectNear(w.roadWheelAngleDeg, 90 * s, DEG_TOL, "road angle");
    }
  });

  it("closed forms of §5.3 hold across angles: caster only asin(sin τ sin δk), KPI only asin(sin σ cos σ (1 − cos δk))", () => {
    for (const dk of [5, 17, 33, 48]) {
      const c = steeredWheel(kingpinAxisFromAnglesDeg(0, 22), [0, 1, 0], degToRad(dk));
      expectNear(c.camberDeg, (Math.asin(Math.sin(degToRad(22)) * Math.sin(degToRad(dk))) * 180) / Math.PI, 1e-9, "caster only");
      const s = steeredWheel(kingpinAxisFromAnglesDeg(11, 0), [0, 1, 0], degToRad(dk));
      const sg = degToRad(11);
      expectNear(s.camberDeg, (Math.asin(Math.sin(sg) * Math.cos(sg) * (1 - Math.cos(degToRad(dk)))) * 180) / Math.PI, 1e-9, "KPI only");
    }
  });

  it("static camber carries through: zero rotation returns the static camber (sign: + top outboard)", () => {
    const w = steeredWheel(kingpinAxisFromAnglesDeg(10, 20), spinAxisFromCamberDeg(-1.5), 0);
    expectNear(w.camberDeg, -1.5, 1e-12, "camber");
  });
});

describe("scrub radius and caster trail from projected angles (REFERENCES §5.2)", () => {
  // Axis through (c, y_w − q, R_l) at hub height with the projected angles; wheel centre over the contact centre.
  function figures(q: number, rl: number, kpi: number, c: number, caster: number) {
    const axis = { point: [c, 100 - q, rl] as const, direction: kingpinAxisFromAnglesDeg(kpi, caster) };
    return steerAxisFigures(axis, [0, 100, rl], [0, 1, 0], [0, 100, 0]);
  }
  it.each([
    [12, 42.5, 10, 4.5061],
    [8, 32, 12, 1.1982],
    [0, 42.5, 10, -7.4939],
    [60, 300, 13, -9.2605],
  ])("q %d, R %d, σ %d° → r_s %d mm (Barton & Fieldhouse §3.1.5.3 sign [F]; r_s = q − R tan σ [D])", (q, rl, kpi, rs) => {
    const f = figures(q, rl, kpi, 0, 0);
    expectNear(f.scrubRadiusMm, rs, 1e-4, "scrub radius");
    expectNear(f.hubOffsetMm, q, 1e-9, "hub offset");
    expectNear(f.kingpinInclinationDeg, kpi, 1e-9, "KPI");
  });
  it.each([
    [0, 42.5, 25, 19.8181],
    [-5, 42.5, 25, 14.8181],
    [0, 32, 6, 3.3633],
    [0, 300, 7, 36.8354],
  ])("c %d, R %d, τ %d° → trail %d mm (super7thheaven / bs-wiki sign [F]; t = c + R tan τ [D])", (c, rl, caster, t) => {
    const f = figures(0, rl, 0, c, caster);
    expectNear(f.casterTrailMm, t, 1e-4, "trail");
    expectNear(f.casterDeg, caster, 1e-9, "caster");
  });

  // Own worked case, constructed by hand from Barton & Fieldhouse's kingpin-offset definitions [F] and the
  // §5.2 relation: ball joints (110, 20) and (100, 60) → σ = atan(10/40) = 14.0362°, axis meets the ground at
  // y = 115; wheel centre (125, 45), zero camber → hub offset q = 125 − 103.75 = 21.25, r_s = 21.25 − 45·0.25 = 10.
  it("own case: ball joints in 3-D give σ 14.0362°, q 21.25 mm, r_s 10 mm; 20° caster and 4 mm offset give t = 4 + 45 tan 20°", () => {
    const axis = kingpinAxisFromBallJoints([110, 20], [100, 60], 20, 4, 45);
    const f = steerAxisFigures(axis, [0, 125, 45], [0, 1, 0], [0, 125, 0]);
    expectNear(f.kingpinInclinationDeg, 14.0362, DEG_TOL, "σ");
    expectNear(f.hubOffsetMm, 21.25, 1e-9, "q");
    expectNear(f.scrubRadiusMm, 10, 1e-9, "r_s");
    expectRel(f.casterTrailMm, 4 + 45 * Math.tan(degToRad(20)), 1e-9, "trail");
    // Spin axis (y) and steering axis meet only if the axis crosses the hub line: here it passes 4 mm ahead.
    expect(f.spindleOffsetMm).toBeGreaterThan(0);
  });
});
