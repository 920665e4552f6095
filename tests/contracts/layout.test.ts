import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { LAYOUT_SCHEMA_VERSION, layoutDocumentVersion, layoutJsonSchema, parseLayout, upgradeLayout } from "@/contracts/layout";

/** The baseline written as a schema-0 document: no `schema`, caster in the front view, bare rack travel, one gear ratio. */
function schema0Document(): Record<string, unknown> {
  const { schema: _schema, sideView, topView, strength, frontView, ...rest } = structuredClone(TARNWICK_10_BASE);
  void _schema;
  const { steeringInput, ...top } = topView;
  const { gearRatios, ...str } = strength;
  return {
    ...rest,
    frontView: { ...frontView, casterDeg: sideView.casterDeg, casterOffsetMm: sideView.casterOffsetMm },
    topView: { ...top, rackTravelMm: steeringInput.travelMm },
    strength: { ...str, gearRatio: gearRatios[0] * gearRatios[1] },
  };
}

function issuesOf(doc: unknown) {
  const r = parseLayout(doc);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.issues;
}

describe("layout contract", () => {
  it("accepts every demo layout as schema 1", () => {
    for (const d of DEMO_LAYOUTS) {
      const r = parseLayout(d.layout);
      expect(r.ok, d.key).toBe(true);
      if (r.ok) {
        expect(r.layout).toEqual(d.layout);
        expect(r.upgradedFrom).toBeNull();
      }
    }
  });

  it("upgrades a schema-0 document (one step) to the same layout", () => {
    const old = schema0Document();
    expect(layoutDocumentVersion(old)).toBe(0);
    const r = parseLayout(old);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.upgradedFrom).toBe(0);
    expect(r.layout.schema).toBe(LAYOUT_SCHEMA_VERSION);
    expect(r.layout.sideView).toEqual(TARNWICK_10_BASE.sideView);
    expect(r.layout.topView.steeringInput).toEqual({ kind: "rack", travelMm: 10 });
    expect(r.layout.strength.gearRatios).toHaveLength(1);
    expect(r.layout.strength.gearRatios[0]).toBeCloseTo((76 / 22) * 2.6, 12);
    expect(r.layout.frontView).toEqual(TARNWICK_10_BASE.frontView);
    // Upgrading does not touch its input and leaves a current document as it is.
    expect(old).toEqual(schema0Document());
    expect(upgradeLayout(TARNWICK_10_BASE)).toBe(TARNWICK_10_BASE);
  });

  it("a schema-0 document with a bad value reports the field by its new path", () => {
    const old = schema0Document();
    (old.frontView as Record<string, unknown>).casterDeg = 80;
    const issues = issuesOf(old);
    expect(issues).toContainEqual({ path: "sideView.casterDeg", message: "sideView.casterDeg must be at most 45 °" });
  });

  it("names the field in every range message", () => {
    const bad = structuredClone(TARNWICK_10_BASE) as unknown as Record<string, Record<string, unknown>>;
    bad.frontView.tyreRadiusMm = 2;
    bad.drive.ratedAngleDeg = "thirty";
    bad.strength.shaftsSharing = 2.5;
    const issues = issuesOf(bad);
    expect(issues).toContainEqual({ path: "frontView.tyreRadiusMm", message: "frontView.tyreRadiusMm must be at least 5 mm" });
    expect(issues.find((i) => i.path === "drive.ratedAngleDeg")?.message).toMatch(/^drive\.ratedAngleDeg must be a number/);
    expect(issues.find((i) => i.path === "strength.shaftsSharing")?.message).toBe("strength.shaftsSharing must be a whole number");
  });

  it("cross-field checks name both fields", () => {
    const neck = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: 8 } };
    // A misfit of valid values also names the part that cannot be built (the API answers impossible_geometry).
    expect(issuesOf(neck)).toContainEqual({ path: "drive.neckDiameterMm", message: "drive.neckDiameterMm must be smaller than drive.cupMouthDiameterMm", part: "shaft neck" });
    const slot = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, slottedCup: true } };
    expect(issuesOf(slot).map((i) => i.path)).toContain("drive.slotLimitDeg");
    const arms = { ...TARNWICK_10_BASE, frontView: { ...TARNWICK_10_BASE.frontView, upperOuter: { y: 104.9, z: 20 } } };
    expect(issuesOf(arms).map((i) => i.path)).toContain("frontView.upperOuter.z");
  });

  it("refuses unknown keys, unknown versions and non-objects", () => {
    expect(issuesOf({ ...TARNWICK_10_BASE, extra: 1 }).length).toBeGreaterThan(0);
    expect(issuesOf({ ...TARNWICK_10_BASE, schema: 7 })).toEqual([{ path: "schema", message: "schema must be a layout version from 0 to 1" }]);
    expect(issuesOf("layout").length).toBeGreaterThan(0);
    expect(issuesOf(null).length).toBeGreaterThan(0);
  });

  it("property: no input of any shape makes parseLayout throw; garbage is refused with paths", () => {
    fc.assert(
      fc.property(fc.anything(), (doc) => {
        const r = parseLayout(doc);
        if (!r.ok) for (const i of r.issues) expect(typeof i.message).toBe("string");
      }),
      { numRuns: 300 },
    );
  });

  it("JSON Schema: draft 2020-12 with the ranges and the required fields of the contract", () => {
    const js = layoutJsonSchema() as {
      $schema: string;
      required: string[];
      properties: { frontView: { properties: Record<string, { minimum?: number; maximum?: number }> }; schema: { const?: number } };
    };
    expect(js.$schema).toContain("2020-12");
    expect(js.required).toEqual(expect.arrayContaining(["schema", "frontView", "sideView", "topView", "drive", "strength"]));
    expect(js.properties.schema.const).toBe(1);
    expect(js.properties.frontView.properties.tyreRadiusMm).toMatchObject({ minimum: 5, maximum: 400 });
    expect(() => JSON.stringify(js)).not.toThrow();
  });
});
