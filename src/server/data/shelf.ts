import "server-only";
import { and, arrayContains, asc, eq, sql } from "drizzle-orm";
import { parseLayout, type Layout } from "@/contracts/layout";
import {
  applyShelfItem,
  SHELF_KIND_LABELS,
  SPEC_SCHEMAS,
  type ShelfItem,
  type ShelfItemCreateBody,
  type ShelfKind,
  type ShelfKitUse,
  type ShelfSpec,
} from "@/contracts/shelf";
import type { StoredSummary } from "@/contracts/revisions";
import { db } from "../db/client";
import { kitRevisions, kits, shelfItems, users } from "../db/schema";
import { fieldIssues, HttpError, notFound } from "../http/errors";
import { writeHeadRevision } from "./kits";
import { readStoredLayout, requireValidLayout } from "./layouts";
import { summarizeLayout } from "./summaries";
import { ensureWorkspaceLibrary } from "./targets";

/** How many kits one shelf edit may rewrite (each gets a new revision and a fresh analysis). */
export const SHELF_EDIT_KIT_LIMIT = 500;

const ITEM_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function shelfItemIdOrNotFound(raw: string): string {
  if (!ITEM_ID.test(raw)) throw notFound("Shelf item");
  return raw.toLowerCase();
}

/** The kits whose head layout takes its figures from the item (its id in kits.shelf_refs, indexed). */
const refersTo = (id: string) => arrayContains(kits.shelfRefs, [id]);

const itemColumns = {
  id: shelfItems.id,
  kind: shelfItems.kind,
  name: shelfItems.name,
  spec: shelfItems.spec,
  catalogueId: shelfItems.catalogueId,
  version: shelfItems.version,
  updatedByName: users.name,
  updatedAt: shelfItems.updatedAt,
  usedBy: sql<number>`(select count(*) from ${kits} where ${kits.workspaceId} = ${shelfItems.workspaceId} and ${kits.shelfRefs} @> array[${shelfItems.id}::text])`.mapWith(Number),
};

type ItemRow = { id: string; kind: string; name: string; spec: unknown; catalogueId: string | null; version: number; updatedByName: string | null; updatedAt: Date; usedBy: number };
const toItem = (r: ItemRow): ShelfItem => ({ ...r, kind: r.kind as ShelfKind, spec: r.spec as ShelfSpec, updatedAt: r.updatedAt.toISOString() });

/** The workspace's shelf (seeded from the engine's catalogue on first use), by kind then name. */
export async function listShelf(workspaceId: string): Promise<ShelfItem[]> {
  await ensureWorkspaceLibrary(workspaceId);
  const rows = await db
    .select(itemColumns)
    .from(shelfItems)
    .leftJoin(users, eq(users.id, shelfItems.updatedBy))
    .where(eq(shelfItems.workspaceId, workspaceId))
    .orderBy(asc(shelfItems.kind), asc(shelfItems.name));
  return rows.map(toItem);
}

export async function getShelfItem(workspaceId: string, id: string): Promise<ShelfItem> {
  const [row] = await db
    .select(itemColumns)
    .from(shelfItems)
    .leftJoin(users, eq(users.id, shelfItems.updatedBy))
    .where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, id)))
    .limit(1);
  if (!row) throw notFound("Shelf item");
  return toItem(row);
}

const nameTaken = (kind: ShelfKind, name: string) =>
  new HttpError(409, "name_taken", `This shelf already has a ${SHELF_KIND_LABELS[kind].one} named “${name}”.`, [{ path: "name", message: "Name already used on this shelf" }]);

function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; cause?: { code?: string } };
  return e?.code === "23505" || e?.cause?.code === "23505";
}

async function requireShaftMaterial(workspaceId: string, spec: ShelfSpec, kind: ShelfKind): Promise<void> {
  if (kind !== "shaft") return;
  const materialId = (spec as { materialId: string | null }).materialId;
  if (!materialId) return;
  const [m] = await db.select({ kind: shelfItems.kind }).from(shelfItems).where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, materialId))).limit(1);
  if (m?.kind !== "material") throw new HttpError(422, "invalid", "Invalid body: spec.materialId: no material with this id on the workspace's shelf", [{ path: "spec.materialId", message: "No material with this id on this shelf" }]);
}

export async function createShelfItem(workspaceId: string, userId: string, body: ShelfItemCreateBody): Promise<ShelfItem> {
  await ensureWorkspaceLibrary(workspaceId);
  await requireShaftMaterial(workspaceId, body.spec, body.kind);
  try {
    const [row] = await db.insert(shelfItems).values({ workspaceId, kind: body.kind, name: body.name, spec: body.spec, createdBy: userId, updatedBy: userId }).returning({ id: shelfItems.id });
    return getShelfItem(workspaceId, row!.id);
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(body.kind, body.name);
    throw error;
  }
}

type KitHead = { id: string; name: string; version: number; headRevision: number; archivedAt: Date | null; layout: unknown };

async function kitsReferring(workspaceId: string, item: { id: string }): Promise<KitHead[]> {
  return db
    .select({ id: kits.id, name: kits.name, version: kits.version, headRevision: kits.headRevision, archivedAt: kits.archivedAt, layout: kitRevisions.layout })
    .from(kits)
    .innerJoin(kitRevisions, and(eq(kitRevisions.kitId, kits.id), eq(kitRevisions.number, kits.headRevision)))
    .where(and(eq(kits.workspaceId, workspaceId), refersTo(item.id)))
    .orderBy(asc(kits.name));
}

const toUse = (k: KitHead): ShelfKitUse => ({ id: k.id, name: k.name, version: k.version, headRevision: k.headRevision, archived: k.archivedAt !== null });

/** Every kit whose head layout takes figures from the item. */
export async function kitsUsingShelfItem(workspaceId: string, id: string): Promise<ShelfKitUse[]> {
  const item = await getShelfItem(workspaceId, id);
  return (await kitsReferring(workspaceId, item)).map(toUse);
}

// Key order does not make two layouts different.
function stableJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(stableJson).join(",")}]`;
  if (v && typeof v === "object") {
    return `{${Object.keys(v)
      .sort()
      .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
      .map((k) => `${JSON.stringify(k)}:${stableJson((v as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  }
  return JSON.stringify(v);
}

type Change = { kit: KitHead; layout: Layout };

/** The kits whose layout the changed item would change, each with its new layout (validated: a misfit names the kit). */
async function changesOf(workspaceId: string, next: ShelfItem): Promise<Change[]> {
  const users_ = await kitsReferring(workspaceId, next);
  const materials = next.kind === "shaft" ? (await listShelf(workspaceId)).filter((i) => i.kind === "material") : [];
  const changes: Change[] = [];
  for (const kit of users_) {
    const parsed = parseLayout(readStoredLayout(kit.layout));
    if (!parsed.ok) continue; // a layout that cannot be read is left as it is
    const layout = applyShelfItem(parsed.layout, next, materials);
    if (stableJson(layout) === stableJson(parsed.layout)) continue;
    try {
      changes.push({ kit, layout: requireValidLayout(layout) });
    } catch (error) {
      if (error instanceof HttpError) throw new HttpError(422, error.code, `Kit “${kit.name}” would not work with this change: ${error.message}`, error.fields, { ...error.extra, kitId: kit.id });
      throw error;
    }
  }
  return changes;
}

export type ShelfPatch = { version: number; name?: string; spec?: unknown; kits?: { id: string; version: number }[] };

/**
 * Changes a shelf item and, in the same transaction, every kit it changes (a new revision each). When the
 * kits the caller confirmed (id and version) are not exactly the kits that would change, nothing is written:
 * 409 `confirm_kits` lists them, so the person is asked before any kit changes. A stale item version is 409.
 */
export async function updateShelfItem(workspaceId: string, id: string, userId: string, patch: ShelfPatch): Promise<{ item: ShelfItem; changedKits: ShelfKitUse[] }> {
  const item = await getShelfItem(workspaceId, id);
  let spec = item.spec;
  if (patch.spec !== undefined) {
    const parsed = SPEC_SCHEMAS[item.kind].safeParse(patch.spec);
    if (!parsed.success) {
      const fields = fieldIssues(parsed.error).map((f) => ({ ...f, path: f.path === "(body)" ? "spec" : `spec.${f.path}` }));
      throw new HttpError(422, "invalid", `Invalid body: ${fields[0]!.path}: ${fields[0]!.message}`, fields);
    }
    spec = parsed.data as ShelfSpec;
    await requireShaftMaterial(workspaceId, spec, item.kind);
  }
  const next: ShelfItem = { ...item, name: patch.name ?? item.name, spec };
  const changes = await changesOf(workspaceId, next);
  if (changes.length > SHELF_EDIT_KIT_LIMIT) {
    throw new HttpError(422, "too_many_kits", `This change would rewrite ${changes.length} kits; one shelf edit changes at most ${SHELF_EDIT_KIT_LIMIT}. Unlink some kits first, or add a new shelf item.`);
  }
  const wanted = changes.map((c) => `${c.kit.id}@${c.kit.version}`).sort();
  const confirmed = (patch.kits ?? []).map((k) => `${k.id}@${k.version}`).sort();
  if (wanted.join(",") !== confirmed.join(",")) {
    throw new HttpError(409, "confirm_kits", changes.length === 1
      ? "This change rewrites 1 kit. Confirm it by sending the kit in `kits`."
      : `This change rewrites ${changes.length} kits. Confirm them by sending them in \`kits\`.`, undefined, { kits: changes.map((c) => toUse(c.kit)) });
  }
  const summaries: StoredSummary[] = [];
  for (const c of changes) summaries.push(await summarizeLayout(c.layout));
  const note = `Shelf ${SHELF_KIND_LABELS[item.kind].one} “${next.name}” changed`;
  let updated: boolean;
  try {
    updated = await db.transaction(async (tx) => {
      const done = await tx
        .update(shelfItems)
        .set({ name: next.name, spec: next.spec, version: patch.version + 1, updatedBy: userId, updatedAt: new Date() })
        .where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, id), eq(shelfItems.version, patch.version)))
        .returning({ id: shelfItems.id });
      if (done.length === 0) return false;
      for (const [i, c] of changes.entries()) {
        const head = await writeHeadRevision(tx, { workspaceId, kitId: c.kit.id, userId, basedOn: c.kit.version }, c.layout, summaries[i]!, { kind: "shelf", note });
        if (head === null) throw new KitMoved(c.kit.name);
      }
      return true;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw nameTaken(item.kind, next.name);
    if (!(error instanceof KitMoved)) throw error;
    // A kit was saved between the confirmation and now: the whole change is rolled back, and asked again.
    throw new HttpError(409, "confirm_kits", `Kit “${error.kitName}” was saved while this change was being confirmed; nothing was changed. Confirm the kits again.`, undefined, {
      kits: (await changesOf(workspaceId, next)).map((c) => toUse(c.kit)),
    });
  }
  if (!updated) {
    const now = await getShelfItem(workspaceId, id);
    throw new HttpError(409, "stale_version", `This shelf item changed since version ${patch.version}; it is now at version ${now.version}. Reload and apply your change again.`, [
      { path: "version", message: `Stale: the current version is ${now.version}` },
    ], { currentVersion: now.version });
  }
  return { item: await getShelfItem(workspaceId, id), changedKits: changes.map((c) => ({ ...toUse(c.kit), version: c.kit.version + 1, headRevision: c.kit.headRevision + 1 })) };
}

/** Removes an item no kit and no shaft uses; otherwise 409 `in_use` naming them (kits keep their own figures either way). */
export async function deleteShelfItem(workspaceId: string, id: string): Promise<void> {
  const item = await getShelfItem(workspaceId, id);
  const using = await kitsReferring(workspaceId, item);
  const shafts = item.kind === "material"
    ? await db.select({ name: shelfItems.name }).from(shelfItems).where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.kind, "shaft"), sql`${shelfItems.spec}->>'materialId' = ${id}`))
    : [];
  if (using.length || shafts.length) {
    const who = [...using.map((k) => `kit “${k.name}”`), ...shafts.map((s) => `shaft “${s.name}”`)];
    throw new HttpError(409, "in_use", `This ${SHELF_KIND_LABELS[item.kind].one} is in use by ${who.slice(0, 5).join(", ")}${who.length > 5 ? ` and ${who.length - 5} more` : ""}. Unlink them first.`, undefined, { kits: using.map(toUse), shafts: shafts.map((s) => s.name) });
  }
  await db.delete(shelfItems).where(and(eq(shelfItems.workspaceId, workspaceId), eq(shelfItems.id, id)));
}

class KitMoved extends Error {
  constructor(readonly kitName: string) {
    super(`kit ${kitName} moved on`);
  }
}
