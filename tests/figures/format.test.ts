import { describe, expect, it } from "vitest";
import { fmt, limitLabel, signed } from "@/figures/format";

describe("readout formatting", () => {
  it("never shows NaN or Infinity", () => {
    expect(fmt(Number.NaN)).toBe("—");
    expect(fmt(Number.POSITIVE_INFINITY, 2, "mm")).toBe("—");
    expect(fmt(null)).toBe("—");
  });
  it("rounds and attaches units", () => {
    expect(fmt(29.44710523, 1, "°")).toBe("29.4°");
    expect(fmt(3.14159, 2, "mm")).toBe("3.14 mm");
    expect(fmt(-0.04, 1, "mm")).toBe("0.0 mm");
    expect(signed(1.25, 2, "mm")).toBe("+1.25 mm");
    expect(signed(-1.25, 2, "mm")).toBe("-1.25 mm");
    expect(signed(0.05, 2, "mm")).toBe("+0.05 mm");
    expect(signed(0.004, 2, "mm")).toBe("0.00 mm");
  });
  it("names what limits steer lock in words", () => {
    expect(limitLabel("neck-contact")).toBe("shaft neck meets the cup mouth");
    expect(limitLabel("something-new")).toBe("something-new");
  });
});
