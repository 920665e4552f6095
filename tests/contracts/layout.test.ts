import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { LAYOUT_SCHEMA_VERSION, layoutDocumentVersion, layoutJsonSchema, parseLayout, upgradeLayout, type Layout } from "@/contracts/layout";
import { analyzeLayout } from "@/engine/index";
import schema1 from "./fixtures/schema-1-documents.json";

/** The baseline written as a schema-0 document: no `schema`, caster in the front view, bare rack travel as `rackEnd`'s travel, one gear ratio. */
function schema0Document(): Record<string, unknown> {
  const { schema: _schema, sideView, topView, strength, frontView, ...rest } = structuredClone(TARNWICK_10_BASE);
  void _schema;
  const { steeringInput, tieRodInner, ...top } = topView;
  const { gearRatios, ...str } = strength;
  return {
    ...rest,
    frontView: { ...frontView, casterDeg: sideView.casterDeg, casterOffsetMm: sideView.casterOffsetMm },
    topView: { ...top, rackEnd: tieRodInner, rackTravelMm: (steeringInput as { travelMm: number }).travelMm },
    strength: { ...str, gearRatio: gearRatios[0] * gearRatios[1] },
  };
}

function issuesOf(doc: unknown) {
  const r = parseLayout(doc);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.issues;
}

describe("layout contract", () => {
  it("accepts every demo layout as the current schema (2)", () => {
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
    expect(r.layout.topView.steeringInput).toEqual({ kind: "rack", travelMm: 6.5 });
    expect(r.layout.topView.tieRodInner).toEqual(TARNWICK_10_BASE.topView.tieRodInner);
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
    expect(issuesOf({ ...TARNWICK_10_BASE, schema: 7 })).toEqual([{ path: "schema", message: "schema must be a layout version from 0 to 2" }]);
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
    expect(js.properties.schema.const).toBe(2);
    expect(js.properties.frontView.properties.tyreRadiusMm).toMatchObject({ minimum: 5, maximum: 400 });
    expect(() => JSON.stringify(js)).not.toThrow();
  });
});

describe("schema 1 documents (before the bellcrank input)", () => {
  const docs = schema1 as unknown as Record<"base" | "printed", { document: Record<string, unknown>; analysis: Record<string, unknown> }>;

  it.each(["base", "printed"] as const)("%s: loads, upgraded one step (rackEnd → tieRodInner), nothing else changed", (key) => {
    const doc = docs[key].document;
    expect(layoutDocumentVersion(doc)).toBe(1);
    const r = parseLayout(doc);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.upgradedFrom).toBe(1);
    const top = doc.topView as Record<string, unknown>;
    expect(r.layout.topView.tieRodInner).toEqual(top.rackEnd);
    expect(r.layout.topView.steeringInput).toEqual({ kind: "rack", travelMm: 10 });
    const { topView: _t, schema: _s, ...rest } = doc;
    void _t;
    void _s;
    const { topView: _t2, schema: _s2, ...restUp } = r.layout;
    void _t2;
    void _s2;
    expect(restUp).toEqual(rest);
  });

  it.each(["base", "printed"] as const)("%s: analyses exactly as the schema-1 engine did (every travel row, step, lock and envelope value)", (key) => {
    const r = parseLayout(docs[key].document);
    if (!r.ok) throw new Error("did not parse");
    const a = analyzeLayout(r.layout, { travelSteps: 7, steerSteps: 9 });
    type Old = {
      travel: unknown;
      atStatic: unknown;
      steerAxis: unknown;
      steps: ({ rackMm: number } & Record<string, unknown>)[];
      ackermann: Record<string, unknown>;
      steerLock: Record<string, unknown>;
      envelope: { travelMm: number[]; rackMm: number[]; jointAngleDeg: unknown; leftRoadWheelDeg: unknown };
      strength: Record<string, number>;
      drive: Record<string, number>;
    };
    const old = docs[key].analysis as unknown as Old;
    const renameLock = (l: { rackMm: number; limitedBy: string } & Record<string, unknown>) => {
      const { rackMm, limitedBy, ...rest } = l;
      return { ...rest, steerInput: rackMm, limitedBy: ({ linkage: "toggle", "rack-travel": "input-travel" } as Record<string, string>)[limitedBy] ?? limitedBy };
    };
    type OldLock = { rackMm: number; limitedBy: string } & Record<string, unknown>;
    const oldLock = old.steerLock as { worst: OldLock; static: OldLock; perTravel: OldLock[] };
    expect(a.travel).toEqual(old.travel);
    expect(a.atStatic).toEqual(old.atStatic);
    expect(a.steerAxis).toEqual(old.steerAxis);
    expect(a.steering.steps).toEqual(old.steps.map(({ rackMm, ...rest }) => ({ steerInput: rackMm, ...rest })));
    expect(a.steerLock).toEqual({ worst: renameLock(oldLock.worst), static: renameLock(oldLock.static), perTravel: oldLock.perTravel.map(renameLock) });
    expect({ ...a.ackermann, minReportingAngleDeg: undefined }).toEqual({ ...old.ackermann, minReportingAngleDeg: undefined });
    expect(a.envelope).toEqual({ travelMm: old.envelope.travelMm, steerInput: old.envelope.rackMm, jointAngleDeg: old.envelope.jointAngleDeg, leftRoadWheelDeg: old.envelope.leftRoadWheelDeg });
    for (const k of Object.keys(old.drive)) expect(a.drive[k as keyof typeof a.drive], k).toBe(old.drive[k]);
    for (const k of Object.keys(old.strength)) expect(a.strength[k as keyof typeof a.strength], k).toBe(old.strength[k]);
  });
});

describe("schema 2: the bellcrank input", () => {
  const bellcrank = (pivot: { x: number; y: number }, travelDeg = 25): Layout => ({
    ...TARNWICK_10_BASE,
    topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "bellcrank", pivot, travelDeg } },
  });

  it("accepts a bellcrank with a pivot, a travel in degrees and an optional stop margin", () => {
    const l = { ...bellcrank({ x: -5, y: 35 }), topView: { ...bellcrank({ x: -5, y: 35 }).topView, stopMarginDeg: 2 } };
    const r = parseLayout(l);
    expect(r.ok).toBe(true);
  });

  it("names the field and the reason: travel out of range, a pivot under the inner ball, an unknown input kind", () => {
    expect(issuesOf(bellcrank({ x: -5, y: 35 }, 95))).toContainEqual({ path: "topView.steeringInput.travelDeg", message: "topView.steeringInput.travelDeg must be at most 80 °" });
    expect(issuesOf(bellcrank({ x: -20.5, y: 35 }))).toContainEqual({
      path: "topView.steeringInput.pivot",
      message: "topView.steeringInput.pivot must be at least 1 mm (in plan) from topView.tieRodInner (the bellcrank arm has a length)",
      part: "bellcrank",
    });
    const odd = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "worm", travelMm: 5 } } };
    expect(issuesOf(odd).map((i) => i.path)).toContain("topView.steeringInput.kind");
    const margin = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, stopMarginDeg: 12 } };
    expect(issuesOf(margin)).toContainEqual({ path: "topView.stopMarginDeg", message: "topView.stopMarginDeg must be at most 10 °" });
  });
});
