import "server-only";
import { and, eq } from "drizzle-orm";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import type { MaterialSpec } from "@/contracts/shelf";
import type { TestOutcome, TestSetup } from "@/contracts/test-log";
import { initialPlacement, placeByPicks } from "@/contracts/underlays";
import { db } from "../db/client";
import { kits, kitUnderlays, shelfItems, testRuns } from "../db/schema";
import { uploadFromBytes } from "../http/upload";
import { storeAttachment } from "./attachments";
import { benchPhotoSvg, cornerDrawingSvg, renderSvg } from "./demo-pictures";
import { createTestRun } from "./test-runs";
import { putUnderlay } from "./underlays";

// The club's test log: runs of the demo kits on the bench rig and the club track, each with a photo drawn for
// the demo (demo-pictures.ts), and a pencil drawing under the baseline kit's front view. Every name, figure
// and note is invented for the demo.

const RACE_GEARING = [76 / 22, 2.6];
const kv = (currentA: number, load: string, lockDeg: number | null = 28): TestSetup => ({ motor: { kind: "kv", kvRpmPerV: 4000, currentA }, gearRatios: RACE_GEARING, lockDeg, load });
const rig = (torqueNm: number, load: string): TestSetup => ({ motor: { kind: "torque", torqueNm }, gearRatios: RACE_GEARING, lockDeg: 0, load });

/** The club's flat-printed PA12-CF, added to the shelf with the test log (its runs calibrate it). */
export const DEMO_PRINT_MATERIAL: { name: string; spec: MaterialSpec } = {
  name: "Club PA12-CF, printed flat",
  spec: {
    printed: true,
    tensileYieldMpa: 27.71,
    yieldSource: "in-plane strength of FFF PA12 + carbon fibre, annealed: Babiș et al., Technologies 2025, 13(10), 456 (the club prints its shafts flat on the bed)",
    shearRule: "distortion-energy",
    derate: 0.8,
    derateSource: "the club's print settings, taken as the common FFF derate until the test log says otherwise (invented for the demo)",
  },
};

interface DemoRun {
  readonly kit: string;
  readonly revision: number;
  readonly daysAgo: number;
  readonly part: string;
  /** A shelf material by name. */
  readonly material: string;
  readonly setup: TestSetup;
  readonly outcome: TestOutcome;
  readonly where?: string;
  readonly notes: string;
  readonly by: "owner" | "editor";
  readonly photos: number;
}

const STEEL = "Club 4140 bar, batch HF-0412";
const PRINT = DEMO_PRINT_MATERIAL.name;

export const DEMO_RUNS: readonly DemoRun[] = [
  { kit: "Tarnwick 10 — 5.0 mm steel dogbone", revision: 3, daysAgo: 24, part: "left front dogbone", material: STEEL, setup: kv(80, "1.9 kg race trim, 12 packs on the club loop"), outcome: "held", notes: "No marks on the neck or the pin. Cups show a light polish only.", by: "owner", photos: 1 },
  { kit: "Tarnwick 10 — 5.0 mm steel dogbone", revision: 4, daysAgo: 17, part: "right front dogbone", material: STEEL, setup: kv(80, "1.9 kg race trim, club day, 3 heats and the final"), outcome: "held", notes: "Same as run 1 after a full club day.", by: "editor", photos: 0 },
  { kit: "Tarnwick 10 — 4.0 mm steel dogbone", revision: 2, daysAgo: 16, part: "left front dogbone", material: STEEL, setup: kv(80, "1.9 kg race trim, 8 packs"), outcome: "held", notes: "The extra lock is welcome in the hairpin; no marks.", by: "editor", photos: 1 },
  { kit: "Tarnwick 10 — 4.0 mm steel dogbone", revision: 2, daysAgo: 11, part: "left front dogbone", material: STEEL, setup: kv(160, "punch setting on the bench rig, 40 launches against the brake"), outcome: "worn", where: "pin flats at the outer ball", notes: "The pin has worn flats; the neck itself is fine. Swap the pins every few club days.", by: "editor", photos: 1 },
  { kit: "Tarnwick 10 — 3.5 mm neck (shelved)", revision: 2, daysAgo: 29, part: "left front dogbone", material: STEEL, setup: kv(120, "bench rig, 30 launches against the brake"), outcome: "held", notes: "Held on the rig at the club's usual current.", by: "editor", photos: 0 },
  { kit: "Tarnwick 10 — 3.5 mm neck (shelved)", revision: 2, daysAgo: 28, part: "left front dogbone", material: STEEL, setup: kv(160, "punch setting on the bench rig"), outcome: "broke", where: "neck, 2 mm from the inner ball", notes: "Sheared at the neck on the 11th launch. The fracture face is flat and bright: a torsion break.", by: "editor", photos: 1 },
  { kit: "Tarnwick 10 — printed PA12-CF, slotted cup", revision: 2, daysAgo: 6, part: "left front dogbone", material: PRINT, setup: rig(0.03, "bench rig, 50 launches against the brake"), outcome: "held", notes: "Printed flat, 100 % infill, annealed. No whitening at the neck.", by: "owner", photos: 1 },
  { kit: "Tarnwick 10 — printed PA12-CF, slotted cup", revision: 2, daysAgo: 6, part: "left front dogbone", material: PRINT, setup: rig(0.05, "bench rig, 50 launches against the brake"), outcome: "held", notes: "Still fine; slight stringing marks from the print only.", by: "owner", photos: 0 },
  { kit: "Tarnwick 10 — printed PA12-CF, slotted cup", revision: 2, daysAgo: 5, part: "left front dogbone", material: PRINT, setup: kv(25, "1.7 kg test trim, 3 packs, gentle throttle", 26), outcome: "worn", where: "neck, whitened over 3 mm", notes: "Whitening at the neck after three packs: the layers are starting to give.", by: "owner", photos: 1 },
  { kit: "Tarnwick 10 — printed PA12-CF, slotted cup", revision: 2, daysAgo: 4, part: "right front dogbone", material: PRINT, setup: kv(30, "1.7 kg test trim, first pack", 26), outcome: "broke", where: "neck, between two layers", notes: "Broke along a layer line on a hard launch out of the hairpin.", by: "owner", photos: 1 },
  { kit: "Tarnwick 10 — printed PA12-CF, slotted cup", revision: 2, daysAgo: 3, part: "left front dogbone", material: PRINT, setup: kv(40, "1.7 kg, full throttle launches on the rig"), outcome: "broke", where: "neck, at the outer ball", notes: "Gone on the second launch.", by: "owner", photos: 1 },
];

const DAY_MS = 86_400_000;

async function ensureMaterial(workspaceId: string, author: string): Promise<void> {
  await db.insert(shelfItems).values({ workspaceId, kind: "material", name: DEMO_PRINT_MATERIAL.name, spec: DEMO_PRINT_MATERIAL.spec, createdBy: author, updatedBy: author }).onConflictDoNothing();
}

async function kitIdByName(workspaceId: string, name: string): Promise<string | undefined> {
  const [k] = await db.select({ id: kits.id }).from(kits).where(and(eq(kits.workspaceId, workspaceId), eq(kits.name, name))).limit(1);
  return k?.id;
}

/** The runs of each demo kit that has none yet, with their photos. Returns how many runs were added. */
export async function seedDemoTestLog(workspaceId: string, authors: Record<"owner" | "editor", string>): Promise<number> {
  await ensureMaterial(workspaceId, authors.owner);
  const materials = await db.select({ id: shelfItems.id, name: shelfItems.name, spec: shelfItems.spec }).from(shelfItems).where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.kind, "material")));
  const logged = new Set((await db.selectDistinct({ kitId: testRuns.kitId }).from(testRuns).where(eq(testRuns.workspaceId, workspaceId))).map((r) => r.kitId));
  let added = 0;
  for (const [i, r] of DEMO_RUNS.entries()) {
    const kitId = await kitIdByName(workspaceId, r.kit);
    const material = materials.find((m) => m.name === r.material);
    if (!kitId || !material || logged.has(kitId)) continue;
    const testedOn = new Date(Date.now() - r.daysAgo * DAY_MS).toISOString().slice(0, 10);
    const run = await createTestRun(workspaceId, kitId, authors[r.by], {
      revision: r.revision,
      testedOn,
      part: r.part,
      materialId: material.id,
      setup: r.setup,
      outcome: r.outcome,
      failureLocation: r.where ?? "",
      notes: r.notes,
    });
    for (let n = 0; n < r.photos; n++) {
      const printed = (material.spec as MaterialSpec).printed;
      const neckMm = r.kit.includes("3.5 mm") ? 3.5 : r.kit.includes("4.0 mm") ? 4 : 5;
      const bytes = await renderSvg(benchPhotoSvg({ outcome: r.outcome, neckMm, printed, seed: i + 1 }), "jpeg");
      await storeAttachment({ workspaceId, kitId, testRunId: run.id, purpose: "test-photo", upload: uploadFromBytes(bytes, "image/jpeg", `run-${run.number}-${r.outcome}.jpg`), userId: authors[r.by], caption: `${r.part} after run ${run.number}` });
    }
    await db.update(testRuns).set({ createdAt: new Date(Date.now() - (r.daysAgo - 0.3) * DAY_MS) }).where(eq(testRuns.id, run.id));
    added += 1;
  }
  // Runs of a kit are added together: a kit with some already is left as it is.
  return added;
}

/** A pencil drawing under the baseline kit's front view, scaled by its two marks 100 mm apart. */
export async function seedDemoUnderlay(workspaceId: string, author: string): Promise<void> {
  const kitId = await kitIdByName(workspaceId, "Tarnwick 10 — 5.0 mm steel dogbone");
  if (!kitId) return;
  const [has] = await db.select({ id: kitUnderlays.id }).from(kitUnderlays).where(and(eq(kitUnderlays.kitId, kitId), eq(kitUnderlays.view, "front"))).limit(1);
  if (has) return;
  const drawing = cornerDrawingSvg(TARNWICK_10_BASE);
  const bytes = await renderSvg(drawing.svg, "png");
  const [a, b] = drawing.marks;
  // The first mark is where the centreline meets the ground: the origin of the front view.
  const placement = placeByPicks(initialPlacement({ width: 1000, height: 640 }, [60, 40], 250), a, b, drawing.markDistanceMm, { level: true, aAtMm: [0, 0] });
  await putUnderlay(workspaceId, kitId, "front", author, placement, async () => uploadFromBytes(bytes, "image/png", "tarnwick-front-sketch.png"));
  await db.update(kitUnderlays).set({ opacity: 0.6 }).where(and(eq(kitUnderlays.kitId, kitId), eq(kitUnderlays.view, "front")));
}
