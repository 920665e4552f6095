import { describe, it } from "vitest";
import { crossPinLoad } from "@/engine/strength/cross-pin";
import { expectGeometryError, expectRelClose } from "../near";

describe("cross-pin shear, F = T/(2 r_e), τ = F/(π d_p²/4) — derived, REFERENCES §6.1 [D]", () => {
  it("T 2000 N·mm, r_e 4 mm, d_p 2 mm → 250 N per end, 79.5775 MPa (REFERENCES §6.3)", () => {
    const load = crossPinLoad({ torqueNmm: 2000, contactRadiusMm: 4, pinDiameterMm: 2 });
    expectRelClose(load.forcePerEndN, 250);
    expectRelClose(load.shearStressMpa, 79.5775);
  });

  it("rejects a zero contact radius or pin diameter", () => {
    expectGeometryError(() => crossPinLoad({ torqueNmm: 2000, contactRadiusMm: 0, pinDiameterMm: 2 }), "cross pin");
    expectGeometryError(() => crossPinLoad({ torqueNmm: 2000, contactRadiusMm: 4, pinDiameterMm: -2 }), "cross pin");
  });
});
