import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { OUTSIDE_REFERENCE } from "../helpers/outside-reference";
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout, type AnalysisResult } from "@/engine/index";
import { CITATIONS, isCitationKey } from "@/engine/methods/citations";
import { METHOD_ENTRIES, methodByKey } from "@/engine/methods/method-entries";
import { OUTPUT_FIELDS, outputFieldCitations, outputFieldFor, outputFieldsMarkdown } from "@/engine/output-fields";

/** Every leaf path of a result, arrays as [] ("steering.steps[].innerDeg"); a null object counts as a leaf. */
function leafPaths(v: unknown, path = "", out = new Set<string>()): Set<string> {
  if (Array.isArray(v)) {
    if (v.length === 0) out.add(`${path}[]`);
    v.forEach((x) => leafPaths(x, `${path}[]`, out));
  } else if (v !== null && typeof v === "object") {
    for (const [k, x] of Object.entries(v)) leafPaths(x, path ? `${path}.${k}` : k, out);
  } else out.add(path);
  return out;
}

/** Every string anywhere in a result. */
function strings(v: unknown, out: string[] = []): string[] {
  if (typeof v === "string") out.push(v);
  else if (Array.isArray(v)) v.forEach((x) => strings(x, out));
  else if (v !== null && typeof v === "object") Object.values(v).forEach((x) => strings(x, out));
  return out;
}


const overThrown: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "rack", travelMm: 10 } } };
const toggling: Layout = {
  ...TARNWICK_10_BASE,
  topView: { ...TARNWICK_10_BASE.topView, steeringArmBall: { x: -9, y: 104, z: 36 }, steeringInput: { kind: "rack", travelMm: 20 } },
  drive: { ...TARNWICK_10_BASE.drive, jointType: "cv-ball", ratedAngleDeg: 89, cupMouthDiameterMm: 30, pivotDepthMm: 0, neckDiameterMm: 1 },
};
const custom: Layout = {
  ...TARNWICK_10_BASE,
  strength: { ...TARNWICK_10_BASE.strength, material: { kind: "custom", name: "Shop PETG", yieldMpa: 30, source: "our own pull tests, March", printed: true, derate: 0.7 } },
};
const ANALYSES: [string, AnalysisResult][] = [
  ...DEMO_LAYOUTS.map((d) => [d.key, analyzeLayout(d.layout, { travelSteps: 5, steerSteps: 7 })] as [string, AnalysisResult]),
  ["rack past its toggle", analyzeLayout(overThrown, { travelSteps: 5, steerSteps: 7 })],
  ["toggle binds", analyzeLayout(toggling, { travelSteps: 5, steerSteps: 7 })],
  ["custom printed material", analyzeLayout(custom, { travelSteps: 5, steerSteps: 7 })],
];

describe("the table of outputs and the methods entries", () => {
  it("every output field of real answers (rack, bellcrank, toggle, every joint and material kind) has a table entry, and every entry is used", () => {
    const used = new Set<string>();
    for (const [name, a] of ANALYSES) {
      for (const path of leafPaths(a)) {
        const f = outputFieldFor(path);
        expect(f, `${name}: ${path} has no entry in OUTPUT_FIELDS`).not.toBeNull();
        used.add(f!.path);
      }
    }
    expect(OUTPUT_FIELDS.map((f) => f.path).filter((p) => !used.has(p))).toEqual([]);
  });

  it("every output field names a methods entry and its citation keys, each a known key", () => {
    for (const f of OUTPUT_FIELDS) {
      expect(() => methodByKey(f.method), f.path).not.toThrow();
      const cites = outputFieldCitations(f);
      expect(cites.length, `${f.path} cites something`).toBeGreaterThan(0);
      for (const k of cites) expect(isCitationKey(k), `${f.path}: ${k}`).toBe(true);
    }
  });

  it("method and citation keys are one namespace of unique page anchors", () => {
    const keys = [...METHOD_ENTRIES.map((m) => m.key), ...CITATIONS.map((c) => c.key), "sources"];
    expect(new Set(keys).size).toBe(keys.length);
    for (const k of keys) expect(k).toMatch(/^[a-z0-9]+(?:-[a-z0-9]+)*$/);
  });

  it("no entry, citation or field text refers to a document outside the product", () => {
    const texts = [
      ...METHOD_ENTRIES.flatMap((m) => [m.title, m.explain, m.definition, m.formula ?? "", m.unit, m.sign, m.range]),
      ...CITATIONS.flatMap((c) => [c.text, c.short, c.usedFor]),
      ...OUTPUT_FIELDS.flatMap((f) => [f.unit, f.sign]),
    ];
    for (const t of texts) expect(t).not.toMatch(OUTSIDE_REFERENCE);
  });

  it("every citation is complete: a full text, what it is used for, and how the product knows it", () => {
    for (const c of CITATIONS) {
      expect(c.text.length, c.key).toBeGreaterThan(30);
      expect(c.usedFor.length, c.key).toBeGreaterThan(10);
      expect(["seen", "recalled", "derived", "common-practice"]).toContain(c.status);
    }
  });
});

describe("the answers name their sources by key", () => {
  it.each(ANALYSES)("%s: no string refers outside the product; every (key) in the strength source is a citation", (_, a) => {
    for (const s of strings(a)) expect(s).not.toMatch(OUTSIDE_REFERENCE);
    const named = [...a.strength.allowableSource.matchAll(/\(([a-z][a-z0-9]*(?:-[a-z0-9]+)+)\)/g)].map((m) => m[1]!);
    for (const k of named) expect(isCitationKey(k), k).toBe(true);
    for (const k of a.strength.allowableCitations) expect(isCitationKey(k), k).toBe(true);
    expect(new Set(named)).toEqual(new Set(a.strength.allowableCitations));
  });
});

describe("README", () => {
  it("holds exactly the table of outputs the engine's table makes (scripts/output-fields-doc.ts --write)", () => {
    const readme = readFileSync(fileURLToPath(new URL("../../README.md", import.meta.url)), "utf8");
    const begin = "<!-- output fields: made by scripts/output-fields-doc.ts -->";
    const end = "<!-- end of output fields -->";
    const a = readme.indexOf(begin);
    const b = readme.indexOf(end);
    expect(a).toBeGreaterThan(0);
    expect(readme.slice(a + begin.length, b).trim()).toBe(outputFieldsMarkdown("http://127.0.0.1:3000/methods"));
    expect(readme).not.toMatch(/\bREFERENCES\b/);
  });
});
