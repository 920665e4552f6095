// The one-shape painter of a view's marks: what it asks of the canvas for each kind of mark, and that text
// is set where Konva's Text set it before (top-left box, lines `size` apart, aligned in its width).
import { describe, expect, it } from "vitest";
import { canvasFont, drawMarks, rememberingMeasure, textLines, type MarkContext, type TextMeasure } from "@/editor/canvas/scene-canvas";
import type { ScreenMark } from "@/drawing/screen-scene";

type Call = [string, ...unknown[]];

/** A measuring context with text 6 px a character and a font 8 up, 2 down, counting what it is asked. */
function fakeMeasurer() {
  const asked: string[] = [];
  const ctx = {
    font: "",
    measureText: (s: string) => {
      asked.push(s);
      return { width: s.length * 6, fontBoundingBoxAscent: 8, fontBoundingBoxDescent: 2, actualBoundingBoxAscent: 7, actualBoundingBoxDescent: 0 } as TextMetrics;
    },
  };
  return { ctx, asked };
}
const sixPx = (): TextMeasure => rememberingMeasure(fakeMeasurer().ctx);

/** A context that records calls and style settings. */
function recorder(): { ctx: MarkContext; calls: Call[] } {
  const calls: Call[] = [];
  const target: Record<string, unknown> = {};
  const ctx = new Proxy(target, {
    get(t, key: string) {
      if (`_${key}` in t) return t[`_${key}`];
      return (...args: unknown[]) => calls.push([key, ...args]);
    },
    set(t, key: string, value) {
      calls.push([`${key}=`, value]);
      t[`_${key}`] = value;
      return true;
    },
  }) as unknown as MarkContext;
  return { ctx, calls };
}

const base = { layer: "arms", part: "arm" } as const;

describe("drawMarks", () => {
  it("draws a closed, filled, dashed stroke: path, fill, then the stroke with its dash, caps and width", () => {
    const { ctx, calls } = recorder();
    const mark: ScreenMark = { ...base, kind: "stroke", points: [[0, 0], [10, 0], [10, 5]], closed: true, colour: "#123456", width: 2, dash: [4, 2], fill: "#abcdef", opacity: 0.5, round: false };
    drawMarks(ctx, [mark], "sans-serif", sixPx());
    const names = calls.map((c) => c[0]);
    expect(names.slice(2, 9)).toEqual(["globalAlpha=", "beginPath", "moveTo", "lineTo", "lineTo", "closePath", "fillStyle="]);
    expect(calls).toContainEqual(["globalAlpha=", 0.5]);
    expect(calls).toContainEqual(["lineTo", 10, 5]);
    expect(names.indexOf("fill")).toBeLessThan(names.indexOf("stroke"));
    expect(calls).toContainEqual(["setLineDash", [4, 2]]);
    expect(calls).toContainEqual(["lineCap=", "butt"]);
    expect(calls).toContainEqual(["lineJoin=", "miter"]);
    expect(calls).toContainEqual(["lineWidth=", 2]);
    expect(calls).toContainEqual(["strokeStyle=", "#123456"]);
    // Left clean for whatever the layer draws next.
    expect(calls.at(-2)).toEqual(["globalAlpha=", 1]);
    expect(calls.at(-1)).toEqual(["setLineDash", []]);
  });

  it("an open round stroke without fill is never filled, and has no dash", () => {
    const { ctx, calls } = recorder();
    drawMarks(ctx, [{ ...base, kind: "stroke", points: [[1, 2], [3, 4]], closed: false, colour: "#000", width: 1.5, round: true }], "sans-serif", sixPx());
    expect(calls.map((c) => c[0])).not.toContain("fill");
    expect(calls.map((c) => c[0])).not.toContain("closePath");
    expect(calls).toContainEqual(["setLineDash", []]);
    expect(calls).toContainEqual(["lineCap=", "round"]);
  });

  it("a circle: a full arc, filled, and stroked only when it has a stroke", () => {
    const { ctx, calls } = recorder();
    drawMarks(ctx, [
      { ...base, kind: "circle", at: [5, 6], radius: 3, fill: "#fff", stroke: "#111", width: 1.5 },
      { ...base, kind: "circle", at: [7, 8], radius: 2, fill: "#eee" },
    ], "sans-serif", sixPx());
    const arcs = calls.filter((c) => c[0] === "arc");
    expect(arcs).toEqual([["arc", 5, 6, 3, 0, Math.PI * 2], ["arc", 7, 8, 2, 0, Math.PI * 2]]);
    expect(calls.filter((c) => c[0] === "stroke")).toHaveLength(1);
    expect(calls).toContainEqual(["lineWidth=", 1.5]);
  });

  it("text: each line's baseline is (ascent − descent)/2 + size/2 below the box top, lines size apart", () => {
    const { ctx, calls } = recorder();
    drawMarks(ctx, [{ ...base, kind: "text", at: [10, 20], text: "a\nbcd", size: 12, bold: true, colour: "#222", align: "left" }], "system-ui, Segoe UI", sixPx());
    expect(calls).toContainEqual(["font=", 'bold 12px system-ui, "Segoe UI"']);
    // (8 − 2)/2 + 12/2 = 9
    expect(calls.filter((c) => c[0] === "fillText")).toEqual([["fillText", "a", 10, 29], ["fillText", "bcd", 10, 41]]);
  });

  it("centred and right-aligned text sits in its box by the line's measured width", () => {
    const { ctx, calls } = recorder();
    drawMarks(ctx, [
      { ...base, kind: "text", at: [0, 0], text: "abcd", size: 10, bold: false, colour: "#222", align: "center", width: 100 },
      { ...base, kind: "text", at: [0, 0], text: "abcd", size: 10, bold: false, colour: "#222", align: "right", width: 100 },
    ], "sans-serif", sixPx());
    const xs = calls.filter((c) => c[0] === "fillText").map((c) => c[2]);
    // "abcd" is 24 px wide: centred at (100 − 24)/2, right-aligned at 100 − 24.
    expect(xs).toEqual([38, 76]);
  });
});

describe("textLines", () => {
  const width = (s: string) => s.length * 6;
  it("keeps lines that fit and wraps a long one at spaces to the box", () => {
    expect(textLines(width, "short\nalso", 60)).toEqual(["short", "also"]);
    // 6 px a character: 60 px holds 10 characters.
    expect(textLines(width, "neck 5.6 mm at the stop", 60)).toEqual(["neck 5.6", "mm at the", "stop"]);
    expect(textLines(width, "anything goes", undefined)).toEqual(["anything goes"]);
  });
  it("a single word wider than the box stays whole", () => {
    expect(textLines(width, "unbreakableword", 30)).toEqual(["unbreakableword"]);
  });
});

describe("rememberingMeasure", () => {
  it("measures each text and font once, and sets the font only to change it", () => {
    const { ctx, asked } = fakeMeasurer();
    const m = rememberingMeasure(ctx);
    expect(m.width("normal 11px x", "abc")).toBe(18);
    expect(m.width("normal 11px x", "abc")).toBe(18);
    expect(m.baseline("normal 11px x", 11)).toBe(8.5);
    expect(m.baseline("normal 11px x", 11)).toBe(8.5);
    expect(asked).toEqual(["abc", "M"]);
    expect(ctx.font).toBe("normal 11px x");
  });
  it("starts over past its limit rather than growing without end", () => {
    const { ctx, asked } = fakeMeasurer();
    const m = rememberingMeasure(ctx, 2);
    m.width("f", "a");
    m.width("f", "b");
    m.width("f", "c"); // clears, then remembers c
    m.width("f", "a");
    expect(asked).toEqual(["a", "b", "c", "a"]);
  });
});

describe("drawMarks with text", () => {
  it("sets a font once for labels that share it", () => {
    const { ctx, calls } = recorder();
    const label = (text: string): ScreenMark => ({ ...base, kind: "text", at: [0, 0], text, size: 11, bold: false, colour: "#222", align: "left" });
    drawMarks(ctx, [label("a"), label("b"), label("c")], "sans-serif", sixPx());
    expect(calls.filter((c) => c[0] === "font=")).toEqual([["font=", "normal 11px sans-serif"]]);
  });
});

describe("canvasFont", () => {
  it("quotes family names with spaces and leaves quoted ones alone", () => {
    expect(canvasFont(11, false, "system-ui, -apple-system, 'Segoe UI', sans-serif")).toBe("normal 11px system-ui, -apple-system, 'Segoe UI', sans-serif");
    expect(canvasFont(9, true, "Noto Sans, serif")).toBe('bold 9px "Noto Sans", serif');
  });
});
