import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { KitCreateFields, KitDetail } from "@/contracts/kits";
import { revisionNumberParam, type RevisionDetail, type RevisionKind, type RevisionRow, type StoredSummary } from "@/contracts/revisions";
import { db } from "../db/client";
import { kitRevisions, kits, users } from "../db/schema";
import { notFound } from "../http/errors";
import { createKit, getKit, saveKitLayout } from "./kits";
import { readStoredLayout, requireValidLayout } from "./layouts";

/** A revision number from the URL; anything but a whole number ≥ 1 is a revision that is not there. */
export function revisionNumberOrNotFound(raw: string): number {
  const parsed = revisionNumberParam.safeParse(raw);
  if (!parsed.success || String(parsed.data) !== raw) throw notFound("Revision");
  return parsed.data;
}

const rowColumns = {
  number: kitRevisions.number,
  note: kitRevisions.note,
  kind: kitRevisions.kind,
  restoredFrom: kitRevisions.restoredFrom,
  authorId: kitRevisions.authorId,
  authorName: users.name,
  createdAt: kitRevisions.createdAt,
  summary: kitRevisions.summary,
};

type Row = { number: number; note: string; kind: string; restoredFrom: number | null; authorId: string | null; authorName: string | null; createdAt: Date; summary: unknown };

const toRow = (r: Row): RevisionRow => ({
  number: r.number,
  note: r.note,
  kind: r.kind as RevisionKind,
  restoredFrom: r.restoredFrom,
  authorId: r.authorId,
  authorName: r.authorName,
  createdAt: r.createdAt.toISOString(),
  summary: (r.summary ?? null) as StoredSummary | null,
});

/** Every revision of a kit of this workspace, newest first (404 for a kit that is not in it). */
export async function listRevisions(workspaceId: string, kitId: string): Promise<RevisionRow[]> {
  await getKit(workspaceId, kitId);
  const rows = await db
    .select(rowColumns)
    .from(kitRevisions)
    .leftJoin(users, eq(users.id, kitRevisions.authorId))
    .where(eq(kitRevisions.kitId, kitId))
    .orderBy(desc(kitRevisions.number));
  return rows.map(toRow);
}

/** One revision with its layout (upgraded to the latest schema, as the kit's own layout is). */
export async function getRevision(workspaceId: string, kitId: string, number: number): Promise<RevisionDetail> {
  const [row] = await db
    .select({ ...rowColumns, kitId: kitRevisions.kitId, layout: kitRevisions.layout })
    .from(kitRevisions)
    .innerJoin(kits, eq(kits.id, kitRevisions.kitId))
    .leftJoin(users, eq(users.id, kitRevisions.authorId))
    .where(and(eq(kits.workspaceId, workspaceId), eq(kitRevisions.kitId, kitId), eq(kitRevisions.number, number)))
    .limit(1);
  if (!row) {
    await getKit(workspaceId, kitId); // the kit's own 404 first
    throw notFound("Revision");
  }
  return { ...toRow(row), kitId: row.kitId, layout: readStoredLayout(row.layout) };
}

/** Makes an earlier revision's layout the kit's new head, as a new revision: nothing is deleted. */
export async function restoreRevision(workspaceId: string, kitId: string, number: number, userId: string, basedOn: number, note?: string): Promise<KitDetail> {
  const rev = await getRevision(workspaceId, kitId, number);
  const layout = requireValidLayout(rev.layout, "revision.layout");
  return saveKitLayout(workspaceId, kitId, userId, basedOn, layout, { kind: "restore", restoredFrom: number, note: note ?? "" });
}

/** A new kit from this kit's head or one of its revisions; it remembers the kit and revision it came from. */
export async function createVariant(
  workspaceId: string,
  kitId: string,
  userId: string,
  body: { name: string; revision?: number; scale?: string; notes?: string; tags?: string[] },
): Promise<KitDetail> {
  const kit = await getKit(workspaceId, kitId);
  const number = body.revision ?? kit.headRevision;
  const source = body.revision === undefined ? readStoredLayout(kit.layout) : (await getRevision(workspaceId, kitId, number)).layout;
  const layout = requireValidLayout(source, "revision.layout");
  return createKit(
    workspaceId,
    userId,
    { name: body.name, scale: (body.scale ?? kit.scale) as KitCreateFields["scale"], notes: body.notes ?? kit.notes, tags: body.tags ?? kit.tags },
    layout,
    { kind: "variant", note: `Variant of “${kit.name}”, revision ${number}` },
    { kitId: kit.id, revision: number },
  );
}
