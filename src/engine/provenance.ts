/**
 * Where a figure comes from, with the tags of REFERENCES.md:
 * "found" [F] a published source, "from-memory" [M] recalled from a named book or standard,
 * "derived" [D] worked out here, "common-practice" [C] a fact of the trade with no source.
 */
export type ProvenanceTag = "found" | "from-memory" | "derived" | "common-practice";

/** A figure's source: its tags (one or more, honestly mixed where a value is half memory, half practice) and a citation. */
export interface FigureSource {
  readonly provenance: readonly ProvenanceTag[];
  readonly citation: string;
}
