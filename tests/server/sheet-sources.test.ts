// What the sheet prints as a figure's source and sign: the engine's own text, with our team's sheet of
// formulas (not a published source) left out.
import { describe, expect, it } from "vitest";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { analyzeLayout } from "@/engine";
import { sheetFigureGroups } from "@/figures/sheet-figures";
import { figureSign, publishedPart, sheetSources } from "@/server/exports/sheet-sources";

describe("publishedPart", () => {
  it("keeps the published source and drops mentions of our own notes", () => {
    expect(publishedPart("Barton & Fieldhouse §3.1.5.3 [F]; REFERENCES §5.1")).toBe("Barton & Fieldhouse §3.1.5.3 [F]");
    expect(publishedPart("REFERENCES §2.2 (Jazar ch. 7 [M], Milliken ch. 19 [M])")).toBe("Jazar ch. 7 [M], Milliken ch. 19 [M]");
    expect(publishedPart("efunda, AISI 4140 alloy steel properties, via REFERENCES §7.2")).toBe("efunda, AISI 4140 alloy steel properties");
    expect(publishedPart("+ above the ground under the wheel at this travel (DESIGN.md)")).toBe("+ above the ground under the wheel at this travel");
  });

  it("answers null when nothing published is left", () => {
    expect(publishedPart("REFERENCES §5.1–5.2 [F]/[D]")).toBeNull();
    expect(publishedPart("REFERENCES §1.6, §8")).toBeNull();
    expect(publishedPart("—")).toBeNull();
  });
});

describe("the sheet's signs and sources", () => {
  it("gives every sign-bearing figure its sign, and every source line a published source", () => {
    expect(figureSign("camber-bump")).toBe("+ wheel top leans outboard (relative to the body)");
    expect(figureSign("scrub")).toBe("+ axis meets the ground inboard of the contact centre");
    expect(figureSign("not-a-figure")).toBeNull();
    for (const d of DEMO_LAYOUTS) {
      const a = analyzeLayout(d.layout, { travelSteps: 9, steerSteps: 15 });
      const lines = sheetSources(a, sheetFigureGroups(a, "mm").flatMap((g) => g.readouts));
      expect(lines.length).toBeGreaterThan(5);
      expect(lines.at(-1)!.figure).toBe("Allowable shear of the material");
      for (const l of lines) expect(`${l.figure} ${l.source}`).not.toMatch(/REFERENCES|DESIGN\.md/);
    }
  });
});
