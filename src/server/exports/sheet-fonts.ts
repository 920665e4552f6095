import "server-only";
// The sheet's type: Inter (SIL Open Font License 1.1, src/app/fonts/Inter-LICENSE.txt), regular and
// semibold, embedded as subsets. pdfkit cannot subset the variable web font the pages use, and parsing the
// full OpenType (CFF) cuts costs it a second a sheet, so src/app/fonts holds TrueType cuts of the
// characters a sheet sets (how they were made: src/app/fonts/README.md).
import { readFileSync } from "node:fs";
import path from "node:path";

const FONT_DIR = path.join(process.cwd(), "src", "app", "fonts");

/**
 * The regular cut is the document's first font (opened from its file, so pdfkit never loads its built-in
 * Helvetica) and is named by its path; the semibold is registered from memory under a name.
 */
export const SHEET_FONT_REGULAR_PATH = path.join(FONT_DIR, "inter-sheet-regular.ttf");
export const SHEET_FONTS = { regular: SHEET_FONT_REGULAR_PATH, bold: "inter-semibold" } as const;

let bold: Buffer | null = null;

/** The semibold cut's file, read once per process. */
export function sheetBoldFont(): Buffer {
  bold ??= readFileSync(path.join(FONT_DIR, "inter-sheet-semibold.ttf"));
  return bold;
}

/** Inter has no diameter sign (U+2300): the sheet writes the letter Ø, as drawings commonly do. */
export function paperText(text: string): string {
  return text.replaceAll("⌀", "Ø");
}

// OpenType shaping (contextual alternates, kerning) costs fontkit a few milliseconds per string with Inter,
// seconds over a sheet; plain glyphs set a technical sheet well, so every string is set with them off.
const NO_FEATURES = { ccmp: false, locl: false, rlig: false, mark: false, mkmk: false, calt: false, clig: false, liga: false, rclt: false, curs: false, kern: false };

/** Text options with shaping off (pdfkit hands `features` to fontkit, which takes this object form too). */
export function plain<T extends PDFKit.Mixins.TextOptions>(options: T = {} as T): T {
  return { ...options, features: NO_FEATURES as unknown as PDFKit.Mixins.TextOptions["features"] };
}

/** The largest type size, from `max` down to `min` points, at which the current font sets `text` on one line of `width`. */
export function fittingSize(doc: PDFKit.PDFDocument, text: string, width: number, max: number, min = 5.5): number {
  const at = doc.fontSize(max).widthOfString(paperText(text), plain());
  return at <= width ? max : Math.max(min, (max * width) / at);
}
