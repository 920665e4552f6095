import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import type { AttachmentInfo } from "@/contracts/attachments";
import type { Layout } from "@/contracts/layout";
import type { MaterialSpec } from "@/contracts/shelf";
import type { RunPrediction, TestOutcome, TestRun, TestRunCreateBody, TestRunPatchBody, TestSetup } from "@/contracts/test-log";
import { db } from "../db/client";
import { attachments, kits, shelfItems, testRuns, users } from "../db/schema";
import { HttpError, notFound } from "../http/errors";
import type { Upload } from "../http/upload";
import { deleteObjects } from "../storage/object-store";
import { storeAttachment, toAttachmentInfo } from "./attachments";
import { getKit } from "./kits";
import { requireValidLayout } from "./layouts";
import { getRevision } from "./revisions";
import { predictRun, type ShelfMaterial } from "./run-prediction";

/** Photos one run may carry. */
export const MAX_RUN_PHOTOS = 12;

export function runIdOrNotFound(raw: string): string {
  if (!z.string().uuid().safeParse(raw).success) throw notFound("Test run");
  return raw;
}

const authors = alias(users, "run_authors");

const runColumns = {
  id: testRuns.id,
  kitId: testRuns.kitId,
  workspaceId: testRuns.workspaceId,
  number: testRuns.number,
  revision: testRuns.revision,
  testedOn: testRuns.testedOn,
  part: testRuns.part,
  materialId: testRuns.materialItemId,
  materialName: testRuns.materialName,
  setup: testRuns.setup,
  outcome: testRuns.outcome,
  failureLocation: testRuns.failureLocation,
  notes: testRuns.notes,
  prediction: testRuns.prediction,
  version: testRuns.version,
  createdByName: authors.name,
  createdAt: testRuns.createdAt,
};

type RunRow = { [K in keyof typeof runColumns]: unknown } & { id: string; workspaceId: string; createdAt: Date };

function toRun(r: RunRow, photos: AttachmentInfo[]): TestRun {
  return {
    id: r.id,
    kitId: r.kitId as string,
    number: r.number as number,
    revision: r.revision as number,
    testedOn: r.testedOn as string,
    part: r.part as string,
    materialId: r.materialId as string | null,
    materialName: r.materialName as string,
    setup: r.setup as TestSetup,
    outcome: r.outcome as TestOutcome,
    failureLocation: r.failureLocation as string,
    notes: r.notes as string,
    prediction: (r.prediction ?? null) as RunPrediction | null,
    photos,
    version: r.version as number,
    createdByName: r.createdByName as string | null,
    createdAt: r.createdAt.toISOString(),
  };
}

async function photosOf(runIds: string[]): Promise<Map<string, AttachmentInfo[]>> {
  const byRun = new Map<string, AttachmentInfo[]>();
  if (runIds.length === 0) return byRun;
  const rows = await db.select().from(attachments).where(inArray(attachments.testRunId, runIds)).orderBy(asc(attachments.createdAt), asc(attachments.id));
  for (const r of rows) byRun.set(r.testRunId!, [...(byRun.get(r.testRunId!) ?? []), toAttachmentInfo(r)]);
  return byRun;
}

/** Every run logged for a kit, newest first, with its photos (404 for a kit not in this workspace). */
export async function listTestRuns(workspaceId: string, kitId: string): Promise<TestRun[]> {
  await getKit(workspaceId, kitId);
  const rows = await db
    .select(runColumns)
    .from(testRuns)
    .leftJoin(authors, eq(authors.id, testRuns.createdBy))
    .where(and(eq(testRuns.workspaceId, workspaceId), eq(testRuns.kitId, kitId)))
    .orderBy(desc(testRuns.number));
  const photos = await photosOf(rows.map((r) => r.id));
  return rows.map((r) => toRun(r as RunRow, photos.get(r.id) ?? []));
}

export async function getTestRun(workspaceId: string, kitId: string, runId: string): Promise<TestRun> {
  const [row] = await db
    .select(runColumns)
    .from(testRuns)
    .leftJoin(authors, eq(authors.id, testRuns.createdBy))
    .where(and(eq(testRuns.workspaceId, workspaceId), eq(testRuns.kitId, kitId), eq(testRuns.id, runId)))
    .limit(1);
  if (!row) {
    await getKit(workspaceId, kitId); // the kit's own 404 first
    throw notFound("Test run");
  }
  return toRun(row as RunRow, (await photosOf([row.id])).get(row.id) ?? []);
}

/** The shelf material a run names: 422 naming the field when this workspace's shelf has no such material. */
async function shelfMaterial(workspaceId: string, id: string): Promise<ShelfMaterial> {
  const [row] = await db
    .select({ id: shelfItems.id, name: shelfItems.name, kind: shelfItems.kind, spec: shelfItems.spec })
    .from(shelfItems)
    .where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, id)))
    .limit(1);
  if (row?.kind !== "material") {
    throw new HttpError(422, "invalid", "Invalid body: materialId: no material with this id on the workspace's shelf", [{ path: "materialId", message: "No material with this id on this shelf" }]);
  }
  return { id: row.id, name: row.name, spec: row.spec as MaterialSpec };
}

/** The layout of the revision a run belongs to (422 when the kit has no such revision). */
async function revisionLayout(workspaceId: string, kitId: string, revision: number): Promise<Layout> {
  const rev = await getRevision(workspaceId, kitId, revision).catch((error: unknown) => {
    if (error instanceof HttpError && error.status === 404 && error.message.startsWith("Revision")) {
      throw new HttpError(422, "invalid", `Invalid body: revision: this kit has no revision ${revision}`, [{ path: "revision", message: `No revision ${revision} of this kit` }]);
    }
    throw error;
  });
  return requireValidLayout(rev.layout, "revision.layout");
}

/** Logs a run, numbered after the kit's last one, with the engine's prediction for its set-up. */
export async function createTestRun(workspaceId: string, kitId: string, userId: string, body: TestRunCreateBody): Promise<TestRun> {
  await getKit(workspaceId, kitId);
  const layout = await revisionLayout(workspaceId, kitId, body.revision);
  const material = await shelfMaterial(workspaceId, body.materialId);
  const { prediction, neckShearStressMpa } = predictRun(layout, material, body.setup);
  const id = await db.transaction(async (tx) => {
    // The kit's row lock orders two runs logged at once: each gets its own number.
    await tx.select({ id: kits.id }).from(kits).where(eq(kits.id, kitId)).for("update");
    const [last] = await tx.select({ n: sql<number>`coalesce(max(${testRuns.number}), 0)`.mapWith(Number) }).from(testRuns).where(eq(testRuns.kitId, kitId));
    const [row] = await tx
      .insert(testRuns)
      .values({
        workspaceId,
        kitId,
        number: (last?.n ?? 0) + 1,
        revision: body.revision,
        testedOn: body.testedOn,
        part: body.part,
        materialItemId: material.id,
        materialName: material.name,
        setup: body.setup,
        outcome: body.outcome,
        failureLocation: body.failureLocation,
        notes: body.notes,
        neckShearStressMpa,
        prediction,
        createdBy: userId,
        updatedBy: userId,
      })
      .returning({ id: testRuns.id });
    return row!.id;
  });
  return getTestRun(workspaceId, kitId, id);
}

/** Changes a run if it is still at `patch.version` (else 409); a new set-up or material is predicted again. */
export async function updateTestRun(workspaceId: string, kitId: string, runId: string, userId: string, patch: TestRunPatchBody): Promise<TestRun> {
  const run = await getTestRun(workspaceId, kitId, runId);
  const outcome = patch.outcome ?? run.outcome;
  const failureLocation = patch.failureLocation ?? run.failureLocation;
  if (outcome === "broke" && !failureLocation) {
    throw new HttpError(422, "invalid", "Invalid body: failureLocation: required for a part that broke: say where it broke", [{ path: "failureLocation", message: "Required for a part that broke" }]);
  }
  let again: { materialItemId: string; materialName: string; prediction: RunPrediction; neckShearStressMpa: number | null } | null = null;
  if (patch.setup || patch.materialId) {
    const material = await shelfMaterial(workspaceId, patch.materialId ?? run.materialId ?? "");
    const layout = await revisionLayout(workspaceId, kitId, run.revision);
    again = { materialItemId: material.id, materialName: material.name, ...predictRun(layout, material, patch.setup ?? run.setup) };
  }
  const { version, materialId: _m, ...fields } = patch;
  void _m;
  const done = await db
    .update(testRuns)
    .set({ ...fields, ...(again ?? {}), version: version + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(testRuns.workspaceId, workspaceId), eq(testRuns.kitId, kitId), eq(testRuns.id, runId), eq(testRuns.version, version)))
    .returning({ id: testRuns.id });
  if (done.length === 0) {
    const now = await getTestRun(workspaceId, kitId, runId);
    throw new HttpError(409, "stale_version", `This test run changed since version ${version}; it is now at version ${now.version}. Reload and apply your change again.`, [
      { path: "version", message: `Stale: the current version is ${now.version}` },
    ], { currentVersion: now.version });
  }
  return getTestRun(workspaceId, kitId, runId);
}

/** Removes a run, its photos' rows and then their files (its number is not reused). */
export async function deleteTestRun(workspaceId: string, kitId: string, runId: string): Promise<void> {
  const keys = await db.transaction(async (tx) => {
    const files = await tx.delete(attachments).where(and(eq(attachments.workspaceId, workspaceId), eq(attachments.testRunId, runId))).returning({ key: attachments.objectKey });
    const gone = await tx.delete(testRuns).where(and(eq(testRuns.workspaceId, workspaceId), eq(testRuns.kitId, kitId), eq(testRuns.id, runId))).returning({ id: testRuns.id });
    if (gone.length === 0) throw notFound("Test run");
    return files.map((f) => f.key);
  });
  await deleteObjects(keys);
}

/** Adds a photo to a run: the run must be this kit's, in this workspace, with room for another photo. */
export async function addRunPhoto(workspaceId: string, kitId: string, runId: string, userId: string, readUpload: () => Promise<Upload>): Promise<AttachmentInfo> {
  await getTestRun(workspaceId, kitId, runId);
  const [count] = await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(attachments).where(eq(attachments.testRunId, runId));
  if ((count?.n ?? 0) >= MAX_RUN_PHOTOS) {
    throw new HttpError(422, "too_many_photos", `A test run takes at most ${MAX_RUN_PHOTOS} photos; remove one first.`, [{ path: "file", message: `At most ${MAX_RUN_PHOTOS} photos per run` }]);
  }
  // Read only once the run is known to be the caller's: nothing of a refused upload is read or kept.
  const upload = await readUpload();
  const { row } = await storeAttachment({ workspaceId, kitId, testRunId: runId, purpose: "test-photo", upload, userId });
  return toAttachmentInfo(row);
}

/** Removes one photo of a run, row then file. */
export async function deleteRunPhoto(workspaceId: string, kitId: string, runId: string, fileId: string): Promise<void> {
  const gone = await db
    .delete(attachments)
    .where(and(eq(attachments.workspaceId, workspaceId), eq(attachments.kitId, kitId), eq(attachments.testRunId, runId), eq(attachments.id, fileId)))
    .returning({ key: attachments.objectKey });
  if (gone.length === 0) {
    await getTestRun(workspaceId, kitId, runId);
    throw notFound("Photo");
  }
  await deleteObjects(gone.map((g) => g.key));
}
