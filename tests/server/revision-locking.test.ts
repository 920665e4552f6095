// The database, not the timing of requests, decides between two writers of one kit: while one transaction
// holds the kit's row, a second based on the same version waits, then finds the version moved and writes
// nothing. And the backfill gives revisions saved before summaries were kept the engine's figures.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { Pool } from "pg";
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_CVD, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { summarizeAnalysis, type StoredSummary } from "@/contracts/revisions";
import { analyzeLayout } from "@/engine";
import { db } from "@/server/db/client";
import { kitRevisions, kits, workspaces } from "@/server/db/schema";
import { createKit, getKit, writeHeadRevision } from "@/server/data/kits";
import { backfillSummaries } from "../../scripts/lib/backfill-summaries";
import { signUp } from "../helpers/api";

const summary = (layout: typeof TARNWICK_10_BASE): StoredSummary => ({ ok: true, ...summarizeAnalysis(analyzeLayout(layout)) });

async function scratchKit() {
  const user = await signUp("Lock Tester");
  const workspaceId = randomUUID();
  await db.insert(workspaces).values({ id: workspaceId, name: "Locking bench", slug: `locking-${workspaceId.slice(0, 8)}` });
  const kit = await createKit(workspaceId, user.userId, { name: "Latch 10", scale: "1:10" }, TARNWICK_10_BASE);
  return { workspaceId, userId: user.userId, kitId: kit.id };
}

describe("writeHeadRevision under a held row lock", () => {
  it("the second writer on the same version waits for the first, then writes nothing", async () => {
    const { workspaceId, kitId, userId } = await scratchKit();
    const at = { workspaceId, kitId, userId, basedOn: 1 };
    let releaseFirst!: () => void;
    const firstHolds = new Promise<void>((r) => (releaseFirst = r));
    let firstWrote!: () => void;
    const firstHasLock = new Promise<void>((r) => (firstWrote = r));
    const order: string[] = [];

    const first = db.transaction(async (tx) => {
      const n = await writeHeadRevision(tx, at, TARNWICK_10_THIN_NECK, summary(TARNWICK_10_THIN_NECK), { kind: "save", note: "first" });
      firstWrote();
      await firstHolds; // keep the row locked until the second writer is blocked on it
      order.push("first commits");
      return n;
    });
    await firstHasLock;
    const second = db.transaction(async (tx) => {
      const n = await writeHeadRevision(tx, at, TARNWICK_10_CVD, summary(TARNWICK_10_CVD), { kind: "save", note: "second" });
      order.push("second returns");
      return n;
    });
    await new Promise((r) => setTimeout(r, 150));
    expect(order).toEqual([]); // the second is waiting on the row lock
    releaseFirst();
    expect(await first).toBe(2);
    expect(await second).toBeNull();
    expect(order).toEqual(["first commits", "second returns"]);

    const revs = await db.select({ number: kitRevisions.number, note: kitRevisions.note }).from(kitRevisions).where(eq(kitRevisions.kitId, kitId));
    expect(revs.sort((a, b) => a.number - b.number)).toEqual([{ number: 1, note: "" }, { number: 2, note: "first" }]);
    const k = await getKit(workspaceId, kitId);
    expect(k).toMatchObject({ version: 2, headRevision: 2, layout: TARNWICK_10_THIN_NECK });
  });
});

describe("backfillSummaries (run by scripts/migrate.ts)", () => {
  it("computes the summary of a revision that has none and copies the head's readouts to the kit", async () => {
    const { kitId } = await scratchKit();
    await db.update(kitRevisions).set({ summary: null }).where(eq(kitRevisions.kitId, kitId));
    await db.update(kits).set({ lockDeg: null, safetyFactor: null, maxJointAngleDeg: null, ackermannPct: null, neckClearanceMm: null, lockLimitedBy: null }).where(eq(kits.id, kitId));
    const pool = new Pool({ connectionString: process.env.DATABASE_URL, max: 1 });
    try {
      expect(await backfillSummaries(pool)).toBeGreaterThanOrEqual(1);
    } finally {
      await pool.end();
    }
    const expected = analyzeLayout(TARNWICK_10_BASE);
    const [rev] = await db.select({ summary: kitRevisions.summary }).from(kitRevisions).where(eq(kitRevisions.kitId, kitId));
    expect(rev!.summary).toMatchObject({ ok: true, lockLimitedBy: expected.steerLock.worst.limitedBy });
    const [k] = await db.select({ lockDeg: kits.lockDeg, safetyFactor: kits.safetyFactor }).from(kits).where(eq(kits.id, kitId));
    expect(k!.lockDeg).toBeCloseTo(expected.steerLock.worst.innerDeg, 9);
    expect(k!.safetyFactor).toBeCloseTo(expected.strength.safetyFactor, 9);
  });
});
