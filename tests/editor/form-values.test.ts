import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE, TARNWICK_10_BELLCRANK } from "@/contracts/demo-layouts";
import { formKey, formToLayout, gearKey, layoutToForm } from "@/editor/panel/form-values";

const neck = formKey("drive.neckDiameterMm");

describe("the property panel's values", () => {
  it.each(DEMO_LAYOUTS.flatMap((d) => (["mm", "in"] as const).map((u) => [d.key, u, d.layout] as const)))("%s in %s: shown and read back unchanged", (_, unit, layout) => {
    const result = formToLayout(layoutToForm(layout, unit), unit, layout);
    expect(result).toEqual({ ok: true, layout });
  });

  it("shows lengths in the user's unit and reads an edit back in mm", () => {
    const inches = layoutToForm(TARNWICK_10_BASE, "in");
    expect(inches[neck]).toBe("0.19685");
    expect(inches[formKey("frontView.tyreRadiusMm")]).toBe("1.65354");
    // Angles and ratios are not lengths.
    expect(inches[formKey("sideView.casterDeg")]).toBe("22");
    const r = formToLayout({ ...inches, [neck]: "0.16" }, "in", TARNWICK_10_BASE);
    expect(r.ok && r.layout.drive.neckDiameterMm).toBe(4.064);
    const mm = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [neck]: "4,2" }, "mm", TARNWICK_10_BASE);
    expect(mm.ok && mm.layout.drive.neckDiameterMm).toBe(4.2);
  });

  it("names the field and the reason for bad text", () => {
    const base = layoutToForm(TARNWICK_10_BASE, "mm");
    const bad = (key: string, text: string) => {
      const r = formToLayout({ ...base, [key]: text }, "mm", TARNWICK_10_BASE);
      return r.ok ? null : r.errors[key];
    };
    expect(bad(neck, "abc")).toBe("Neck diameter must be a number");
    expect(bad(neck, "")).toBe("Neck diameter is required");
    expect(bad(neck, "0.1")).toBe("Neck diameter must be from 0.3 to 100 mm");
    expect(bad(formKey("strength.shaftsSharing"), "1.5")).toBe("Shafts sharing the torque must be a whole number");
    expect(bad(gearKey(1), "0")).toBe("Gear ratio 2 must be from 0.1 to 100");
    const inch = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "in"), [neck]: "5" }, "in", TARNWICK_10_BASE);
    expect(!inch.ok && inch.errors[neck]).toBe("Neck diameter must be from 0.0118 to 3.937 in");
  });

  it("leaves an optional field out when emptied", () => {
    const r = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [formKey("sideView.casterOffsetMm")]: "" }, "mm", TARNWICK_10_BASE);
    expect(r.ok && "casterOffsetMm" in r.layout.sideView).toBe(false);
    const bore = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [formKey("drive.boreDiameterMm")]: "2" }, "mm", TARNWICK_10_BASE);
    expect(bore.ok && bore.layout.drive.boreDiameterMm).toBe(2);
  });

  it("switches a union's variant with starting values for its fields", () => {
    const values = { ...layoutToForm(TARNWICK_10_BASE, "mm"), [formKey("strength.motor.kind")]: "torque" };
    expect(values[formKey("strength.motor.torqueNm")]).toBe("0.5");
    const r = formToLayout(values, "mm", TARNWICK_10_BASE);
    expect(r.ok && r.layout.strength.motor).toEqual({ kind: "torque", torqueNm: 0.5 });
    // A material of one's own needs its source named.
    const custom = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [formKey("strength.material.kind")]: "custom", [formKey("strength.material.name")]: "PA12 GF" }, "mm", TARNWICK_10_BASE);
    expect(!custom.ok && custom.errors[formKey("strength.material.source")]).toBe("Source of the figures is required");
  });

  it("switches the steering input between rack and bellcrank, with starting values for the bellcrank's pivot and travel", () => {
    const kind = formKey("topView.steeringInput.kind");
    const values = { ...layoutToForm(TARNWICK_10_BASE, "mm"), [kind]: "bellcrank" };
    expect(values[formKey("topView.steeringInput.travelDeg")]).toBe("25");
    const r = formToLayout(values, "mm", TARNWICK_10_BASE);
    expect(r.ok && r.layout.topView.steeringInput).toEqual({ kind: "bellcrank", pivot: { x: -5, y: 35 }, travelDeg: 25 });
    expect(r.ok && r.layout.schema).toBe(2);
    const back = formToLayout({ ...layoutToForm(TARNWICK_10_BELLCRANK, "mm"), [kind]: "rack" }, "mm", TARNWICK_10_BELLCRANK);
    expect(back.ok && back.layout.topView.steeringInput).toEqual({ kind: "rack", travelMm: 6.5 });
    // The stop margin is optional: empty means 1°, a value is kept, out of range is named.
    const margin = formKey("topView.stopMarginDeg");
    expect(values[margin]).toBe("");
    const withMargin = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [margin]: "2" }, "mm", TARNWICK_10_BASE);
    expect(withMargin.ok && withMargin.layout.topView.stopMarginDeg).toBe(2);
    const tooMuch = formToLayout({ ...layoutToForm(TARNWICK_10_BASE, "mm"), [margin]: "12" }, "mm", TARNWICK_10_BASE);
    expect(!tooMuch.ok && tooMuch.errors[margin]).toBe("Steering stop margin must be from 0 to 10°");
  });

  it("reads the gear ratios as a list", () => {
    const values = layoutToForm(TARNWICK_10_BASE, "mm");
    expect(values[gearKey(0)]).toBe("3.4545");
    expect(values[gearKey(1)]).toBe("2.6");
    const r = formToLayout({ ...values, [gearKey(1)]: "2.8" }, "mm", TARNWICK_10_BASE);
    expect(r.ok && r.layout.strength.gearRatios).toEqual([76 / 22, 2.8]);
  });
});
