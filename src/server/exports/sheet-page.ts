import "server-only";
// The sheet's paper: sizes, the drawing scales a view may take, where the views go on the first page, and
// the title block every page carries.
import type { Orientation, PaperSize } from "@/contracts/exports";
import type { PlaneBox } from "@/drawing/view-transform";
import type { LengthUnit } from "@/figures/length-unit";
import type { ExportMeta } from "./export-kit";
import { SHEET_FONTS, fittingSize, paperText, plain } from "./sheet-fonts";

/** PDF points per millimetre (72 points to the inch, 25.4 mm to the inch). */
export const PT_PER_MM = 72 / 25.4;

/** Paper in points, portrait: ISO 216 A4 (210 × 297 mm) and US Letter (8.5 × 11 in). */
const PAPER_PT: Record<PaperSize, readonly [number, number]> = {
  a4: [210 * PT_PER_MM, 297 * PT_PER_MM],
  letter: [8.5 * 72, 11 * 72],
};

export function pageSize(paper: PaperSize, orientation: Orientation): { width: number; height: number } {
  const [w, h] = PAPER_PT[paper];
  return orientation === "portrait" ? { width: w, height: h } : { width: h, height: w };
}

export const INK = "#1b1f24";
export const MUTED = "#5b5f66";
export const RULE = "#9aa1ab";
export const MARGIN = 28;
/** Points per screen pixel for what the scenes size in pixels (type, line widths, markers). */
export const PT_PER_PX = 0.55;

/** The drawing scales a view may take, largest first (ISO 5455's recommended scales). */
const SCALES = [10, 5, 2, 1, 1 / 2, 1 / 5, 1 / 10, 1 / 20, 1 / 50] as const;
/** Room kept around a view's box for its labels and dimensions, paper mm. */
const VIEW_MARGIN_MM = 12;

export function scaleText(scale: number): string {
  return scale >= 1 ? `${scale}:1` : `1:${Math.round(1 / scale)}`;
}

/** The largest scale at which the box, with room for its labels, fits the area (points). */
export function chooseScale(box: PlaneBox, widthPt: number, heightPt: number): number {
  const w = box.maxU - box.minU;
  const h = box.maxV - box.minV;
  for (const s of SCALES) {
    if ((w * s + VIEW_MARGIN_MM) * PT_PER_MM <= widthPt && (h * s + VIEW_MARGIN_MM) * PT_PER_MM <= heightPt) return s;
  }
  return SCALES[SCALES.length - 1];
}

export interface Rect {
  readonly x: number;
  readonly y: number;
  readonly w: number;
  readonly h: number;
}

/** Where the three views go: the front view on top, then the top view and the joint section. */
export function viewFrames(area: Rect, orientation: Orientation): { front: Rect; top: Rect; joint: Rect } {
  const gap = 6;
  if (orientation === "portrait") {
    const h1 = area.h * 0.44;
    const h2 = area.h * 0.3;
    return {
      front: { x: area.x, y: area.y, w: area.w, h: h1 - gap },
      top: { x: area.x, y: area.y + h1, w: area.w, h: h2 - gap },
      joint: { x: area.x, y: area.y + h1 + h2, w: area.w, h: area.h - h1 - h2 },
    };
  }
  const h1 = area.h * 0.55;
  const w1 = area.w * 0.62;
  return {
    front: { x: area.x, y: area.y, w: w1 - gap, h: h1 - gap },
    joint: { x: area.x + w1, y: area.y, w: area.w - w1, h: h1 - gap },
    top: { x: area.x, y: area.y + h1, w: area.w, h: area.h - h1 },
  };
}

/** One label-over-value cell of the title block. */
function cell(doc: PDFKit.PDFDocument, r: Rect, label: string, value: string, strong = false): void {
  doc.rect(r.x, r.y, r.w, r.h).lineWidth(0.5).stroke(RULE);
  doc.font(SHEET_FONTS.regular).fontSize(6).fillColor(MUTED).text(label, r.x + 3, r.y + 2.5, plain({ width: r.w - 6, lineBreak: false }));
  doc.font(strong ? SHEET_FONTS.bold : SHEET_FONTS.regular);
  doc.fontSize(fittingSize(doc, value, r.w - 6, strong ? 9 : 7.5)).fillColor(INK)
    .text(paperText(value), r.x + 3, r.y + 10.5, plain({ width: r.w - 6, height: r.h - 11, ellipsis: true, lineBreak: false }));
}

const DATE_FORMAT = new Intl.DateTimeFormat("en-GB", { year: "numeric", month: "short", day: "2-digit", timeZone: "UTC" });

/** The title block: kit, revision, sheet, workspace, author, date, units and the scale of each view. */
export function titleBlock(doc: PDFKit.PDFDocument, r: Rect, meta: ExportMeta, unit: LengthUnit, scales: { views: string; model: string }, page: string): void {
  const rowH = r.h / 3;
  const c = r.w / 8;
  cell(doc, { x: r.x, y: r.y, w: c * 5, h: rowH }, "Kit", meta.kitName, true);
  cell(doc, { x: r.x + c * 5, y: r.y, w: c * 1.5, h: rowH }, "Revision", meta.revision, true);
  cell(doc, { x: r.x + c * 6.5, y: r.y, w: c * 1.5, h: rowH }, "Sheet", page);
  cell(doc, { x: r.x, y: r.y + rowH, w: c * 4, h: rowH }, "Workspace", meta.workspaceName);
  cell(doc, { x: r.x + c * 4, y: r.y + rowH, w: c * 2, h: rowH }, "Author", meta.author);
  cell(doc, { x: r.x + c * 6, y: r.y + rowH, w: c * 2, h: rowH }, "Date", DATE_FORMAT.format(new Date(meta.date)));
  cell(doc, { x: r.x, y: r.y + 2 * rowH, w: c * 2, h: rowH }, "Units", unit === "in" ? "inches, degrees" : "mm, degrees");
  cell(doc, { x: r.x + c * 2, y: r.y + 2 * rowH, w: c * 4.5, h: rowH }, "Drawing scales", scales.views);
  cell(doc, { x: r.x + c * 6.5, y: r.y + 2 * rowH, w: c * 1.5, h: rowH }, "Model", scales.model);
}
