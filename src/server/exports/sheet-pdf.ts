import "server-only";
// The dimension sheet, a PDF made with pdfkit. Per kit: a drawing page (the front view, the top view and
// the joint section to stated scales with their dimensions, the headline figures, the cautions and the
// title block), then the tables (the computed figures with units and signs, the inputs, the sources of
// the formulas) and the cautions again. Several kits make one document, each starting on a new page.
import PDFDocument from "pdfkit";
import type { Orientation, PaperSize } from "@/contracts/exports";
import { kitScenes } from "@/drawing/kit-scenes";
import type { Scene } from "@/drawing/scene";
import { sceneMarks } from "@/drawing/screen-scene";
import { CAUTIONS } from "@/figures/cautions";
import type { LengthUnit } from "@/figures/length-unit";
import { inputGroups, sheetFigureGroups } from "@/figures/sheet-figures";
import { zeroLockNote } from "@/figures/readout-figures";
import type { ExportKit } from "./export-kit";
import { drawMarks } from "./pdf-marks";
import { SHEET_FONTS, SHEET_FONT_REGULAR_PATH, fittingSize, paperText, plain, sheetBoldFont } from "./sheet-fonts";
import { INK, MARGIN, MUTED, PT_PER_MM, PT_PER_PX, RULE, chooseScale, pageSize, scaleText, titleBlock, viewFrames, type Rect } from "./sheet-page";
import { SOURCE_TAGS, figureSign, sheetSources } from "./sheet-sources";

export interface SheetOptions {
  readonly paper: PaperSize;
  readonly orientation: Orientation;
  readonly unit: LengthUnit;
}

const TITLE_BLOCK_H = 72;
const TITLE_BLOCK_W = 270;
/** Headline figures on the drawing page (readout ids). */
const HEADLINE = ["steer-lock-worst", "joint-max", "neck-clearance", "safety-factor"] as const;

type Doc = PDFKit.PDFDocument;

/** One view in its frame: title and stated scale, the drawing clipped to the frame, the view's notes. */
function drawView(doc: Doc, scene: Scene, r: Rect): number {
  const head = 14;
  const area: Rect = { x: r.x + 4, y: r.y + head, w: r.w - 8, h: r.h - head - 4 };
  const scale = chooseScale(scene.box, area.w, area.h);
  const s = scale * PT_PER_MM;
  const cu = (scene.box.minU + scene.box.maxU) / 2;
  const cv = (scene.box.minV + scene.box.maxV) / 2;
  const t = { scale: s, ox: area.x + area.w / 2 - cu * s, oy: area.y + area.h / 2 + cv * s };
  doc.rect(r.x, r.y, r.w, r.h).lineWidth(0.5).stroke(RULE);
  doc.font(SHEET_FONTS.bold).fontSize(8).fillColor(INK).text(`${scene.title} · scale ${scaleText(scale)}`, r.x + 4, r.y + 3.5, plain({ continued: true, lineBreak: false }))
    .font(SHEET_FONTS.regular).fillColor(MUTED).text(`   ${paperText(scene.axes)}`, plain({ lineBreak: false }));
  doc.save();
  doc.rect(area.x, area.y, area.w, area.h).clip();
  drawMarks(doc, sceneMarks(scene, t, { left: area.x, width: area.w }, PT_PER_PX));
  doc.restore();
  scene.notes.forEach((note, i) => {
    const y = r.y + r.h - 10 - (scene.notes.length - 1 - i) * 9;
    doc.font(SHEET_FONTS.regular).fontSize(6.5).fillColor(INK).text(paperText(note), r.x + 4, y, plain({ width: r.w - 8, align: "right", lineBreak: false }));
  });
  return scale;
}

/** The drawing page; answers the scales the views took, for the title block. */
function drawingPage(doc: Doc, kit: ExportKit, o: SheetOptions): { views: string; model: string } {
  const { width, height } = doc.page;
  const scenes = kitScenes(kit.layout, kit.analysis, o.unit, "sheet");
  const bottom = height - MARGIN - TITLE_BLOCK_H;
  const frames = viewFrames({ x: MARGIN, y: MARGIN + 12, w: width - 2 * MARGIN, h: bottom - 8 - (MARGIN + 12) }, o.orientation);
  doc.font(SHEET_FONTS.bold).fontSize(9).fillColor(INK).text("Dimension sheet", MARGIN, MARGIN - 2, plain({ continued: true, lineBreak: false }))
    .font(SHEET_FONTS.regular).fillColor(MUTED).text(`   ${paperText(kit.meta.kitName)} · left front corner; the right corner mirrors it`, plain({ lineBreak: false }));
  const sf = drawView(doc, scenes.front, frames.front);
  const st = drawView(doc, scenes.top, frames.top);
  const sj = drawView(doc, scenes.joint, frames.joint);
  headlineFigures(doc, kit, o.unit, { x: MARGIN, y: bottom, w: width - 2 * MARGIN - TITLE_BLOCK_W - 6, h: TITLE_BLOCK_H });
  return { views: `front ${scaleText(sf)} · top ${scaleText(st)} · joint ${scaleText(sj)}`, model: kit.meta.modelScale };
}

/** The headline figures (as the readouts word them) and the cautions, beside the title block. */
function headlineFigures(doc: Doc, kit: ExportKit, unit: LengthUnit, r: Rect): void {
  const all = sheetFigureGroups(kit.analysis, unit).flatMap((g) => g.readouts);
  const shown = HEADLINE.map((id) => all.find((f) => f.id === id)).filter((f) => f !== undefined);
  const w = r.w / shown.length;
  const boxH = 31;
  shown.forEach((f, i) => {
    const x = r.x + i * w;
    doc.rect(x, r.y, w, boxH).lineWidth(0.5).stroke(RULE);
    // One line each: a label too long for its box ends in an ellipsis (the tables spell it out).
    doc.font(SHEET_FONTS.regular).fontSize(5.5).fillColor(MUTED).text(paperText(f.label), x + 3, r.y + 2.5, plain({ width: w - 6, height: 7, ellipsis: true }));
    doc.font(SHEET_FONTS.bold).fontSize(fittingSize(doc, f.value, w - 6, 10)).fillColor(f.tone === "bad" ? "#b91c1c" : INK).text(paperText(f.value), x + 3, r.y + 10, plain({ width: w - 6, lineBreak: false }));
    if (f.hint) doc.font(SHEET_FONTS.regular).fontSize(5).fillColor(MUTED).text(paperText(f.hint), x + 3, r.y + 22, plain({ width: w - 6, height: 6, ellipsis: true }));
  });
  doc.font(SHEET_FONTS.bold).fontSize(6).fillColor("#92400e").text("Cautions", r.x, r.y + boxH + 2.5, plain({ width: r.w, lineBreak: false }));
  doc.font(SHEET_FONTS.regular).fontSize(5.6).fillColor(INK).text(CAUTIONS.join(" "), r.x, r.y + boxH + 9.5, plain({ width: r.w, height: r.h - boxH - 9 }));
}

/** Writes down the page, starting a new page (with the running header) when the next block does not fit. */
class Flow {
  y = 0;
  constructor(private readonly doc: Doc, private readonly header: string) {
    this.page();
  }

  get width(): number {
    return this.doc.page.width - 2 * MARGIN;
  }

  page(): void {
    this.doc.addPage();
    this.doc.font(SHEET_FONTS.regular).fontSize(7).fillColor(MUTED).text(paperText(this.header), MARGIN, MARGIN - 6, plain({ lineBreak: false }));
    this.y = MARGIN + 8;
  }

  /** Room for `h` points, or a new page. */
  need(h: number): void {
    if (this.y + h > this.doc.page.height - MARGIN - 20) this.page();
  }

  heading(text: string): void {
    this.need(34);
    this.y += 6;
    this.doc.font(SHEET_FONTS.bold).fontSize(10).fillColor(INK).text(text, MARGIN, this.y, plain({ lineBreak: false }));
    this.y += 15;
  }
}

/** A table row: cells at x offsets with widths; answers its height. */
function row(doc: Doc, f: Flow, cells: readonly { text: string; x: number; w: number; bold?: boolean; size?: number; colour?: string }[]): void {
  const measure = (c: (typeof cells)[number]) => doc.font(c.bold ? SHEET_FONTS.bold : SHEET_FONTS.regular).fontSize(c.size ?? 7.5).heightOfString(paperText(c.text), plain({ width: c.w }));
  const h = Math.max(...cells.map(measure)) + 3;
  f.need(h);
  for (const c of cells) {
    doc.font(c.bold ? SHEET_FONTS.bold : SHEET_FONTS.regular).fontSize(c.size ?? 7.5).fillColor(c.colour ?? INK).text(paperText(c.text), MARGIN + c.x, f.y, plain({ width: c.w }));
  }
  f.y += h;
  doc.moveTo(MARGIN, f.y - 1.5).lineTo(MARGIN + f.width, f.y - 1.5).lineWidth(0.3).stroke("#d6d9de");
}

function tablesPages(doc: Doc, kit: ExportKit, o: SheetOptions): void {
  const a = kit.analysis;
  const f = new Flow(doc, `${kit.meta.kitName} · revision ${kit.meta.revision} · ${kit.meta.workspaceName}`);
  const W = f.width;
  // Figure | value | notes and sign: the value column is wide enough for the longest limit's words.
  const cLabel = { x: 0, w: W * 0.3 };
  const cValue = { x: W * 0.3 + 4, w: W * 0.25 };
  const cNote = { x: W * 0.55 + 8, w: W * 0.45 - 8 };
  f.heading("Computed figures");
  const note = zeroLockNote(a, o.unit);
  if (note) row(doc, f, [{ text: note, x: 0, w: W, colour: "#92400e" }]);
  row(doc, f, [{ text: "Figure", ...cLabel, bold: true, colour: MUTED, size: 7 }, { text: "Value", ...cValue, bold: true, colour: MUTED, size: 7 }, { text: "Notes and sign convention", ...cNote, bold: true, colour: MUTED, size: 7 }]);
  const groups = sheetFigureGroups(a, o.unit);
  for (const g of groups) {
    row(doc, f, [{ text: g.title, x: 0, w: W, bold: true, size: 8 }]);
    for (const r of g.readouts) {
      const sign = figureSign(r.id);
      const notes = [r.hint, sign ? `sign: ${sign}` : null].filter(Boolean).join(" · ");
      row(doc, f, [{ text: r.label, ...cLabel }, { text: r.value, ...cValue, bold: true, colour: r.tone === "bad" ? "#b91c1c" : INK }, { text: notes, ...cNote, size: 6.5, colour: MUTED }]);
    }
  }
  if (a.warnings.length) {
    f.heading("Warnings");
    for (const w of a.warnings) row(doc, f, [{ text: w, x: 0, w: W, colour: "#92400e" }]);
  }
  f.heading(`Inputs (lengths in ${o.unit === "in" ? "inches" : "millimetres"})`);
  const half = (W - 12) / 2;
  for (const g of inputGroups(kit.layout, o.unit)) {
    row(doc, f, [{ text: g.title, x: 0, w: W, bold: true, size: 8 }]);
    for (let i = 0; i < g.rows.length; i += 2) {
      const cells = [g.rows[i], g.rows[i + 1]].flatMap((r, j) => r ? [{ text: r.label, x: j * (half + 12), w: half * 0.6 }, { text: r.value, x: j * (half + 12) + half * 0.6 + 4, w: half * 0.4 - 4, bold: true }] : []);
      row(doc, f, cells);
    }
  }
  f.heading("Sources of the formulas");
  row(doc, f, [{ text: SOURCE_TAGS, x: 0, w: W, size: 6.5, colour: MUTED }]);
  for (const s of sheetSources(a, groups.flatMap((g) => g.readouts))) {
    row(doc, f, [{ text: s.figure, x: 0, w: W * 0.3, size: 7 }, { text: s.source, x: W * 0.3 + 4, w: W * 0.7 - 4, size: 7 }]);
  }
  f.heading("Cautions");
  for (const c of CAUTIONS) row(doc, f, [{ text: c, x: 0, w: W, colour: "#92400e" }]);
}

/**
 * The dimension sheet of one kit or several (one after another in one document). Lengths in `unit`;
 * figures worded and rounded as the editor's readouts word and round them.
 */
export function sheetPdf(kits: readonly ExportKit[], o: SheetOptions): Promise<Buffer> {
  const size = pageSize(o.paper, o.orientation);
  const first = kits[0]!;
  const doc = new PDFDocument({
    size: [size.width, size.height],
    margin: 0,
    autoFirstPage: false,
    bufferPages: true,
    font: SHEET_FONT_REGULAR_PATH,
    info: { Title: `Dimension sheet — ${kits.map((k) => k.meta.kitName).join(", ")}`, Author: first.meta.author, Subject: `Revision ${first.meta.revision}`, Creator: "Knucklebench" },
  });
  doc.registerFont(SHEET_FONTS.bold, sheetBoldFont());
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  // Each kit's pages, then its title block and page numbers once its page count is known.
  for (const kit of kits) {
    doc.addPage();
    const start = doc.bufferedPageRange().count - 1;
    const scales = drawingPage(doc, kit, o);
    tablesPages(doc, kit, o);
    const count = doc.bufferedPageRange().count - start;
    for (let i = 0; i < count; i++) {
      doc.switchToPage(start + i);
      const { width, height } = doc.page;
      doc.rect(MARGIN - 8, MARGIN - 12, width - 2 * MARGIN + 16, height - 2 * MARGIN + 20).lineWidth(0.8).stroke(INK);
      const page = `${i + 1} of ${count}`;
      if (i === 0) titleBlock(doc, { x: width - MARGIN - TITLE_BLOCK_W, y: height - MARGIN - TITLE_BLOCK_H, w: TITLE_BLOCK_W, h: TITLE_BLOCK_H }, kit.meta, o.unit, scales, page);
      else doc.font(SHEET_FONTS.regular).fontSize(7).fillColor(MUTED).text(`Sheet ${page}`, MARGIN, height - MARGIN - 4, plain({ width: width - 2 * MARGIN, align: "right", lineBreak: false }));
    }
  }
  doc.end();
  return done;
}
