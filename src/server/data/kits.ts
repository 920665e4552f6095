import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { kitIdParam, type KitCreateFields, type KitDetail, type KitSummary } from "@/contracts/kits";
import { db } from "../db/client";
import { kits, users } from "../db/schema";
import { HttpError, notFound } from "../http/errors";


// The same users table joined twice: who made the kit and who wrote its current version.
const editors = alias(users, "editors");

const summaryColumns = {
  id: kits.id,
  name: kits.name,
  scale: kits.scale,
  notes: kits.notes,
  version: kits.version,
  createdBy: kits.createdBy,
  createdByName: users.name,
  updatedBy: kits.updatedBy,
  updatedByName: editors.name,
  createdAt: kits.createdAt,
  updatedAt: kits.updatedAt,
};

type SummaryRow = { createdAt: Date; updatedAt: Date } & Omit<KitSummary, "createdAt" | "updatedAt">;
const toSummary = <T extends SummaryRow>(r: T) => ({ ...r, createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString() });

/** A kit id from the URL; a malformed one is simply a kit that is not there (404, never a database error). */
export function kitIdOrNotFound(raw: string): string {
  const parsed = kitIdParam.safeParse(raw);
  if (!parsed.success) throw notFound("Kit");
  return parsed.data;
}

export async function listKits(workspaceId: string): Promise<KitSummary[]> {
  const rows = await db
    .select(summaryColumns)
    .from(kits)
    .leftJoin(users, eq(users.id, kits.createdBy))
    .leftJoin(editors, eq(editors.id, kits.updatedBy))
    .where(eq(kits.workspaceId, workspaceId))
    .orderBy(desc(kits.updatedAt));
  return rows.map(toSummary);
}

/** A kit of this workspace; a kit of another workspace is "not found", never "forbidden". */
export async function getKit(workspaceId: string, kitId: string): Promise<KitDetail> {
  const [row] = await db
    .select({ ...summaryColumns, workspaceId: kits.workspaceId, layout: kits.layout })
    .from(kits)
    .leftJoin(users, eq(users.id, kits.createdBy))
    .leftJoin(editors, eq(editors.id, kits.updatedBy))
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId)))
    .limit(1);
  if (!row) throw notFound("Kit");
  return toSummary(row);
}

export async function createKit(workspaceId: string, userId: string, fields: KitCreateFields, layout: unknown): Promise<KitDetail> {
  const [row] = await db
    .insert(kits)
    .values({ workspaceId, name: fields.name, scale: fields.scale, notes: fields.notes ?? "", layout, createdBy: userId, updatedBy: userId })
    .returning({ id: kits.id });
  return getKit(workspaceId, row!.id);
}

/**
 * Writes `patch` only if the stored version still equals `basedOn`, bumping it; otherwise 409 with the
 * current version, so a second tab or collaborator never overwrites work it has not seen.
 */
export async function updateKit(
  workspaceId: string,
  kitId: string,
  userId: string,
  basedOn: number,
  patch: Partial<{ name: string; scale: string; notes: string; layout: unknown }>,
): Promise<KitDetail> {
  const updated = await db
    .update(kits)
    .set({ ...patch, version: basedOn + 1, updatedBy: userId, updatedAt: new Date() })
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId), eq(kits.version, basedOn)))
    .returning({ id: kits.id });
  if (updated.length === 0) {
    const current = await getKit(workspaceId, kitId); // 404 when it is not there at all
    const by = current.updatedByName ? ` by ${current.updatedByName}` : "";
    throw new HttpError(409, "stale_version", `This kit changed since version ${basedOn}; it is now at version ${current.version}${by}. Reload and apply your edit again.`, [
      { path: "version", message: `Stale: the current version is ${current.version}` },
    ], { currentVersion: current.version, updatedByName: current.updatedByName, updatedAt: current.updatedAt });
  }
  return getKit(workspaceId, kitId);
}

export async function deleteKit(workspaceId: string, kitId: string): Promise<void> {
  const deleted = await db
    .delete(kits)
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId)))
    .returning({ id: kits.id });
  if (deleted.length === 0) throw notFound("Kit");
}
