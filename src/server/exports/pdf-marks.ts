import "server-only";
// The screen marks of a scene (src/drawing/screen-scene.ts) drawn with pdfkit: the canvas's strokes,
// circles and text, on paper.
import type { ScreenMark } from "@/drawing/screen-scene";
import { SHEET_FONTS, paperText, plain } from "./sheet-fonts";

export function drawMarks(doc: PDFKit.PDFDocument, marks: readonly ScreenMark[]): void {
  for (const m of marks) {
    doc.save();
    switch (m.kind) {
      case "stroke": {
        const [first, ...rest] = m.points;
        if (!first) break;
        doc.moveTo(first[0], first[1]);
        for (const p of rest) doc.lineTo(p[0], p[1]);
        if (m.closed) doc.closePath();
        doc.lineWidth(m.width).lineCap(m.round ? "round" : "butt").lineJoin(m.round ? "round" : "miter");
        if (m.dash && m.dash.length >= 2) doc.dash(m.dash[0]!, { space: m.dash[1]! });
        if (m.opacity !== undefined) doc.opacity(m.opacity);
        if (m.fill) doc.fillAndStroke(m.fill, m.colour);
        else doc.stroke(m.colour);
        break;
      }
      case "circle":
        doc.circle(m.at[0], m.at[1], m.radius);
        if (m.stroke) doc.lineWidth(m.width ?? 1).fillAndStroke(m.fill, m.stroke);
        else doc.fill(m.fill);
        break;
      case "text":
        // A line per "\n", each the type's size apart as on the canvas, aligned in the mark's box.
        doc.font(m.bold ? SHEET_FONTS.bold : SHEET_FONTS.regular).fontSize(m.size).fillColor(m.colour);
        m.text.split("\n").forEach((line, i) => {
          doc.text(paperText(line), m.at[0], m.at[1] + i * m.size, plain(m.width ? { width: m.width, align: m.align, lineBreak: false } : { lineBreak: false }));
        });
        break;
    }
    doc.restore();
  }
}
