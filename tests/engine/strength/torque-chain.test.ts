import { describe, expect, it } from "vitest";
import {
  brushedStallCurrentA,
  brushedStallTorqueNm,
  motorTorqueNm,
  overallRatio,
  shaftTorqueNmm,
  torqueConstantNmPerA,
} from "@/engine/strength/torque-chain";
import { expectGeometryError, expectRelClose } from "../near";

describe("torque constant K_t = 60/(2π K_v) — Wikipedia 'Motor constants' [F, via REFERENCES §6.2]; check cases REFERENCES §6.3", () => {
  it.each([
    [2200, 0.0043406],
    [2900, 0.0032929],
    [3500, 0.0027284],
    [4000, 0.0023873],
  ])("K_v %i rpm/V → K_t %f N·m/A", (kv, kt) => {
    expectRelClose(torqueConstantNmPerA(kv), kt);
  });
});

describe("drive-torque chain T = T_m·N·η/n — REFERENCES §6.2 [C], check cases §6.3", () => {
  it.each([
    { kv: 4000, current: 80, ratios: [76 / 22, 2.6], N: 8.9818, tm: 0.190986, out: 1.7154, n: 4, perShaft: 428.85 },
    { kv: 4000, current: 80, ratios: [76 / 22, 2.6], N: 8.9818, tm: 0.190986, out: 1.7154, n: 2, perShaft: 857.7 },
    { kv: 3500, current: 100, ratios: [87 / 21, 2.6], N: 10.7714, tm: 0.272837, out: 2.93884, n: 2, perShaft: 1469.422 },
    { kv: 2200, current: 120, ratios: [46 / 13, 3.4], N: 12.0308, tm: 0.520871, out: 6.26648, n: 4, perShaft: 1566.619 },
  ])("K_v $kv, $current A, N $N, n $n → $perShaft N·mm", ({ kv, current, ratios, N, tm, out, n, perShaft }) => {
    const motor = motorTorqueNm({ kind: "kv", kvRpmPerV: kv, currentA: current });
    expectRelClose(motor, tm);
    expectRelClose(overallRatio(ratios), N);
    expectRelClose(shaftTorqueNmm({ motorTorqueNm: motor, ratios, efficiency: 1, shaftsSharing: 1 }), out * 1000);
    expectRelClose(shaftTorqueNmm({ motorTorqueNm: motor, ratios, efficiency: 1, shaftsSharing: n }), perShaft);
  });

  it("brushed stall: K_v 2900, 7.4 V, 0.05 Ω → 148 A, 0.487343 N·m (REFERENCES §6.3)", () => {
    expectRelClose(brushedStallCurrentA(7.4, 0.05), 148);
    expectRelClose(brushedStallTorqueNm(2900, 7.4, 0.05), 0.487343);
  });

  it("no-load current is subtracted, and efficiency scales linearly", () => {
    // K_t·(I − I₀) with I₀ = 4 A: 0.0023873 · 76 (worked by hand from the §6.2 formula)
    expectRelClose(motorTorqueNm({ kind: "kv", kvRpmPerV: 4000, currentA: 80, noLoadCurrentA: 4 }), 0.0023873 * 76);
    expect(motorTorqueNm({ kind: "torque", torqueNm: 0.3 })).toBe(0.3);
    const full = shaftTorqueNmm({ motorTorqueNm: 0.3, ratios: [4], efficiency: 1, shaftsSharing: 2 });
    expectRelClose(full, 600, 1e-12);
    expectRelClose(shaftTorqueNmm({ motorTorqueNm: 0.3, ratios: [4], efficiency: 0.9, shaftsSharing: 2 }), 0.9 * full, 1e-12);
    expect(overallRatio([])).toBe(1); // direct drive
  });

  it("invalid figures are named errors", () => {
    expectGeometryError(() => torqueConstantNmPerA(0), "motor");
    expectGeometryError(() => motorTorqueNm({ kind: "kv", kvRpmPerV: 4000, currentA: 3, noLoadCurrentA: 4 }), "motor");
    expectGeometryError(() => motorTorqueNm({ kind: "torque", torqueNm: Number.NaN }), "motor");
    expectGeometryError(() => overallRatio([2, -1]), "gearing");
    expectGeometryError(() => shaftTorqueNmm({ motorTorqueNm: 0.3, ratios: [4], efficiency: 1.2, shaftsSharing: 2 }), "gearing");
    expectGeometryError(() => shaftTorqueNmm({ motorTorqueNm: 0.3, ratios: [4], efficiency: 1, shaftsSharing: 0.5 }), "gearing");
    expectGeometryError(() => shaftTorqueNmm({ motorTorqueNm: 1e300, ratios: [1e300], efficiency: 1, shaftsSharing: 1 }), "drive shaft");
    expectGeometryError(() => brushedStallCurrentA(7.4, 0), "motor");
  });
});
