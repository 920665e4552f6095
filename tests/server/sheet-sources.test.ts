// What the sheet prints as a figure's sign and sources: the engine's sign text and, for the sources, full
// citations named by the methods page's keys, never a document outside the product.
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { analyzeLayout } from "@/engine";
import { CITATIONS } from "@/engine/methods/citations";
import { sheetFigureGroups } from "@/figures/sheet-figures";
import { figureSign, sheetSources } from "@/server/exports/sheet-sources";
import { OUTSIDE_REFERENCE } from "../helpers/outside-reference";

describe("the sheet's signs and sources", () => {
  it("states the sign of a sign-bearing figure as the engine's table does", () => {
    expect(figureSign("camber-bump")).toBe("+ wheel top leans outboard (relative to the body)");
    expect(figureSign("scrub")).toBe("+ axis meets the ground inboard of the contact centre");
    expect(figureSign("not-a-figure")).toBeNull();
  });

  it("gives one line per citation key, each a full citation of the methods page, the material's last", () => {
    const keys = new Set(CITATIONS.map((c) => c.key));
    for (const d of DEMO_LAYOUTS) {
      const a = analyzeLayout(d.layout, { travelSteps: 9, steerSteps: 15 });
      const lines = sheetSources(a, sheetFigureGroups(a, "mm").flatMap((g) => g.readouts));
      expect(lines.length).toBeGreaterThan(5);
      expect(lines.at(-1)!.figure).toBe("Allowable shear of the material");
      for (const l of lines) {
        expect(keys.has(l.key)).toBe(true);
        expect(l.source.endsWith(`[${l.key}]`)).toBe(true);
        expect(`${l.figure} ${l.source}`).not.toMatch(OUTSIDE_REFERENCE);
      }
      // The camber figures rest on the sign convention's standard.
      expect(lines.find((l) => l.key === "sae-j670-2008")?.figure).toMatch(/Camber at full bump/);
    }
  });
});
