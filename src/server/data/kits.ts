import "server-only";
import { and, arrayContains, asc, eq, gte, ilike, inArray, isNotNull, isNull, lt, lte, or, sql, type SQL } from "drizzle-orm";
import { alias, type AnyPgColumn } from "drizzle-orm/pg-core";
import { kitIdParam, type KitCreateFields, type KitDetail, type KitSummary } from "@/contracts/kits";
import type { LibraryPage, LibraryQuery, LibrarySort } from "@/contracts/library";
import type { RevisionKind, StoredSummary } from "@/contracts/revisions";
import { effectiveTargetsProblem, READOUT_KEYS, type TargetOverrides, type Targets } from "@/contracts/targets";
import { db } from "../db/client";
import { kitRevisions, kits, users } from "../db/schema";
import { HttpError, notFound } from "../http/errors";
import { readoutColumns, summarizeLayout } from "./summaries";
import { getTargets } from "./targets";

// The same users table joined twice (who made the kit, who wrote its current version), and kits once more
// for the name of the kit a variant came from.
const editors = alias(users, "editors");
const origins = alias(kits, "origins");

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
  tags: kits.tags,
  headRevision: kits.headRevision,
  archivedAt: kits.archivedAt,
  originKitId: kits.originKitId,
  originKitName: origins.name,
  originRevision: kits.originRevision,
  targetOverrides: kits.targetOverrides,
  lockDeg: kits.lockDeg,
  lockLimitedBy: kits.lockLimitedBy,
  maxJointAngleDeg: kits.maxJointAngleDeg,
  ackermannPct: kits.ackermannPct,
  safetyFactor: kits.safetyFactor,
  neckClearanceMm: kits.neckClearanceMm,
};

type SummaryRow = Omit<KitSummary, "createdAt" | "updatedAt" | "archivedAt" | "readouts" | "targetOverrides" | "lockLimitedBy"> & {
  createdAt: Date;
  updatedAt: Date;
  archivedAt: Date | null;
  targetOverrides: Record<string, number>;
  lockDeg: number | null;
  lockLimitedBy: string | null;
  maxJointAngleDeg: number | null;
  ackermannPct: number | null;
  safetyFactor: number | null;
  neckClearanceMm: number | null;
};

function toSummary(r: SummaryRow): KitSummary {
  const { lockDeg, maxJointAngleDeg, ackermannPct, safetyFactor, neckClearanceMm, createdAt, updatedAt, archivedAt, ...rest } = r;
  return {
    ...rest,
    createdAt: createdAt.toISOString(),
    updatedAt: updatedAt.toISOString(),
    archivedAt: archivedAt ? archivedAt.toISOString() : null,
    readouts: { lockDeg, maxJointAngleDeg, ackermannPct, safetyFactor, neckClearanceMm },
  };
}

/** A kit id from the URL; a malformed one is simply a kit that is not there (404, never a database error). */
export function kitIdOrNotFound(raw: string): string {
  const parsed = kitIdParam.safeParse(raw);
  if (!parsed.success) throw notFound("Kit");
  return parsed.data;
}

// --- the library ------------------------------------------------------------------------------------

const SORT_COLUMNS: Record<LibrarySort, SQL | AnyPgColumn> = {
  name: sql`lower(${kits.name})`,
  scale: kits.scale,
  author: sql`(select ${users.name} from ${users} where ${users.id} = ${kits.createdBy})`,
  updatedAt: kits.updatedAt,
  createdAt: kits.createdAt,
  headRevision: kits.headRevision,
  lockDeg: kits.lockDeg,
  maxJointAngleDeg: kits.maxJointAngleDeg,
  ackermannPct: kits.ackermannPct,
  safetyFactor: kits.safetyFactor,
  neckClearanceMm: kits.neckClearanceMm,
};

const READOUT_COLUMNS = {
  lockDeg: kits.lockDeg,
  maxJointAngleDeg: kits.maxJointAngleDeg,
  ackermannPct: kits.ackermannPct,
  safetyFactor: kits.safetyFactor,
  neckClearanceMm: kits.neckClearanceMm,
};

/** A kit's own target where it overrides the workspace's, else the workspace's. */
const effective = (key: keyof Targets, ws: Targets) => sql`coalesce((${kits.targetOverrides}->>${key})::double precision, ${ws[key]})`;

/** True when some judged readout misses the kit's effective target (null where none can be judged). */
function missesSomeTarget(ws: Targets): SQL {
  return sql`(${kits.lockDeg} < ${effective("minLockDeg", ws)}
    or ${kits.maxJointAngleDeg} > ${effective("maxJointAngleDeg", ws)}
    or ${kits.safetyFactor} < ${effective("minSafetyFactor", ws)}
    or ${kits.neckClearanceMm} < ${effective("minNeckClearanceMm", ws)}
    or ${kits.ackermannPct} < ${effective("ackermannMinPct", ws)}
    or ${kits.ackermannPct} > ${effective("ackermannMaxPct", ws)})`;
}

const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

function endOfDay(value: string): Date {
  const d = new Date(value);
  // A bare date names the whole day: up to the start of the next one.
  return /^\d{4}-\d{2}-\d{2}$/.test(value) ? new Date(d.getTime() + 86_400_000) : d;
}

function libraryFilter(workspaceId: string, q: LibraryQuery, targets: Targets): SQL {
  const where: (SQL | undefined)[] = [eq(kits.workspaceId, workspaceId)];
  if (q.status === "active") where.push(isNull(kits.archivedAt));
  else if (q.status === "archived") where.push(isNotNull(kits.archivedAt));
  if (q.q) {
    const p = likePattern(q.q);
    where.push(
      or(
        ilike(kits.name, p),
        ilike(kits.scale, p),
        sql`exists (select 1 from unnest(${kits.tags}) as t(tag) where t.tag ilike ${p})`,
        sql`exists (select 1 from ${users} where ${users.id} = ${kits.createdBy} and ${users.name} ilike ${p})`,
      ),
    );
  }
  if (q.scale?.length) where.push(inArray(kits.scale, q.scale));
  if (q.tags?.length) where.push(arrayContains(kits.tags, q.tags));
  if (q.author) where.push(eq(kits.createdBy, q.author));
  if (q.updatedFrom) where.push(gte(kits.updatedAt, new Date(q.updatedFrom)));
  if (q.updatedTo) where.push(lt(kits.updatedAt, endOfDay(q.updatedTo)));
  if (q.limitedBy?.length) where.push(inArray(kits.lockLimitedBy, q.limitedBy));
  for (const k of READOUT_KEYS) {
    const min = q[`${k}Min`];
    const max = q[`${k}Max`];
    if (min !== undefined) where.push(gte(READOUT_COLUMNS[k], min));
    if (max !== undefined) where.push(lte(READOUT_COLUMNS[k], max));
  }
  if (q.verdict === "misses") where.push(sql`coalesce(${missesSomeTarget(targets)}, false)`);
  else if (q.verdict === "meets") where.push(sql`${kits.lockDeg} is not null and not coalesce(${missesSomeTarget(targets)}, false)`);
  return and(...where)!;
}

/**
 * One page of the workspace's kits, filtered and ordered on the server (missing figures sort last). The
 * page is picked from the kits table alone (narrow rows, the filter and the order), and only its 50 rows
 * are joined to their authors; the total is counted beside it.
 */
export async function queryLibrary(workspaceId: string, q: LibraryQuery): Promise<LibraryPage> {
  const { targets } = await getTargets(workspaceId);
  const where = libraryFilter(workspaceId, q, targets);
  const column = SORT_COLUMNS[q.sort];
  const order = q.dir === "asc" ? sql`${column} asc nulls last` : sql`${column} desc nulls last`;
  const page = db.select({ pageId: kits.id }).from(kits).where(where).orderBy(order, asc(kits.id)).limit(q.size).offset((q.page - 1) * q.size).as("page");
  const [rows, [counted]] = await Promise.all([
    db
      .select(summaryColumns)
      .from(page)
      .innerJoin(kits, eq(kits.id, page.pageId))
      .leftJoin(users, eq(users.id, kits.createdBy))
      .leftJoin(editors, eq(editors.id, kits.updatedBy))
      .leftJoin(origins, eq(origins.id, kits.originKitId))
      .orderBy(order, asc(kits.id)),
    db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(kits).where(where),
  ]);
  return { kits: rows.map(toSummary), total: counted?.n ?? 0, page: q.page, size: q.size, targets };
}

/** The tags and authors of the workspace's kits, with counts, for the library's filter choices. */
export async function libraryFacets(workspaceId: string) {
  const tags = await db.execute<{ tag: string; count: string }>(
    sql`select t.tag, count(*) as count from ${kits}, unnest(${kits.tags}) as t(tag) where ${kits.workspaceId} = ${workspaceId} group by t.tag order by t.tag limit 500`,
  );
  const authors = await db
    .select({ id: users.id, name: users.name, count: sql<number>`count(*)`.mapWith(Number) })
    .from(kits)
    .innerJoin(users, eq(users.id, kits.createdBy))
    .where(eq(kits.workspaceId, workspaceId))
    .groupBy(users.id, users.name)
    .orderBy(asc(users.name));
  return { tags: tags.rows.map((r) => ({ tag: r.tag, count: Number(r.count) })), authors };
}

// --- one kit ----------------------------------------------------------------------------------------

/** A kit of this workspace; a kit of another workspace is "not found", never "forbidden". */
export async function getKit(workspaceId: string, kitId: string): Promise<KitDetail> {
  const [row] = await db
    .select({ ...summaryColumns, workspaceId: kits.workspaceId, layout: kitRevisions.layout })
    .from(kits)
    .innerJoin(kitRevisions, and(eq(kitRevisions.kitId, kits.id), eq(kitRevisions.number, kits.headRevision)))
    .leftJoin(users, eq(users.id, kits.createdBy))
    .leftJoin(editors, eq(editors.id, kits.updatedBy))
    .leftJoin(origins, eq(origins.id, kits.originKitId))
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId)))
    .limit(1);
  if (!row) throw notFound("Kit");
  const { workspaceId: ws, layout, ...summary } = row;
  return { ...toSummary(summary), workspaceId: ws, layout };
}

/** The ids of the shelf items a layout takes figures from (its `shelf` field). */
export function shelfRefsOf(layout: unknown): string[] {
  const refs = (layout as { shelf?: Record<string, unknown> } | null)?.shelf;
  return refs && typeof refs === "object" ? Object.values(refs).filter((v): v is string => typeof v === "string") : [];
}

export type RevisionWrite = { note?: string; kind: RevisionKind; restoredFrom?: number | null };

/**
 * Creates a kit and its revision 1 in one transaction. `origin` marks a variant: the kit and revision it
 * was made from.
 */
export async function createKit(
  workspaceId: string,
  userId: string,
  fields: KitCreateFields,
  layout: unknown,
  write: RevisionWrite = { kind: "create" },
  origin?: { kitId: string; revision: number },
): Promise<KitDetail> {
  const summary = await summarizeLayout(layout);
  const id = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(kits)
      .values({
        workspaceId,
        name: fields.name,
        scale: fields.scale,
        notes: fields.notes ?? "",
        tags: fields.tags ?? [],
        shelfRefs: shelfRefsOf(layout),
        originKitId: origin?.kitId ?? null,
        originRevision: origin?.revision ?? null,
        ...readoutColumns(summary),
        createdBy: userId,
        updatedBy: userId,
      })
      .returning({ id: kits.id });
    await tx.insert(kitRevisions).values({ kitId: row!.id, number: 1, layout, summary, note: write.note ?? "", kind: write.kind, authorId: userId });
    return row!.id;
  });
  return getKit(workspaceId, id);
}

async function staleKit(workspaceId: string, kitId: string, basedOn: number): Promise<HttpError> {
  const current = await getKit(workspaceId, kitId); // 404 when it is not there at all
  const by = current.updatedByName ? ` by ${current.updatedByName}` : "";
  return new HttpError(409, "stale_version", `This kit changed since version ${basedOn}; it is now at version ${current.version}${by}. Reload and apply your edit again.`, [
    { path: "version", message: `Stale: the current version is ${current.version}` },
  ], { currentVersion: current.version, updatedByName: current.updatedByName, updatedAt: current.updatedAt });
}

export type KitPatch = Partial<{ name: string; scale: string; notes: string; tags: string[]; archived: boolean; targets: TargetOverrides }>;

/**
 * Writes `patch` only if the stored version still equals `basedOn`, bumping it; otherwise 409 with the
 * current version, so a second tab or collaborator never overwrites work it has not seen. The layout is
 * never written here: a new layout is a new revision (saveKitLayout).
 */
export async function updateKit(workspaceId: string, kitId: string, userId: string, basedOn: number, patch: KitPatch): Promise<KitDetail> {
  const { archived, targets, ...plain } = patch;
  if (targets) {
    const problem = effectiveTargetsProblem((await getTargets(workspaceId)).targets, targets);
    if (problem) throw new HttpError(422, "invalid", `Invalid body: ${problem.path}: ${problem.message}`, [problem]);
  }
  const updated = await db
    .update(kits)
    .set({
      ...plain,
      ...(targets ? { targetOverrides: targets } : {}),
      ...(archived === undefined ? {} : { archivedAt: archived ? sql`coalesce(${kits.archivedAt}, now())` : null }),
      version: basedOn + 1,
      updatedBy: userId,
      updatedAt: new Date(),
    })
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId), eq(kits.version, basedOn)))
    .returning({ id: kits.id });
  if (updated.length === 0) throw await staleKit(workspaceId, kitId, basedOn);
  return getKit(workspaceId, kitId);
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Inside a transaction: makes `layout` the kit's next (head) revision if the kit is still at `basedOn` (the update's
 * row lock orders concurrent writers; the loser finds the version moved). Returns the new revision's
 * number, or null when the version was stale (nothing written).
 */
export async function writeHeadRevision(
  tx: Tx,
  at: { workspaceId: string; kitId: string; userId: string; basedOn: number },
  layout: unknown,
  summary: StoredSummary,
  write: RevisionWrite,
): Promise<number | null> {
  const [row] = await tx
    .update(kits)
    .set({ version: at.basedOn + 1, headRevision: sql`${kits.headRevision} + 1`, shelfRefs: shelfRefsOf(layout), ...readoutColumns(summary), updatedBy: at.userId, updatedAt: new Date() })
    .where(and(eq(kits.workspaceId, at.workspaceId), eq(kits.id, at.kitId), eq(kits.version, at.basedOn)))
    .returning({ headRevision: kits.headRevision });
  if (!row) return null;
  await tx.insert(kitRevisions).values({
    kitId: at.kitId,
    number: row.headRevision,
    layout,
    summary,
    note: write.note ?? "",
    kind: write.kind,
    restoredFrom: write.restoredFrom ?? null,
    authorId: at.userId,
  });
  return row.headRevision;
}

/** Saves a layout as the kit's next revision (with its cached summary), or 409 when `basedOn` is stale. */
export async function saveKitLayout(workspaceId: string, kitId: string, userId: string, basedOn: number, layout: unknown, write: RevisionWrite): Promise<KitDetail> {
  const summary = await summarizeLayout(layout);
  const head = await db.transaction((tx) => writeHeadRevision(tx, { workspaceId, kitId, userId, basedOn }, layout, summary, write));
  if (head === null) throw await staleKit(workspaceId, kitId, basedOn);
  return getKit(workspaceId, kitId);
}

export async function deleteKit(workspaceId: string, kitId: string): Promise<void> {
  const deleted = await db
    .delete(kits)
    .where(and(eq(kits.workspaceId, workspaceId), eq(kits.id, kitId)))
    .returning({ id: kits.id });
  if (deleted.length === 0) throw notFound("Kit");
}

