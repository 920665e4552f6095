// The cautions the product shows wherever its figures could hurt someone if taken on trust (DESIGN.md):
// the editor's sheet tab, the dimension sheet, the README.

export const CAUTIONS: readonly string[] = [
  "Strength figures are estimates: printed parts vary with layer direction, infill, temperature and moisture.",
  "A drivetrain spun up on the bench can throw fragments: guard it and wear eye protection.",
  "This is a design aid for models, not a sign-off for full-size or road vehicles: defer to local codes and licensed practice.",
];
