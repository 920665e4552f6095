import "server-only";
import type { JointSpec, MaterialSpec } from "@/contracts/shelf";
import { DRIVE_JOINT_TYPES, MATERIALS } from "@/engine";

type FigureSource = { readonly provenance: readonly string[]; readonly citation: string };

/**
 * A catalogue citation as the product shows it: the published source and how it was found, without the
 * pointers into the team's own working notes (those are for us, not for the people who design with it).
 */
export function publicCitation(text: string): string {
  return text
    .replace(/[,;]?\s*via REFERENCES §[\d.]+/g, "")
    .replace(/\s*\(REFERENCES §[\d.]+[^)]*\)/g, "")
    .replace(/[,;]?\s*REFERENCES §[\d.]+(\s*\[[A-Z]\](\/\[[A-Z]\])?)?/g, "")
    .trim();
}

const cite = (s: FigureSource) => `${publicCitation(s.citation)} [${s.provenance.join(", ")}]`.slice(0, 500);

export type CatalogueItem =
  | { kind: "material"; name: string; catalogueId: string; spec: MaterialSpec }
  | { kind: "joint"; name: string; catalogueId: string; spec: JointSpec };

/** A new shelf's contents: the engine's materials and joint kinds, each figure with the engine's source. */
export function catalogueShelf(): CatalogueItem[] {
  const materials: CatalogueItem[] = MATERIALS.map((m) =>
    m.kind === "metal"
      ? {
          kind: "material",
          name: m.name,
          catalogueId: m.id,
          spec: { printed: false, tensileYieldMpa: m.yieldStrengthMpa, yieldSource: cite(m.strengthSource), shearRule: "distortion-energy", derate: 1, derateSource: "" },
        }
      : {
          kind: "material",
          name: m.name,
          catalogueId: m.id,
          spec: {
            printed: true,
            tensileYieldMpa: m.acrossLayerStrengthMpa,
            yieldSource: cite(m.strengthSource),
            shearRule: "distortion-energy",
            derate: m.derateFactor,
            derateSource: cite(m.derateSource),
          },
        },
  );
  const joints: CatalogueItem[] = Object.values(DRIVE_JOINT_TYPES).map((j) => ({
    kind: "joint",
    name: j.label,
    catalogueId: j.kind,
    spec: {
      jointType: j.kind,
      ratedAngleDeg: j.typicalRatedAngleDeg,
      ratedAngleSource: cite({ ...j.ratedAngleSource, citation: `${j.ratedAngleSource.citation}; typical of ${j.ratedAngleRangeDeg[0]}–${j.ratedAngleRangeDeg[1]}°` }),
      // The catalogue says whether a joint slides, not how far: a fixed joint takes none, a plunging one needs the maker's figure.
      plungeMm: j.plunges ? null : 0,
      plungeSource: j.plunges ? "slides axially; no figure in the catalogue, enter the maker's" : `fixed joint, takes no plunge (${publicCitation(j.note)})`.slice(0, 500),
    },
  }));
  return [...materials, ...joints];
}
