import "server-only";
import type { JointSpec, MaterialSpec } from "@/contracts/shelf";
import { DRIVE_JOINT_TYPES, MATERIALS } from "@/engine";
import { citationByKey } from "@/engine/methods/citations";
import type { FigureSource } from "@/engine/provenance";

/**
 * A catalogue figure's source as the shelf shows it: the engine's note and its citations, each by the short
 * name and the stable key of the methods page (/methods#key), where the full citation is.
 */
const cite = (s: FigureSource) => `${s.note} — ${s.cites.map((k) => `${citationByKey(k).short} [${k}]`).join("; ")}`.slice(0, 500);

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
      ratedAngleSource: cite({ ...j.ratedAngleSource, note: `${j.ratedAngleSource.note}; typical of ${j.ratedAngleRangeDeg[0]}–${j.ratedAngleRangeDeg[1]}°` }),
      // The catalogue says whether a joint slides, not how far: a fixed joint takes none, a plunging one needs the maker's figure.
      plungeMm: j.plunges ? null : 0,
      plungeSource: j.plunges ? "slides axially; no figure in the catalogue, enter the maker's" : `fixed joint, takes no plunge (${j.note})`.slice(0, 500),
    },
  }));
  return [...materials, ...joints];
}
