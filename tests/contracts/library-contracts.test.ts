// The design library's pure rules: judging readouts against targets (and a kit's overrides), marking a
// difference better or worse, the comparison's address, applying and unlinking shelf items, the library
// query and the view kept in the URL.
import { describe, expect, it } from "vitest";
import { compareHref, parseCompareItems } from "@/contracts/compare";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { libraryQuerySchema } from "@/contracts/library";
import { layoutSchema } from "@/contracts/layout";
import { applyShelfItem, layoutMatchesShelfItem, unlinkShelfItem, type ShelfItem } from "@/contracts/shelf";
import { compareReadout, DEFAULT_TARGETS, effectiveTargets, effectiveTargetsProblem, judgeReadout, targetText, type Targets } from "@/contracts/targets";
import { DEFAULT_COLUMNS, libraryApiSearch, libraryViewSearch, readLibraryView, withView } from "@/lib/library-url";

const T: Targets = { minLockDeg: 30, maxJointAngleDeg: 35, minSafetyFactor: 2, ackermannMinPct: 20, ackermannMaxPct: 90, minNeckClearanceMm: 0.2 };

describe("judging readouts against targets", () => {
  it.each([
    ["lockDeg", 30, "meets"],
    ["lockDeg", 29.99, "misses"],
    ["maxJointAngleDeg", 35, "meets"],
    ["maxJointAngleDeg", 35.01, "misses"],
    ["safetyFactor", 1.99, "misses"],
    ["neckClearanceMm", 0.2, "meets"],
    ["ackermannPct", 20, "meets"],
    ["ackermannPct", 90.5, "misses"],
    ["ackermannPct", 19, "misses"],
    ["neckClearanceMm", null, "none"],
    ["ackermannPct", null, "none"],
  ] as const)("%s = %s → %s (targets at their edges meet)", (key, value, verdict) => {
    expect(judgeReadout(key, value, T)).toBe(verdict);
  });

  it("a kit's overrides replace only the keys it sets", () => {
    expect(effectiveTargets(T, { minLockDeg: 25 })).toEqual({ ...T, minLockDeg: 25 });
    expect(effectiveTargets(T, {})).toEqual(T);
    expect(effectiveTargetsProblem(T, { ackermannMinPct: 95 })).toEqual({ path: "targets.ackermannMinPct", message: expect.stringContaining("95 to 90") });
    expect(effectiveTargetsProblem(T, { ackermannMaxPct: 10 })?.path).toBe("targets.ackermannMaxPct");
    expect(effectiveTargetsProblem(T, { ackermannMinPct: 50, ackermannMaxPct: 60 })).toBeNull();
  });

  it("says each target in words", () => {
    expect(targetText("lockDeg", T)).toBe("≥ 30°");
    expect(targetText("maxJointAngleDeg", T)).toBe("≤ 35°");
    expect(targetText("ackermannPct", T)).toBe("20 – 90 %");
    expect(targetText("neckClearanceMm", T)).toBe("≥ 0.2 mm");
  });

  it("starts new workspaces with consistent defaults", () => {
    expect(DEFAULT_TARGETS.ackermannMinPct).toBeLessThanOrEqual(DEFAULT_TARGETS.ackermannMaxPct);
  });
});

describe("marking a difference better or worse against the targets", () => {
  it("closer to a missed target is better, further is worse, even when both still miss", () => {
    expect(compareReadout("lockDeg", 20, 22, T)).toEqual({ change: "better", crossed: null });
    expect(compareReadout("lockDeg", 22, 20, T)).toEqual({ change: "worse", crossed: null });
    expect(compareReadout("maxJointAngleDeg", 40, 38, T)).toEqual({ change: "better", crossed: null });
  });

  it("names a flip of the verdict", () => {
    expect(compareReadout("neckClearanceMm", 0, 0.46, T)).toEqual({ change: "better", crossed: "now-meets" });
    expect(compareReadout("safetyFactor", 2.5, 1.5, T)).toEqual({ change: "worse", crossed: "now-misses" });
  });

  it("past a target, the side that is better decides; inside the Ackermann range only 'changed'", () => {
    expect(compareReadout("safetyFactor", 15.3, 7.8, T)).toEqual({ change: "worse", crossed: null });
    expect(compareReadout("lockDeg", 31, 33, T)).toEqual({ change: "better", crossed: null });
    expect(compareReadout("ackermannPct", 40, 60, T)).toEqual({ change: "changed", crossed: null });
    expect(compareReadout("ackermannPct", 95, 100, T)).toEqual({ change: "worse", crossed: null });
  });

  it("a difference below the last shown digit is no difference; a figure appearing is 'changed'", () => {
    expect(compareReadout("lockDeg", 30.01, 30.03, T).change).toBe("same");
    expect(compareReadout("safetyFactor", 2.001, 2.003, T).change).toBe("same");
    expect(compareReadout("neckClearanceMm", null, 0.3, T).change).toBe("changed");
    expect(compareReadout("neckClearanceMm", null, null, T).change).toBe("same");
  });

  it("judges each item with its own kit's targets", () => {
    // Same lock, but the second kit asks only 18°: it meets where the first misses.
    expect(compareReadout("lockDeg", 20, 20, { ...T, minLockDeg: 18 }, T)).toEqual({ change: "better", crossed: "now-meets" });
  });
});

describe("the comparison's address", () => {
  const a = "11111111-1111-4111-8111-111111111111";
  const b = "22222222-2222-4222-8222-222222222222";

  it("reads kits and revisions, and writes them back the same way", () => {
    const parsed = parseCompareItems(`${a}, ${b.toUpperCase()}@3`);
    expect(parsed).toEqual({ ok: true, items: [{ kitId: a, revision: null }, { kitId: b, revision: 3 }] });
    expect(compareHref("ws", parsed.ok ? parsed.items : [])).toBe(`/workspaces/ws/compare?items=${a},${b}@3`);
  });

  it.each([
    ["", /got 0/],
    [a, /got 1/],
    [[a, b, `${a}@1`, `${b}@1`, `${a}@2`].join(","), /got 5/],
    [`${a},x`, /not a kit id/],
    [`${a},${a}@0`, /whole number from 1/],
    [`${a},${a}@1@2`, /not a kit id/],
    [`${a},${a}`, /named twice/],
  ])("refuses %j", (raw, message) => {
    const parsed = parseCompareItems(raw);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toMatch(message);
  });
});

describe("shelf items in a layout", () => {
  const material: ShelfItem = {
    id: "33333333-3333-4333-8333-333333333333", kind: "material", name: "Club bar", catalogueId: null, version: 1, updatedByName: null, updatedAt: "", usedBy: 0,
    spec: { printed: true, tensileYieldMpa: 40, yieldSource: "coupon tests (invented)", shearRule: "tresca", derate: 0.7, derateSource: "club practice (invented)" },
  };
  const shaft: ShelfItem = {
    id: "44444444-4444-4444-8444-444444444444", kind: "shaft", name: "Hollow shaft", catalogueId: null, version: 1, updatedByName: null, updatedAt: "", usedBy: 0,
    spec: { neckDiameterMm: 4.5, boreDiameterMm: 1.5, lengthMm: 70, materialId: material.id },
  };

  it("takes a material's figures (with its rule and sources) and names the item; the result is a valid layout", () => {
    const l = applyShelfItem(TARNWICK_10_BASE, material);
    expect(l.strength.material).toEqual({ kind: "custom", name: "Club bar", yieldMpa: 40, source: "coupon tests (invented); derate: club practice (invented)", printed: true, derate: 0.7, shearRule: "tresca" });
    expect(l.shelf).toEqual({ material: material.id });
    expect(layoutSchema.safeParse(l).success).toBe(true);
    expect(layoutMatchesShelfItem(l, material)).toBe(true);
    expect(layoutMatchesShelfItem({ ...l, strength: { ...l.strength, material: { ...l.strength.material, yieldMpa: 41 } } } as typeof l, material)).toBe(false);
  });

  it("a shaft brings its neck, bore and material; unlinking keeps the figures", () => {
    const l = applyShelfItem(TARNWICK_10_BASE, shaft, [material]);
    expect(l.drive).toMatchObject({ neckDiameterMm: 4.5, boreDiameterMm: 1.5 });
    expect(l.shelf).toEqual({ shaft: shaft.id, material: material.id });
    const solid = applyShelfItem(l, { ...shaft, spec: { ...shaft.spec, boreDiameterMm: 0 } as ShelfItem["spec"] }, [material]);
    expect("boreDiameterMm" in solid.drive).toBe(false);
    const loose = unlinkShelfItem(unlinkShelfItem(l, "shaft"), "material");
    expect(loose.shelf).toBeUndefined();
    expect(loose.drive.neckDiameterMm).toBe(4.5);
  });
});

describe("the library's query and the view in the URL", () => {
  it("defaults to active kits, newest first, 50 a page", () => {
    expect(libraryQuerySchema.parse({})).toMatchObject({ status: "active", verdict: "any", sort: "updatedAt", dir: "desc", page: 1, size: 50 });
  });

  it("keeps only what differs from the defaults, and the columns only in the page's URL", () => {
    const view = readLibraryView(new URLSearchParams("sort=safetyFactor&dir=asc&tags=Steel,race&cols=name,safetyFactor&page=3"));
    expect(view).toMatchObject({ sort: "safetyFactor", dir: "asc", tags: ["steel", "race"], page: 3, cols: ["name", "safetyFactor"] });
    expect(libraryViewSearch(view)).toBe("tags=steel%2Crace&sort=safetyFactor&dir=asc&page=3&cols=name%2CsafetyFactor");
    expect(libraryApiSearch(view)).toBe("tags=steel%2Crace&sort=safetyFactor&dir=asc&page=3");
  });

  it("drops a parameter that does not parse and keeps the rest", () => {
    const view = readLibraryView(new URLSearchParams("sort=bogus&scale=1:8&page=-2&colour=red&cols=nope"));
    expect(view).toMatchObject({ sort: "updatedAt", scale: ["1:8"], page: 1, cols: ["name"] });
    expect(readLibraryView(new URLSearchParams()).cols).toEqual(DEFAULT_COLUMNS);
  });

  it("a new filter goes back to the first page; paging and columns do not", () => {
    const view = readLibraryView(new URLSearchParams("page=4"));
    expect(withView(view, { q: "cvd" }).page).toBe(1);
    expect(withView(view, { page: 5 }).page).toBe(5);
    expect(withView(view, { cols: ["name"] }).page).toBe(4);
  });
});
