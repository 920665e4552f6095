import "server-only";
import { and, asc, eq, isNotNull } from "drizzle-orm";
import { proposalFor, type CalibrationApplyBody, type CalibrationPoint, type MaterialCalibration } from "@/contracts/calibration";
import type { MaterialSpec, ShelfItem, ShelfKitUse } from "@/contracts/shelf";
import type { RunPrediction, TestOutcome } from "@/contracts/test-log";
import { calibrateAllowable } from "@/engine";
import { db } from "../db/client";
import { kits, shelfItems, testRuns } from "../db/schema";
import { HttpError, notFound } from "../http/errors";
import { allowableOf } from "./run-prediction";
import { updateShelfItem } from "./shelf";

const today = () => new Date().toISOString().slice(0, 10);

/** Every shelf material with logged runs: its points, the calibration and what applying it would do. */
export async function workspaceCalibration(workspaceId: string, materialId?: string): Promise<MaterialCalibration[]> {
  const rows = await db
    .select({
      runId: testRuns.id,
      kitId: testRuns.kitId,
      kitName: kits.name,
      runNumber: testRuns.number,
      revision: testRuns.revision,
      testedOn: testRuns.testedOn,
      part: testRuns.part,
      outcome: testRuns.outcome,
      failureLocation: testRuns.failureLocation,
      stress: testRuns.neckShearStressMpa,
      prediction: testRuns.prediction,
      materialId: shelfItems.id,
      materialName: shelfItems.name,
      materialVersion: shelfItems.version,
      spec: shelfItems.spec,
    })
    .from(testRuns)
    .innerJoin(kits, eq(kits.id, testRuns.kitId))
    .innerJoin(shelfItems, eq(shelfItems.id, testRuns.materialItemId))
    .where(and(eq(testRuns.workspaceId, workspaceId), isNotNull(testRuns.neckShearStressMpa), ...(materialId ? [eq(shelfItems.id, materialId)] : [])))
    .orderBy(asc(shelfItems.name), asc(testRuns.testedOn), asc(kits.name), asc(testRuns.number));

  const byMaterial = new Map<string, typeof rows>();
  for (const r of rows) byMaterial.set(r.materialId, [...(byMaterial.get(r.materialId) ?? []), r]);
  return [...byMaterial.values()].map((runs) => {
    const m = runs[0]!;
    const spec = m.spec as MaterialSpec;
    const allowable = allowableOf({ id: m.materialId, name: m.materialName, spec });
    const points: CalibrationPoint[] = runs.map((r) => {
      const p = r.prediction as RunPrediction | null;
      return {
        runId: r.runId,
        kitId: r.kitId,
        kitName: r.kitName,
        runNumber: r.runNumber,
        revision: r.revision,
        testedOn: r.testedOn,
        part: r.part,
        outcome: r.outcome as TestOutcome,
        failureLocation: r.failureLocation,
        safetyFactor: allowable / r.stress!,
        loggedSafetyFactor: p?.ok ? p.safetyFactor : null,
      };
    });
    const calibration = calibrateAllowable(points);
    return {
      material: { id: m.materialId, name: m.materialName, version: m.materialVersion, printed: spec.printed, derate: spec.derate, derateSource: spec.derateSource },
      allowableShearMpa: allowable,
      points,
      calibration,
      proposal: proposalFor(calibration, spec.derate, today()),
    };
  });
}

/**
 * Applies a material's calibration to its shelf item as a new derate with the source "calibrated from N test
 * runs". It is a shelf edit like any other: the kits it rewrites must be confirmed (409 `confirm_kits` lists
 * them) and a stale item version is 409. When the runs changed since the person looked (another run logged,
 * a figure edited), nothing is written: 409 `calibration_changed` with the calibration of now.
 */
export async function applyCalibration(workspaceId: string, materialId: string, userId: string, body: CalibrationApplyBody): Promise<{ item: ShelfItem; changedKits: ShelfKitUse[] }> {
  const [now] = await workspaceCalibration(workspaceId, materialId);
  if (!now) {
    const [item] = await db.select({ kind: shelfItems.kind }).from(shelfItems).where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, materialId))).limit(1);
    if (item?.kind !== "material") throw notFound("Shelf material");
    throw new HttpError(422, "no_runs", "No test runs are logged with this material yet: there is nothing to calibrate from.");
  }
  const p = now.proposal;
  if (!p) {
    throw new HttpError(422, "not_calibrated", now.calibration.status === "overlap"
      ? "A run that broke was predicted at least as safe as a run that held: no single derate puts the line between them."
      : "Calibrating needs at least one run that held and one that broke.");
  }
  if (now.calibration.runs !== body.runs || Math.abs(p.derateAfter - body.derate) > 1e-9 || now.material.version !== body.version) {
    throw new HttpError(409, "calibration_changed", `The runs or the material changed since you looked: the calibration is now from ${now.calibration.runs} runs, a derate of ${p.derateAfter}. Look again before applying it.`, undefined, { calibration: now });
  }
  if (!p.applicable) throw new HttpError(422, "not_applicable", p.reason!);
  const [item] = await db.select({ spec: shelfItems.spec }).from(shelfItems).where(eq(shelfItems.id, materialId)).limit(1);
  const spec = { ...(item!.spec as MaterialSpec), derate: p.derateAfter, derateSource: p.source };
  return updateShelfItem(workspaceId, materialId, userId, { version: body.version, spec, kits: body.kits });
}
