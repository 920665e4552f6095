/**
 * A reference to a document outside the product, which nothing the product shows or sends may carry: the
 * team's own sheet of formulas by name, a Markdown file, or a bracketed provenance tag ([F], [M], [D], [C]).
 * A book's own section sign (Shigley §5-5) is part of a proper citation and is not matched.
 */
export const OUTSIDE_REFERENCE = /\bREFERENCES\b|\b[\w-]+\.md\b|\[(?:F|M|D|C)(?:\]|,|\/)/;
