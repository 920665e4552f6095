import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, desc, eq } from "drizzle-orm";
import type PgBoss from "pg-boss";
import {
  applyFigures,
  changesOf,
  compareCandidates,
  searchNote,
  SEARCH_SAMPLES_DEFAULT,
  searchQuestionSchema,
  type SearchCandidate,
  type SearchQuestion,
  type SearchView,
} from "@/contracts/design-search";
import { parseLayout, type Layout } from "@/contracts/layout";
import { db } from "../db/client";
import { designSearchBatches, designSearches, users } from "../db/schema";
import { getKit } from "../data/kits";
import { HttpError, notFound } from "../http/errors";
import { SEARCH_QUEUE, sendBatches } from "./search-queue";
import {
  buildAnswer,
  currentCandidate,
  REFINE_BUDGET,
  REFINE_STARTS,
  refineStarts,
  SAMPLE_BATCH,
  searchSpace,
  SearchSpaceError,
  type BatchResult,
  type SearchSpace,
} from "./search-space";

// Design searches in the database: starting one (its sample batches queued), reading them, cancelling, and
// what a worker calls when a batch is done — which moves the search on to its refinement and then its answer.

type SearchRow = typeof designSearches.$inferSelect;
type SamplePlan = { kind: "sample"; from: number; count: number };
type RefinePlan = { kind: "refine"; start: Record<string, number | string> };
export type BatchPlan = SamplePlan | RefinePlan;

const SEARCH_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function searchIdOrNotFound(raw: string): string {
  if (!SEARCH_ID.test(raw)) throw notFound("Search");
  return raw;
}

/** The space a stored search walks (its own copy of the layout, so later edits of the kit do not move it). */
export function spaceOf(row: Pick<SearchRow, "id" | "baseLayout" | "question">): SearchSpace {
  const parsed = parseLayout(row.baseLayout);
  if (!parsed.ok) throw new Error(`search ${row.id}: its stored layout no longer reads`);
  return searchSpace(parsed.layout, searchQuestionSchema.parse(row.question), row.id);
}

/** Starts a search of the kit's head layout: stores it with its sample batches and puts them on the queue. */
export async function startSearch(boss: PgBoss, workspaceId: string, kitId: string, userId: string, question: SearchQuestion): Promise<SearchView> {
  const kit = await getKit(workspaceId, kitId);
  const parsed = parseLayout(kit.layout);
  if (!parsed.ok) throw new HttpError(422, "invalid", "This kit's layout cannot be read, so it cannot be searched from; open it in the editor and save it first.");
  const id = randomUUID();
  let space: SearchSpace;
  try {
    space = searchSpace(parsed.layout, question, id);
  } catch (e) {
    if (e instanceof SearchSpaceError) throw new HttpError(422, "invalid", `Invalid body: ${e.path}: ${e.reason}`, [{ path: e.path, message: e.reason }]);
    throw e;
  }
  if (!currentCandidate(space)) throw new HttpError(422, "impossible_geometry", "This kit's current layout cannot be analysed, so there is nothing to search from.");
  const samples = question.samples ?? SEARCH_SAMPLES_DEFAULT;
  const batches: { index: number; plan: SamplePlan; jobId: string }[] = [];
  for (let from = 0, index = 0; from < samples; from += SAMPLE_BATCH, index++) {
    batches.push({ index, plan: { kind: "sample", from, count: Math.min(SAMPLE_BATCH, samples - from) }, jobId: randomUUID() });
  }
  const planned = samples + (space.numbers.length > 0 ? REFINE_STARTS * REFINE_BUDGET : 0);
  await db.transaction(async (tx) => {
    await tx.insert(designSearches).values({
      id,
      workspaceId,
      kitId,
      baseRevision: kit.headRevision,
      baseLayout: parsed.layout,
      question,
      planned,
      batchesTotal: batches.length,
      createdBy: userId,
    });
    await tx.insert(designSearchBatches).values(batches.map((b) => ({ searchId: id, index: b.index, phase: "sample", plan: b.plan, jobId: b.jobId })));
  });
  await sendBatches(boss, batches.map((b) => ({ searchId: id, index: b.index, jobId: b.jobId })));
  return getSearch(workspaceId, kitId, id);
}

const viewColumns = {
  row: designSearches,
  createdByName: users.name,
};

function toView(row: SearchRow, createdByName: string | null): SearchView {
  return {
    id: row.id,
    kitId: row.kitId,
    baseRevision: row.baseRevision,
    status: row.status as SearchView["status"],
    phase: row.phase as SearchView["phase"],
    question: row.question as SearchQuestion,
    tried: row.tried,
    planned: Math.max(row.planned, row.tried),
    best: (row.best as SearchCandidate | null) ?? null,
    answer: (row.answer as SearchView["answer"]) ?? null,
    error: row.error,
    createdByName,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

export async function getSearch(workspaceId: string, kitId: string, searchId: string): Promise<SearchView> {
  const [found] = await db
    .select(viewColumns)
    .from(designSearches)
    .leftJoin(users, eq(users.id, designSearches.createdBy))
    .where(and(eq(designSearches.workspaceId, workspaceId), eq(designSearches.kitId, kitId), eq(designSearches.id, searchId)))
    .limit(1);
  if (!found) throw notFound("Search");
  return toView(found.row, found.createdByName);
}

/** A kit's searches, newest first (the answers left out: the list only names them). */
export async function listSearches(workspaceId: string, kitId: string): Promise<SearchView[]> {
  await getKit(workspaceId, kitId); // 404 for a kit that is not there
  const rows = await db
    .select(viewColumns)
    .from(designSearches)
    .leftJoin(users, eq(users.id, designSearches.createdBy))
    .where(and(eq(designSearches.workspaceId, workspaceId), eq(designSearches.kitId, kitId)))
    .orderBy(desc(designSearches.createdAt))
    .limit(50);
  return rows.map((r) => ({ ...toView(r.row, r.createdByName), answer: null }));
}

/** Cancels a running search: the workers stop within their next few layouts, and its waiting batches leave the queue. */
export async function cancelSearch(boss: PgBoss, workspaceId: string, kitId: string, searchId: string): Promise<SearchView> {
  const current = await getSearch(workspaceId, kitId, searchId);
  if (current.status !== "running") throw new HttpError(409, "not_running", `This search is ${current.status}; only a running search can be cancelled.`);
  await db
    .update(designSearches)
    .set({ status: "cancelled", finishedAt: new Date(), updatedAt: new Date() })
    .where(and(eq(designSearches.id, searchId), eq(designSearches.status, "running")));
  const waiting = await db.select({ jobId: designSearchBatches.jobId }).from(designSearchBatches).where(and(eq(designSearchBatches.searchId, searchId), eq(designSearchBatches.status, "queued")));
  if (waiting.length > 0) await boss.cancel(SEARCH_QUEUE, waiting.map((w) => w.jobId)).catch(() => {});
  return getSearch(workspaceId, kitId, searchId);
}

/** Whether the search is still running (a worker asks between layouts). */
export async function searchIsRunning(searchId: string): Promise<boolean> {
  const [row] = await db.select({ status: designSearches.status }).from(designSearches).where(eq(designSearches.id, searchId)).limit(1);
  return row?.status === "running";
}

/** What a worker needs to run one batch, or null when there is nothing to do (done, cancelled, gone). */
export async function batchToRun(searchId: string, index: number): Promise<{ space: SearchSpace; plan: BatchPlan } | null> {
  const [row] = await db
    .select({ search: designSearches, batch: designSearchBatches })
    .from(designSearchBatches)
    .innerJoin(designSearches, eq(designSearches.id, designSearchBatches.searchId))
    .where(and(eq(designSearchBatches.searchId, searchId), eq(designSearchBatches.index, index)))
    .limit(1);
  if (!row || row.search.status !== "running" || row.batch.status === "done") return null;
  return { space: spaceOf(row.search), plan: row.batch.plan as BatchPlan };
}

/**
 * Records a finished batch (once: a retried batch finds it done) and moves the search on: the last sample
 * batch queues the refinement, the last refinement batch writes the answer. The search's row lock orders
 * workers finishing at the same moment.
 */
export async function recordBatch(boss: PgBoss, searchId: string, index: number, result: BatchResult): Promise<void> {
  const toSend = await db.transaction(async (tx) => {
    const [search] = await tx.select().from(designSearches).where(eq(designSearches.id, searchId)).for("update");
    if (!search) return [];
    const marked = await tx
      .update(designSearchBatches)
      .set({ status: "done", tried: result.tried, result: result.candidates, finishedAt: new Date() })
      .where(and(eq(designSearchBatches.searchId, searchId), eq(designSearchBatches.index, index), eq(designSearchBatches.status, "queued")))
      .returning({ index: designSearchBatches.index });
    if (marked.length === 0 || search.status !== "running") return [];
    const space = spaceOf(search);
    const prefer = space.question.prefer;
    let best = (search.best as SearchCandidate | null) ?? null;
    for (const c of result.candidates) if (!best || compareCandidates(c, best, prefer) < 0) best = c;
    const tried = search.tried + result.tried;
    const batchesDone = search.batchesDone + 1;
    const base = { tried, batchesDone, best, updatedAt: new Date() };
    if (batchesDone < search.batchesTotal) {
      await tx.update(designSearches).set(base).where(eq(designSearches.id, searchId));
      return [];
    }
    const all = await allCandidates(tx, searchId);
    const starts = search.phase === "sample" ? refineStarts(space, all) : [];
    if (starts.length > 0) {
      const batches = starts.map((start, i) => ({ searchId, index: search.batchesTotal + i, phase: "refine", plan: { kind: "refine", start } satisfies RefinePlan, jobId: randomUUID() }));
      await tx.insert(designSearchBatches).values(batches);
      await tx.update(designSearches).set({ ...base, phase: "refine", batchesTotal: search.batchesTotal + batches.length }).where(eq(designSearches.id, searchId));
      return batches;
    }
    const current = currentCandidate(space)!;
    const answer = buildAnswer(space, all, tried, current);
    await tx.update(designSearches).set({ ...base, phase: "finished", status: "done", answer, planned: tried, finishedAt: new Date() }).where(eq(designSearches.id, searchId));
    return [];
  });
  if (toSend.length > 0) await sendBatches(boss, toSend);
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

async function allCandidates(tx: Tx, searchId: string): Promise<SearchCandidate[]> {
  const rows = await tx.select({ result: designSearchBatches.result }).from(designSearchBatches).where(and(eq(designSearchBatches.searchId, searchId), eq(designSearchBatches.status, "done"))).orderBy(asc(designSearchBatches.index));
  return rows.flatMap((r) => (r.result as SearchCandidate[] | null) ?? []);
}

/** Marks a search failed (a batch that keeps failing: a bug, said once rather than retried for ever). */
export async function failSearch(searchId: string, message: string): Promise<void> {
  await db
    .update(designSearches)
    .set({ status: "failed", error: message.slice(0, 500), finishedAt: new Date(), updatedAt: new Date() })
    .where(and(eq(designSearches.id, searchId), eq(designSearches.status, "running")));
}

/**
 * Picks up running searches after a restart: every batch not yet done is on the queue again (a job lost
 * with a stopped process, or one pg-boss gave up on, gets a fresh one). A search is never left with every
 * batch done and no step taken: the last batch's record and the step are one transaction.
 */
export async function resumeSearches(boss: PgBoss): Promise<number> {
  const running = await db.select({ id: designSearches.id }).from(designSearches).where(eq(designSearches.status, "running"));
  for (const { id } of running) {
    const queued = await db.select().from(designSearchBatches).where(and(eq(designSearchBatches.searchId, id), eq(designSearchBatches.status, "queued")));
    const resend: { searchId: string; index: number; jobId: string }[] = [];
    for (const b of queued) {
      const job = await boss.getJobById(SEARCH_QUEUE, b.jobId).catch(() => null);
      if (job && (job.state === "created" || job.state === "retry" || job.state === "active")) continue;
      let jobId = b.jobId;
      if (job) {
        // Its job ended (failed for good, or cancelled) without the batch done: a new job for it.
        jobId = randomUUID();
        await db.update(designSearchBatches).set({ jobId }).where(and(eq(designSearchBatches.searchId, id), eq(designSearchBatches.index, b.index)));
      }
      resend.push({ searchId: id, index: b.index, jobId });
    }
    if (resend.length > 0) await sendBatches(boss, resend);
  }
  return running.length;
}

/**
 * Layout `rank` (1-based) of a finished search's best, as the editor opens it: the searched-from layout
 * with the candidate's figures, and the note a save of it carries.
 */
export async function searchResultLayout(workspaceId: string, kitId: string, searchId: string, rank: number): Promise<{ layout: Layout; note: string; search: SearchView }> {
  const search = await getSearch(workspaceId, kitId, searchId);
  const candidate = search.answer?.best[rank - 1];
  if (!candidate) throw notFound("That layout of the search");
  const [row] = await db.select({ baseLayout: designSearches.baseLayout }).from(designSearches).where(eq(designSearches.id, searchId)).limit(1);
  const parsed = parseLayout(row?.baseLayout);
  if (!parsed.ok) throw notFound("That layout of the search");
  const layout = applyFigures(parsed.layout, candidate.values);
  return { layout, note: searchNote(searchId, rank, changesOf(search.answer!.current.values, candidate.values)), search };
}
