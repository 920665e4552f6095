import "server-only";
import { and, eq } from "drizzle-orm";
import { DEFAULT_TARGETS, type Targets } from "@/contracts/targets";
import { db } from "../db/client";
import { shelfItems, users, workspaceSettings } from "../db/schema";
import { HttpError } from "../http/errors";
import { catalogueShelf } from "./shelf-catalogue";

export type TargetsRecord = { targets: Targets; version: number; updatedByName: string | null; updatedAt: string };

const targetColumns = {
  minLockDeg: workspaceSettings.minLockDeg,
  maxJointAngleDeg: workspaceSettings.maxJointAngleDeg,
  minSafetyFactor: workspaceSettings.minSafetyFactor,
  ackermannMinPct: workspaceSettings.ackermannMinPct,
  ackermannMaxPct: workspaceSettings.ackermannMaxPct,
  minNeckClearanceMm: workspaceSettings.minNeckClearanceMm,
};

/**
 * Makes the workspace's library settings on first use: the starting targets, and the shelf seeded from the
 * engine's catalogue in the same transaction, so a shelf is seeded once however many requests race here.
 */
export async function ensureWorkspaceLibrary(workspaceId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const made = await tx.insert(workspaceSettings).values({ workspaceId, ...DEFAULT_TARGETS }).onConflictDoNothing().returning({ id: workspaceSettings.workspaceId });
    if (made.length === 0) return;
    await tx
      .insert(shelfItems)
      .values(catalogueShelf().map((c) => ({ workspaceId, kind: c.kind, name: c.name, spec: c.spec, catalogueId: c.catalogueId })))
      .onConflictDoNothing();
  });
}

async function readTargets(workspaceId: string): Promise<TargetsRecord | null> {
  const [row] = await db
    .select({ ...targetColumns, version: workspaceSettings.version, updatedByName: users.name, updatedAt: workspaceSettings.updatedAt })
    .from(workspaceSettings)
    .leftJoin(users, eq(users.id, workspaceSettings.updatedBy))
    .where(eq(workspaceSettings.workspaceId, workspaceId))
    .limit(1);
  if (!row) return null;
  const { version, updatedByName, updatedAt, ...targets } = row;
  return { targets, version, updatedByName, updatedAt: updatedAt.toISOString() };
}

export async function getTargets(workspaceId: string): Promise<TargetsRecord> {
  const found = await readTargets(workspaceId);
  if (found) return found;
  await ensureWorkspaceLibrary(workspaceId);
  return (await readTargets(workspaceId))!;
}

/** Replaces the workspace's targets if `basedOn` is still the version stored; otherwise 409 and nothing changes. */
export async function putTargets(workspaceId: string, userId: string, basedOn: number, targets: Targets): Promise<TargetsRecord> {
  await getTargets(workspaceId);
  const updated = await db
    .update(workspaceSettings)
    .set({ ...targets, version: basedOn + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(workspaceSettings.workspaceId, workspaceId), eq(workspaceSettings.version, basedOn)))
    .returning({ id: workspaceSettings.workspaceId });
  const now = (await readTargets(workspaceId))!;
  if (updated.length === 0) {
    const by = now.updatedByName ? ` by ${now.updatedByName}` : "";
    throw new HttpError(409, "stale_version", `The targets changed since version ${basedOn}; they are now at version ${now.version}${by}. Reload and apply your change again.`, [
      { path: "version", message: `Stale: the current version is ${now.version}` },
    ], { currentVersion: now.version });
  }
  return now;
}
