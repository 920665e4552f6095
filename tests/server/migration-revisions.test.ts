// Migration 0003 on a database that already has kits (made at 0002, when a kit row held its layout): each
// kit becomes revision 1 of itself, the layout moves to the revision, and scripts/migrate.ts's backfill
// gives it the engine's summary and the kit its library columns. Runs in a scratch database of its own.
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { analyzeLayout } from "@/engine";
import { backfillSummaries } from "../../scripts/lib/backfill-summaries";

const drizzleDir = fileURLToPath(new URL("../../drizzle", import.meta.url));
const name = `kb_migration_${Math.random().toString(36).slice(2, 10)}`;
let admin: Pool;
let pool: Pool;
let before0003: string;

beforeAll(async () => {
  admin = new Pool({ connectionString: process.env.DATABASE_URL, max: 1 });
  await admin.query(`create database ${name}`);
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${name}`;
  pool = new Pool({ connectionString: url.toString(), max: 1 });
  // The migrations as they stood before 0003: the same files, the journal cut after 0002.
  before0003 = mkdtempSync(join(tmpdir(), "kb-migrations-"));
  cpSync(drizzleDir, before0003, { recursive: true });
  const journal = JSON.parse(readFileSync(join(before0003, "meta/_journal.json"), "utf8")) as { entries: { idx: number }[] };
  journal.entries = journal.entries.filter((e) => e.idx < 3);
  writeFileSync(join(before0003, "meta/_journal.json"), JSON.stringify(journal));
});

afterAll(async () => {
  await pool?.end();
  await admin?.query(`drop database if exists ${name}`);
  await admin?.end();
  if (before0003) rmSync(before0003, { recursive: true, force: true });
});

describe("migration 0003 with kits already there", () => {
  it("makes each kit revision 1 of itself with its layout, and the backfill adds the engine's summary", async () => {
    await migrate(drizzle({ client: pool }), { migrationsFolder: before0003 });
    await pool.query("insert into users (id, name, email) values ('u-old', 'Older Hand', 'older@test.example')");
    await pool.query("insert into workspaces (id, name, slug) values ('w-old', 'Old bench', 'old-bench')");
    const { rows } = await pool.query<{ id: string }>(
      "insert into kits (workspace_id, name, scale, layout, created_by, updated_by, version) values ('w-old', 'Kept kit', '1:10', $1, 'u-old', 'u-old', 4) returning id",
      [JSON.stringify(TARNWICK_10_THIN_NECK)],
    );
    const kitId = rows[0]!.id;

    await migrate(drizzle({ client: pool }), { migrationsFolder: drizzleDir });
    const revs = await pool.query("select number, kind, layout, author_id, summary from kit_revisions where kit_id = $1", [kitId]);
    expect(revs.rows).toEqual([{ number: 1, kind: "migrated", layout: TARNWICK_10_THIN_NECK, author_id: "u-old", summary: null }]);
    const kit = await pool.query("select head_revision, version, shelf_refs from kits where id = $1", [kitId]);
    expect(kit.rows[0]).toEqual({ head_revision: 1, version: 4, shelf_refs: [] });
    const columns = await pool.query("select column_name from information_schema.columns where table_name = 'kits' and column_name = 'layout'");
    expect(columns.rowCount).toBe(0);

    expect(await backfillSummaries(pool)).toBe(1);
    const expected = analyzeLayout(TARNWICK_10_THIN_NECK);
    const after = await pool.query<{ summary: { ok: boolean; safetyFactor: number }; lock_deg: number; safety_factor: number }>(
      "select r.summary, k.lock_deg, k.safety_factor from kits k join kit_revisions r on r.kit_id = k.id and r.number = k.head_revision where k.id = $1",
      [kitId],
    );
    expect(after.rows[0]!.summary.ok).toBe(true);
    expect(after.rows[0]!.summary.safetyFactor).toBeCloseTo(expected.strength.safetyFactor, 9);
    expect(after.rows[0]!.lock_deg).toBeCloseTo(expected.steerLock.worst.innerDeg, 9);
    // A second run finds nothing left to do.
    expect(await backfillSummaries(pool)).toBe(0);
  });
});
