/**
 * How the product knows a source, said in words on the methods page (never as a bracketed tag):
 * "seen" — read at the address given, only what it shows is relied on; "recalled" — cited from the book or
 * standard as remembered, its edition, chapter and clause not re-read; "derived" — worked out for this
 * product from the geometry stated and checked numerically by a second, independent method;
 * "common-practice" — a fact of the trade with no published source.
 */
export type SourceStatus = "seen" | "recalled" | "derived" | "common-practice";

/** A figure's source: a plain note and the citation keys (methods page anchors, see methods/citations.ts) it rests on. */
export interface FigureSource {
  readonly note: string;
  readonly cites: readonly string[];
}
