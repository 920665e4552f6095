// After the migrations: every revision without a cached summary (those the SQL migration made from kits
// saved before revisions were kept), or with one taken from an older shape of analysis, gets one from the
// engine, and each kit's library columns follow its head.
import type { Pool } from "pg";
import { parseLayout } from "../../src/contracts/layout";
import { failedSummary, summarizeAnalysis, SUMMARY_ANALYSIS_SCHEMA, type StoredSummary } from "../../src/contracts/revisions";
import { analyzeLayout, GeometryError } from "../../src/engine";

export function summaryOf(layout: unknown): StoredSummary {
  const parsed = parseLayout(layout);
  if (!parsed.ok) return failedSummary(`invalid layout: ${parsed.issues[0]?.path ?? ""} ${parsed.issues[0]?.message ?? ""}`.trim());
  try {
    return { ok: true, ...summarizeAnalysis(analyzeLayout(parsed.layout)) };
  } catch (error) {
    if (error instanceof GeometryError) return failedSummary(error.message);
    throw error;
  }
}

/** Fills the missing or outdated summaries in batches; answers how many revisions got one. */
export async function backfillSummaries(pool: Pool): Promise<number> {
  let done = 0;
  for (;;) {
    const { rows } = await pool.query<{ id: string; layout: unknown }>(
      "select id, layout from kit_revisions where summary is null or coalesce((summary->>'analysisSchema')::int, 1) < $1 order by created_at limit 200",
      [SUMMARY_ANALYSIS_SCHEMA],
    );
    if (rows.length === 0) break;
    for (const r of rows) {
      await pool.query("update kit_revisions set summary = $1 where id = $2", [JSON.stringify(summaryOf(r.layout)), r.id]);
      done += 1;
    }
  }
  if (done > 0) {
    await pool.query(`
      update kits k set
        lock_deg = (r.summary->>'lockDeg')::double precision,
        lock_limited_by = r.summary->>'lockLimitedBy',
        max_joint_angle_deg = (r.summary->>'maxJointAngleDeg')::double precision,
        ackermann_pct = (r.summary->>'ackermannPct')::double precision,
        safety_factor = (r.summary->>'safetyFactor')::double precision,
        neck_clearance_mm = (r.summary->>'neckClearanceMm')::double precision
      from kit_revisions r
      where r.kit_id = k.id and r.number = k.head_revision`);
  }
  return done;
}
