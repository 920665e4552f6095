import { TARNWICK_10_BASE, TARNWICK_10_BELLCRANK, TARNWICK_10_CARDAN, TARNWICK_10_CVD, TARNWICK_10_PRINTED, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import type { JointSpec, MaterialSpec, ShaftSpec } from "@/contracts/shelf";
import type { TargetOverrides, Targets } from "@/contracts/targets";

// The invented club's design library: the Tarnwick 10's front corner, the variants its designers tried,
// each with the revisions that got it there, the club's shelf and its targets. Every name, figure source
// and note here is made up for the demo.

/** Who did it: the demo people by role (demo-seed.ts maps them to accounts). */
export type DemoAuthor = "owner" | "editor";

/** A shelf item the demo adds to the catalogue's; `key` names it inside the demo. */
export type DemoShelfItem =
  | { key: string; kind: "material"; name: string; spec: MaterialSpec }
  | { key: string; kind: "joint"; name: string; spec: JointSpec }
  | { key: string; kind: "shaft"; name: string; spec: Omit<ShaftSpec, "materialId"> & { materialKey: string | null } };

export const DEMO_SHELF: readonly DemoShelfItem[] = [
  {
    key: "club-4140",
    kind: "material",
    name: "Club 4140 bar, batch HF-0412",
    spec: { printed: false, tensileYieldMpa: 834, yieldSource: "supplier certificate HF-0412, quenched and tempered 540 °C (an invented certificate for the demo)", shearRule: "distortion-energy", derate: 1, derateSource: "" },
  },
  {
    key: "club-cvd",
    kind: "joint",
    name: "Club CVD, bench-rated 40°",
    spec: { jointType: "cvd", ratedAngleDeg: 40, ratedAngleSource: "rated on the club's bending jig, 2 h at 40° without binding (invented for the demo)", plungeMm: 3, plungeSource: "measured slide of the pin in the cup (invented for the demo)" },
  },
  { key: "dogbone-5", kind: "shaft", name: "Dogbone 5.0 mm, stock", spec: { neckDiameterMm: 5, boreDiameterMm: 0, lengthMm: 71, materialKey: "club-4140" } },
  { key: "dogbone-4", kind: "shaft", name: "Dogbone 4.0 mm, turned down", spec: { neckDiameterMm: 4, boreDiameterMm: 0, lengthMm: 71, materialKey: "club-4140" } },
];

/** The club's targets: what its members design to. */
export const DEMO_TARGETS: Targets = {
  minLockDeg: 25,
  maxJointAngleDeg: 36,
  minSafetyFactor: 2.5,
  ackermannMinPct: 60,
  ackermannMaxPct: 110,
  minNeckClearanceMm: 0.2,
};

/** One revision of a demo kit: its layout (with shelf items to take figures from), note and author. */
export interface DemoRevision {
  readonly layout: Layout;
  readonly shelf?: readonly string[];
  readonly note: string;
  readonly by: DemoAuthor;
  /** How many days ago it was saved. */
  readonly daysAgo: number;
}

export interface DemoKit {
  readonly key: string;
  readonly name: string;
  readonly scale: string;
  readonly notes: string;
  readonly tags: readonly string[];
  readonly targets?: TargetOverrides;
  /** A variant: the demo kit and revision number it was made from. */
  readonly from?: { readonly key: string; readonly revision: number };
  readonly archived?: boolean;
  readonly revisions: readonly DemoRevision[];
}

const withCamber = (deg: number): Layout => ({ ...TARNWICK_10_BASE, frontView: { ...TARNWICK_10_BASE.frontView, staticCamberDeg: deg } });
const withCup = (layout: Layout, mm: number): Layout => ({ ...layout, drive: { ...layout.drive, cupMouthDiameterMm: mm } });
const withNeck = (mm: number): Layout => ({ ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, neckDiameterMm: mm } });

/** The demo kits in the order they were made (variants after their origin). */
export const DEMO_KITS: readonly DemoKit[] = [
  {
    key: "tarnwick-10-base",
    name: "Tarnwick 10 — 5.0 mm steel dogbone",
    scale: "1:10",
    notes: "Baseline: 5.0 mm 4140 dogbone in a closed 8 mm cup. Held 12 packs on the club track.",
    tags: ["steel", "race", "baseline"],
    revisions: [
      { layout: withCup(withCamber(-0.5), 7.5), note: "First layout, measured off the club car: 7.5 mm cups as the kit shipped.", by: "owner", daysAgo: 41 },
      { layout: withCamber(-0.5), note: "Cups bored out to 8 mm: more lock before the neck touches the mouth.", by: "editor", daysAgo: 33 },
      { layout: TARNWICK_10_BASE, note: "Static camber to −1°: the outer shoulders were wearing after the club day.", by: "owner", daysAgo: 26 },
      { layout: TARNWICK_10_BASE, shelf: ["dogbone-5"], note: "Shaft and material from the club's shelf (batch HF-0412 bar).", by: "owner", daysAgo: 19 },
    ],
  },
  {
    key: "tarnwick-10-thin-neck",
    name: "Tarnwick 10 — 4.0 mm steel dogbone",
    scale: "1:10",
    notes: "Neck turned down to 4.0 mm for more steer lock; watch the safety factor.",
    tags: ["steel", "race", "lock"],
    from: { key: "tarnwick-10-base", revision: 3 },
    revisions: [
      { layout: TARNWICK_10_THIN_NECK, shelf: ["dogbone-4"], note: "Turned-down 4.0 mm dogbone from the shelf.", by: "editor", daysAgo: 18 },
    ],
  },
  {
    key: "tarnwick-10-cvd",
    name: "Tarnwick 10 — CVD 4.5 mm",
    scale: "1:10",
    notes: "CVD variant with a 4.5 mm neck.",
    tags: ["cvd", "race"],
    revisions: [
      { layout: { ...TARNWICK_10_CVD, drive: { ...TARNWICK_10_CVD.drive, ratedAngleDeg: 45 } }, note: "CVD at the catalogue's 45°.", by: "editor", daysAgo: 15 },
      { layout: TARNWICK_10_CVD, shelf: ["club-cvd"], note: "Rated angle from the club's jig test (40°), not the catalogue.", by: "editor", daysAgo: 12 },
    ],
  },
  {
    key: "tarnwick-10-printed",
    name: "Tarnwick 10 — printed PA12-CF, slotted cup",
    scale: "1:10",
    notes: "Printed PA12-CF shaft in a slotted cup: a test part, not for racing.",
    tags: ["printed", "test part"],
    revisions: [
      { layout: { ...TARNWICK_10_PRINTED, drive: { ...TARNWICK_10_PRINTED.drive, slottedCup: false, slotLimitDeg: undefined } }, note: "Printed shaft in the stock closed cup.", by: "owner", daysAgo: 9 },
      { layout: TARNWICK_10_PRINTED, note: "Slotted the cup so the neck can pass the rim; the slot end stops it at 34°.", by: "owner", daysAgo: 7 },
    ],
  },
  {
    key: "tarnwick-10-cardan",
    name: "Tarnwick 10 — single cardan, hollow 7075",
    scale: "1:10",
    notes: "Single cardan on a hollow 7075 shaft; check the speed fluctuation at lock.",
    tags: ["aluminium", "cardan"],
    targets: { maxJointAngleDeg: 42 },
    revisions: [
      { layout: TARNWICK_10_CARDAN, note: "Hollow 7075 shaft, 2 mm bore. The club accepts 42° on this joint after the jig test.", by: "editor", daysAgo: 5 },
    ],
  },
  {
    key: "tarnwick-10-bellcrank",
    name: "Tarnwick 10 — bellcrank steering",
    scale: "1:10",
    notes: "Bellcrank pair and drag link in place of the rack; same 5.0 mm dogbone as the baseline.",
    tags: ["steel", "bellcrank"],
    from: { key: "tarnwick-10-base", revision: 3 },
    revisions: [
      { layout: TARNWICK_10_BELLCRANK, note: "Bellcranks in place of the rack: the servo saver moves to the centre line.", by: "owner", daysAgo: 3 },
    ],
  },
  {
    key: "tarnwick-10-too-thin",
    name: "Tarnwick 10 — 3.5 mm neck (shelved)",
    scale: "1:10",
    notes: "Tried for lock; the rated angle binds first, so it gains nothing. Kept for the record.",
    tags: ["steel", "lock"],
    from: { key: "tarnwick-10-base", revision: 2 },
    archived: true,
    revisions: [
      { layout: withNeck(3.5), note: "3.5 mm neck: no more lock than at 4.0 mm (the joint's rated angle binds first), for less strength.", by: "editor", daysAgo: 30 },
    ],
  },
];
