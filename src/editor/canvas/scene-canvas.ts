// Draws a view's marks (src/drawing/screen-scene.ts) straight onto a 2D canvas context. One shape per view
// paints them all: a node per mark meant reconciling and redrawing a few hundred Konva nodes on every
// pointer move of a drag, longer than a frame. Text is set as Konva's Text sets it (top-left box, lines
// `size` apart, aligned in `width`, words wrapped to it), so the drawing looks as it did. Text is measured
// on a canvas outside the page and remembered: setting a font on a canvas in the page resolves it against
// the page's styles, a style recalculation in the middle of a drag for every label.
import type { ScreenMark, StrokeMark, TextMark } from "@/drawing/screen-scene";

/** The part of CanvasRenderingContext2D the marks use (a recording fake stands in for it in tests). */
export type MarkContext = Pick<
  CanvasRenderingContext2D,
  | "beginPath" | "moveTo" | "lineTo" | "closePath" | "arc" | "fill" | "stroke" | "fillText" | "setLineDash"
  | "fillStyle" | "strokeStyle" | "lineWidth" | "lineCap" | "lineJoin" | "globalAlpha" | "font" | "textBaseline" | "textAlign"
>;

/** How wide a text is in a font, and how far below a line's top its baseline sits (a line `size` high). */
export interface TextMeasure {
  width(font: string, text: string): number;
  baseline(font: string, sizePx: number): number;
}

type Measurer = Pick<CanvasRenderingContext2D, "measureText" | "font">;

/** A TextMeasure over a context's measureText, remembering what it measured. */
export function rememberingMeasure(ctx: Measurer, limit = 4000): TextMeasure {
  const widths = new Map<string, number>();
  const baselines = new Map<string, number>();
  const setFont = (font: string) => {
    if (ctx.font !== font) ctx.font = font;
  };
  return {
    width(font, text) {
      const key = `${font}\u0000${text}`;
      let w = widths.get(key);
      if (w === undefined) {
        setFont(font);
        w = ctx.measureText(text).width;
        if (widths.size >= limit) widths.clear();
        widths.set(key, w);
      }
      return w;
    },
    baseline(font, sizePx) {
      let b = baselines.get(font);
      if (b === undefined) {
        setFont(font);
        // As Konva's Text does: the font's own ascent and descent, measured on an "M".
        const m = ctx.measureText("M");
        b = ((m.fontBoundingBoxAscent ?? m.actualBoundingBoxAscent) - (m.fontBoundingBoxDescent ?? m.actualBoundingBoxDescent)) / 2 + sizePx / 2;
        baselines.set(font, b);
      }
      return b;
    },
  };
}

let offPage: TextMeasure | null = null;
/** Measures on a canvas that is not in the page (made on first use: only a browser has one). */
export function offPageMeasure(): TextMeasure {
  if (!offPage) {
    const canvas = typeof OffscreenCanvas !== "undefined" ? new OffscreenCanvas(1, 1) : document.createElement("canvas");
    offPage = rememberingMeasure(canvas.getContext("2d") as Measurer);
  }
  return offPage;
}

/** The CSS font of a label, with multi-word family names quoted (as the canvas font syntax needs). */
export function canvasFont(sizePx: number, bold: boolean, family: string): string {
  const families = family
    .split(",")
    .map((f) => f.trim())
    .map((f) => (f.includes(" ") && !/["']/.test(f) ? `"${f}"` : f))
    .join(", ");
  return `${bold ? "bold" : "normal"} ${sizePx}px ${families}`;
}

/** The lines a label is set in: its own lines, each wrapped at spaces to `width` when it has one. */
export function textLines(measure: (text: string) => number, text: string, width: number | undefined): string[] {
  const out: string[] = [];
  for (const line of text.split("\n")) {
    if (width === undefined || measure(line) <= width) {
      out.push(line);
      continue;
    }
    let current = "";
    for (const word of line.split(" ")) {
      const tried = current ? `${current} ${word}` : word;
      if (current && measure(tried) > width) {
        out.push(current);
        current = word;
      } else current = tried;
    }
    out.push(current);
  }
  return out;
}

function strokeMark(ctx: MarkContext, m: StrokeMark): void {
  const pts = m.points;
  if (pts.length === 0) return;
  ctx.globalAlpha = m.opacity ?? 1;
  ctx.beginPath();
  ctx.moveTo(pts[0]![0], pts[0]![1]);
  for (let i = 1; i < pts.length; i++) ctx.lineTo(pts[i]![0], pts[i]![1]);
  if (m.closed) ctx.closePath();
  if (m.fill) {
    ctx.fillStyle = m.fill;
    ctx.fill();
  }
  ctx.setLineDash(m.dash ? [...m.dash] : []);
  ctx.lineCap = m.round ? "round" : "butt";
  ctx.lineJoin = m.round ? "round" : "miter";
  ctx.lineWidth = m.width;
  ctx.strokeStyle = m.colour;
  ctx.stroke();
}

function textMark(ctx: MarkContext, m: TextMark, family: string, measure: TextMeasure): void {
  const font = canvasFont(m.size, m.bold, family);
  // Set only when it changes: a view's labels share two or three fonts.
  if (ctx.font !== font) ctx.font = font;
  ctx.globalAlpha = 1;
  ctx.fillStyle = m.colour;
  const baseline = measure.baseline(font, m.size);
  const widthOf = (text: string) => measure.width(font, text);
  textLines(widthOf, m.text, m.width).forEach((line, i) => {
    let x = m.at[0];
    if (m.width !== undefined && m.align !== "left") {
      const spare = m.width - widthOf(line);
      x += m.align === "center" ? spare / 2 : spare;
    }
    ctx.fillText(line, x, m.at[1] + baseline + i * m.size);
  });
}

/** Paints the marks in order: fills before strokes, as each mark's own shape would. */
export function drawMarks(ctx: MarkContext, marks: readonly ScreenMark[], fontFamily: string, measure: TextMeasure = offPageMeasure()): void {
  ctx.textAlign = "left";
  ctx.textBaseline = "alphabetic";
  for (const m of marks) {
    if (m.kind === "stroke") strokeMark(ctx, m);
    else if (m.kind === "text") textMark(ctx, m, fontFamily, measure);
    else {
      ctx.globalAlpha = 1;
      ctx.beginPath();
      ctx.arc(m.at[0], m.at[1], m.radius, 0, Math.PI * 2);
      ctx.fillStyle = m.fill;
      ctx.fill();
      if (m.stroke) {
        ctx.setLineDash([]);
        ctx.lineWidth = m.width ?? 2;
        ctx.strokeStyle = m.stroke;
        ctx.stroke();
      }
    }
  }
  ctx.globalAlpha = 1;
  ctx.setLineDash([]);
}
