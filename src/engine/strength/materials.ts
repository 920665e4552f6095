/**
 * Strength figures of shaft materials, each with its source named by citation key (methods/citations.ts).
 * Stresses and moduli in MPa. Figures are typical or minimum values of the named condition, not guarantees:
 * a designer should replace them with the supplier's certificate or datasheet.
 */
import { GeometryError } from "../errors";
import type { FigureSource } from "../provenance";

interface MaterialCommon {
  /** Stable key, kebab-case. */
  readonly id: string;
  /** Name and condition as a designer would write it. */
  readonly name: string;
  /** Shear modulus G for twist, MPa; absent when no usable figure is known. */
  readonly shearModulusMpa?: number;
  readonly shearModulusSource?: FigureSource;
}

/** A ductile metal: the check uses its tensile yield strength S_y. */
export interface MetalFigure extends MaterialCommon {
  readonly kind: "metal";
  readonly yieldStrengthMpa: number;
  readonly ultimateStrengthMpa?: number;
  readonly strengthSource: FigureSource;
}

/**
 * A printed polymer: the check uses its across-layer (Z, upright) strength — the layer bond carries the
 * torsional shear of a neck whatever the print orientation — times a derate factor in (0, 1].
 */
export interface PrintedFigure extends MaterialCommon {
  readonly kind: "printed";
  readonly process: "fff" | "sls";
  /** Across-layer strength used for the check, MPa (the low end where the source gives a range). */
  readonly acrossLayerStrengthMpa: number;
  /** The source's range of across-layer strength, MPa, when it gives one. */
  readonly acrossLayerRangeMpa?: readonly [number, number];
  /** In-plane (XY) strength, MPa, for reference only. */
  readonly inPlaneStrengthMpa?: number;
  readonly strengthSource: FigureSource;
  /** Multiplies the across-layer strength before the shear criterion, (0, 1]. */
  readonly derateFactor: number;
  readonly derateSource: FigureSource;
}

export type MaterialFigure = MetalFigure | PrintedFigure;

const EFUNDA_4140: FigureSource = { note: "efunda, AISI 4140 alloy steel properties", cites: ["efunda-aisi-4140"] };
const STEEL_G: FigureSource = { note: "steel G ≈ 80 GPa, a value from memory", cites: ["common-practice"] };
const ALUMINIUM_G: FigureSource = { note: "aluminium G ≈ 26–27 GPa, a value from memory", cites: ["common-practice"] };
const PRINT_DERATE: FigureSource = {
  note: "engineering judgement for print-to-print scatter, no published source; change it to suit your process",
  cites: ["common-practice"],
};
// Polymer G from E/(2(1 + ν)) with ν ≈ 0.35 (a textbook figure for polymers, from memory) and the low end of E.
const polymerShearModulus = (youngsMpa: number): number => Math.round(youngsMpa / (2 * (1 + 0.35)));
const POLYMER_G = (what: string, cite: string): FigureSource => ({
  note: `G = E / (2(1 + ν)) with ${what} and ν ≈ 0.35 (a value from memory); printed parts are anisotropic, so treat as rough`,
  cites: [cite, "common-practice"],
});

function steel4140(id: string, condition: string, yieldMpa: number, ultimateMpa: number): MetalFigure {
  return {
    kind: "metal",
    id,
    name: `AISI 4140, ${condition}`,
    yieldStrengthMpa: yieldMpa,
    ultimateStrengthMpa: ultimateMpa,
    strengthSource: EFUNDA_4140,
    shearModulusMpa: 80_000,
    shearModulusSource: STEEL_G,
  };
}

/** The built-in materials table. */
export const MATERIALS: readonly MaterialFigure[] = [
  steel4140("aisi-4140-annealed", "annealed 815 °C", 417.1, 655.0),
  steel4140("aisi-4140-normalized", "normalised 870 °C", 655.0, 1020.4),
  steel4140("aisi-4140-qt-650", "oil-quenched, tempered 650 °C", 655, 758),
  steel4140("aisi-4140-qt-540", "oil-quenched, tempered 540 °C", 834, 951),
  steel4140("aisi-4140-qt-425", "oil-quenched, tempered 425 °C", 1138, 1248),
  steel4140("aisi-4140-qt-205", "oil-quenched, tempered 205 °C", 1641, 1772),
  {
    kind: "metal",
    id: "aisi-1045-cold-drawn-annealed",
    name: "AISI 1045 (≈ JIS S45C), cold drawn and annealed round bar",
    yieldStrengthMpa: 505,
    ultimateStrengthMpa: 585,
    strengthSource: { note: "materials database extract listing S45C as equivalent (weak source)", cites: ["szfco-s45c"] },
    shearModulusMpa: 80_000,
    shearModulusSource: STEEL_G,
  },
  {
    kind: "metal",
    id: "jis-s45c-normalized-min",
    name: "JIS S45C to JIS G4051, normalised (minimum)",
    yieldStrengthMpa: 345,
    ultimateStrengthMpa: 570,
    strengthSource: { note: "JIS G4051 minimum, recalled — check the standard", cites: ["jis-g4051"] },
    shearModulusMpa: 80_000,
    shearModulusSource: STEEL_G,
  },
  {
    kind: "metal",
    id: "jis-s45c-qt-min",
    name: "JIS S45C, quenched and tempered (minimum)",
    yieldStrengthMpa: 490,
    ultimateStrengthMpa: 690,
    strengthSource: { note: "JIS G4051 minimum, recalled — check the standard", cites: ["jis-g4051"] },
    shearModulusMpa: 80_000,
    shearModulusSource: STEEL_G,
  },
  {
    kind: "metal",
    id: "al-7075-t6",
    name: "Aluminium 7075-T6 / T651",
    yieldStrengthMpa: 503,
    ultimateStrengthMpa: 572,
    strengthSource: { note: "SubsTech 7075 data sheet; MMPDS allowables on AmesWeb", cites: ["substech-7075", "amesweb-7075"] },
    shearModulusMpa: 26_900,
    shearModulusSource: ALUMINIUM_G,
  },
  {
    kind: "printed",
    process: "fff",
    id: "pla-fff",
    name: "PLA, FFF printed",
    acrossLayerStrengthMpa: 35,
    acrossLayerRangeMpa: [35, 45],
    inPlaneStrengthMpa: 50,
    strengthSource: { note: "additive.tools PLA, aggregated ranges across sources", cites: ["additive-tools-pla"] },
    derateFactor: 0.8,
    derateSource: PRINT_DERATE,
    shearModulusMpa: polymerShearModulus(3000),
    shearModulusSource: POLYMER_G("E = 3 GPa (low end, additive.tools)", "additive-tools-pla"),
  },
  {
    kind: "printed",
    process: "fff",
    id: "petg-fff",
    name: "PETG, FFF printed",
    acrossLayerStrengthMpa: 25,
    acrossLayerRangeMpa: [25, 38],
    inPlaneStrengthMpa: 44,
    strengthSource: { note: "additive.tools PETG, aggregated ranges across sources", cites: ["additive-tools-petg"] },
    derateFactor: 0.8,
    derateSource: PRINT_DERATE,
    shearModulusMpa: polymerShearModulus(2000),
    shearModulusSource: POLYMER_G("E = 2 GPa (low end, additive.tools)", "additive-tools-petg"),
  },
  {
    kind: "printed",
    process: "fff",
    id: "pa12-cf-fff-annealed",
    name: "PA12 + carbon fibre, FFF printed, annealed 80 °C / 5 h",
    acrossLayerStrengthMpa: 8.78,
    inPlaneStrengthMpa: 27.71,
    strengthSource: {
      note: "Babiș et al., Technologies 2025, 13(10), 456 — vertical prints, about 0.32 × the strongest orientation",
      cites: ["babis-2025-pa12cf"],
    },
    derateFactor: 0.8,
    derateSource: PRINT_DERATE,
  },
  {
    kind: "printed",
    process: "sls",
    id: "pa12-cf-sls",
    name: "PA12 + carbon fibre, SLS",
    acrossLayerStrengthMpa: 38,
    acrossLayerRangeMpa: [38, 50],
    inPlaneStrengthMpa: 46,
    strengthSource: { note: "additive.tools PA12-CF (SLS), Z yield range", cites: ["additive-tools-pa12-cf"] },
    derateFactor: 0.8,
    derateSource: PRINT_DERATE,
  },
];

/** The built-in material with this id; throws GeometryError ("material") for an unknown id. */
export function materialById(id: string): MaterialFigure {
  const found = MATERIALS.find((m) => m.id === id);
  if (!found) throw new GeometryError("material", `no material with id "${id}"`);
  return found;
}
