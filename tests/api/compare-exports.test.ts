// Exports of a pinned revision (`?revision=n` on every kit export) and the comparison's sheet (GET
// …/compare/sheet.pdf?items=A@1,A,B), through their routes against the real database. The sheets are read
// back with poppler's pdftotext (one page per form feed); files are left in .data/exports-test/.
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { parse as parseCsv } from "csv-parse/sync";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as compareSheetRoute from "@/app/api/workspaces/[workspaceId]/compare/sheet.pdf/route";
import * as exportRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/exports/[file]/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { TARNWICK_10_BASE, TARNWICK_10_CVD, TARNWICK_10_THIN_NECK } from "@/contracts/demo-layouts";
import { EXPORT_FILES } from "@/contracts/exports";
import type { Layout } from "@/contracts/layout";
import { answerAnalysisRequest } from "@/editor/readouts/analysis-protocol";
import { db } from "@/server/db/client";
import { kitRevisions } from "@/server/db/schema";
import { kitSlug } from "@/server/exports/kit-export";
import { call, download, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

type P = { workspaceId: string };
type E = { workspaceId: string; kitId: string; file: string };
type Who = { cookie: string } | null;

const OUT = path.join(process.cwd(), ".data", "exports-test");
const RENAMED = "Harrow 8 — pinned sheet test";
let owner: Awaited<ReturnType<typeof signUp>>;
let editor: Awaited<ReturnType<typeof signUp>>;
let viewer: Awaited<ReturnType<typeof signUp>>;
let outsider: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let wsName: string;
let outsiderWs: string;
/** Revision 1 (the owner's: the base layout), revision 2 (the editor's: the thin neck), then renamed by the owner. */
let kitA: string;
/** One revision: the CVD layout. */
let kitB: string;
/** A kit of the outsider's own workspace. */
let outsiderKit: string;

const kitExport = (file: string, query = "", who: Who = viewer, kitId = kitA, w = ws) =>
  download<E>(exportRoute.GET, `/api/workspaces/${w}/kits/${kitId}/exports/${file}${query}`, { workspaceId: w, kitId, file }, who?.cookie);
const compareSheet = (query: string, who: Who = viewer, w = ws) =>
  download<P>(compareSheetRoute.GET, `/api/workspaces/${w}/compare/sheet.pdf${query}`, { workspaceId: w }, who?.cookie);

/** The PDF's pages as poppler's pdftotext lays them out (columns kept on their lines). */
function pdfPages(bytes: Buffer, name: string): string[] {
  mkdirSync(OUT, { recursive: true });
  const file = path.join(OUT, `${name}.pdf`);
  writeFileSync(file, bytes);
  const text = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", file, "-"], { encoding: "utf8" });
  return text.split("\f").filter((p) => p.trim() !== "");
}

const pdfPageCount = (bytes: Buffer, name: string) => {
  const file = path.join(OUT, `${name}.pdf`);
  writeFileSync(file, bytes);
  return Number(/Pages:\s+(\d+)/.exec(execFileSync("pdfinfo", [file], { encoding: "utf8" }))![1]);
};

const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** The values under the title block's "Workspace · Author · Date" (the line starts with the cautions' heading). */
function titleBlockRow(page: string): string {
  const lines = page.split("\n");
  const at = lines.findIndex((l) => /Workspace\s+Author\s+Date\s*$/.test(l));
  expect(at, page.slice(-800)).toBeGreaterThanOrEqual(0);
  return lines[at + 1]!.replace(/\s+/g, " ").trim().replace(/^Cautions /, "");
}

const safetyFactor = (layout: Layout) => {
  const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "full", layout });
  if (!reply.ok) throw new Error(reply.fault.message);
  return reply.analysis.strength.safetyFactor.toFixed(2);
};

async function setRevisionDate(kitId: string, number: number, iso: string) {
  await db.update(kitRevisions).set({ createdAt: new Date(iso) }).where(and(eq(kitRevisions.kitId, kitId), eq(kitRevisions.number, number)));
}

beforeAll(async () => {
  for (const tool of ["pdftotext", "pdfinfo"]) {
    expect(() => execFileSync(tool, ["-v"], { stdio: "ignore" }), `${tool} (poppler-utils) is needed`).not.toThrow();
  }
  owner = await signUp("Oda Thornquist");
  editor = await signUp("Bram Ekwueme");
  viewer = await signUp("Lin Sarrazin");
  outsider = await signUp("Keld Amundsen");
  const mine = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0];
  ws = mine.id;
  wsName = mine.name;
  outsiderWs = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: outsider.cookie })).json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, editor, "editor");
  await addMemberByInvitation(owner, ws, viewer, "viewer");
  const create = async (who: { cookie: string }, w: string, name: string, layout: Layout) => {
    const res = await call<P>(kitsRoute.POST, "POST", `/api/workspaces/${w}/kits`, { workspaceId: w }, { cookie: who.cookie, body: { name, scale: "1:8", layout } });
    expect(res.status).toBe(201);
    return res.json.kit.id as string;
  };
  kitA = await create(owner, ws, "Harrow 8 — before the rename", TARNWICK_10_BASE);
  kitB = await create(owner, ws, "Harrow 8 — CVD", TARNWICK_10_CVD);
  outsiderKit = await create(outsider, outsiderWs, "Someone else's corner", TARNWICK_10_BASE);
  const saved = await call(layoutRoute.PUT, "PUT", `/api/workspaces/${ws}/kits/${kitA}/layout`, { workspaceId: ws, kitId: kitA }, { cookie: editor.cookie, body: { version: 1, layout: TARNWICK_10_THIN_NECK } });
  expect(saved.json.kit).toMatchObject({ version: 2, headRevision: 2 });
  // The owner renames it: the kit row's last editor is now the owner, but no revision is written.
  const renamed = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${kitA}`, { workspaceId: ws, kitId: kitA }, { cookie: owner.cookie, body: { version: 2, name: RENAMED } });
  expect(renamed.json.kit).toMatchObject({ version: 3, headRevision: 2 });
  // Dates apart, so each sheet's date tells which revision it names.
  await setRevisionDate(kitA, 1, "2026-03-14T10:00:00Z");
  await setRevisionDate(kitA, 2, "2026-06-02T09:00:00Z");
});

describe("?revision=n on the kit's exports", () => {
  it("a pinned sheet names that revision, its author and date, and shows its layout's figures", async () => {
    const res = await kitExport("sheet.pdf", "?revision=1&unit=mm");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="harrow-8-pinned-sheet-test-rev1-sheet.pdf"');
    const pages = pdfPages(res.bytes, "pinned-rev1");
    // The title block: the kit's name now, revision 1, the owner who wrote it, on the day it was written.
    expect(pages[0]).toMatch(new RegExp(`${esc(RENAMED)} +1 +1 of ${pages.length}`));
    expect(titleBlockRow(pages[0]!)).toBe(`${wsName} Oda Thornquist 14 Mar 2026`);
    // Revision 1 is the 5.0 mm neck: its safety factor, not the head's.
    expect(safetyFactor(TARNWICK_10_BASE)).not.toBe(safetyFactor(TARNWICK_10_THIN_NECK));
    expect(pages.join("\n")).toMatch(new RegExp(`Safety factor at the neck\\s+${safetyFactor(TARNWICK_10_BASE)}`));
    for (const page of pages.slice(1)) expect(page).toContain(`${RENAMED} · revision 1 · ${wsName}`);
  });

  it("the head's sheet names the head revision's author and date, not who renamed the kit", async () => {
    const res = await kitExport("sheet.pdf", "?unit=mm");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="harrow-8-pinned-sheet-test-rev2-sheet.pdf"');
    const pages = pdfPages(res.bytes, "pinned-head");
    expect(pages[0]).toMatch(new RegExp(`${esc(RENAMED)} +2 +1 of ${pages.length}`));
    expect(titleBlockRow(pages[0]!)).toBe(`${wsName} Bram Ekwueme 02 Jun 2026`);
    expect(pages.join("\n")).toMatch(new RegExp(`Safety factor at the neck\\s+${safetyFactor(TARNWICK_10_THIN_NECK)}`));
    // `?revision=2` is the same sheet as the head's.
    const pinned = await kitExport("sheet.pdf", "?unit=mm&revision=2");
    expect(titleBlockRow(pdfPages(pinned.bytes, "pinned-rev2")[0]!)).toBe(`${wsName} Bram Ekwueme 02 Jun 2026`);
  });

  it("every export takes it: the files are named after the revision and drawn from its layout", async () => {
    for (const file of EXPORT_FILES) {
      const res = await kitExport(file, "?revision=1");
      expect(res.status, file).toBe(200);
      expect(res.headers.get("content-disposition")).toBe(`attachment; filename="harrow-8-pinned-sheet-test-rev1-${file}"`);
    }
    // The envelope's neck clearance is the revision's own neck: 5.0 mm at revision 1, 4.0 mm at the head.
    // Neck-to-rim gap (D/2)cos β − a sin β − d/2 (the engine's neck contact, src/engine/drive/neck-contact.ts).
    for (const [query, layout] of [["?revision=1&unit=mm", TARNWICK_10_BASE], ["?unit=mm", TARNWICK_10_THIN_NECK]] as const) {
      const rows = parseCsv((await kitExport("envelope.csv", `${query}&travelSteps=3&steerSteps=5`)).text, { columns: true }) as Record<string, string>[];
      const d = layout.drive;
      const row = rows[4]!;
      const beta = (Number(row.left_joint_angle_deg) * Math.PI) / 180;
      expect(Number(row.left_neck_clearance_mm)).toBeCloseTo((d.cupMouthDiameterMm / 2) * Math.cos(beta) - d.pivotDepthMm * Math.sin(beta) - d.neckDiameterMm / 2, 3);
    }
    expect(TARNWICK_10_BASE.drive.neckDiameterMm).not.toBe(TARNWICK_10_THIN_NECK.drive.neckDiameterMm);
  });

  it("a revision the kit does not have is 404; a malformed one is 422 naming the parameter", async () => {
    for (const file of ["sheet.pdf", "views.dxf", "travel.csv"]) {
      const missing = await kitExport(file, "?revision=3");
      expect(missing.status, file).toBe(404);
      expect(missing.json.error.code).toBe("not_found");
      expect(missing.json.error.message).toMatch(/Revision/);
    }
    for (const bad of ["0", "-1", "1.5", "two", "01", "", "1e2", "99999999999"]) {
      const res = await kitExport("sheet.pdf", `?revision=${encodeURIComponent(bad)}`);
      expect(res.status, bad).toBe(422);
      expect(res.json.error.fields[0]).toEqual({ path: "revision", message: "revision must be a whole number from 1" });
    }
    const huge = await kitExport("front.svg", "?revision=9999999999");
    expect(huge.status).toBe(422);
    expect(huge.json.error.fields[0]).toEqual({ path: "revision", message: "revision must be at most 2147483647" });
    const twice = await kitExport("views.dxf", "?revision=1&revision=2");
    expect(twice.status).toBe(422);
    expect(twice.json.error.fields[0].path).toBe("revision");
  });

  it("the same role checks: anonymous 401, outsider 403, a kit of another workspace 404", async () => {
    expect((await kitExport("sheet.pdf", "?revision=1", null)).status).toBe(401);
    const stranger = await kitExport("sheet.pdf", "?revision=1", outsider);
    expect(stranger.status).toBe(403);
    expect(stranger.json.error.code).toBe("not_a_member");
    expect((await kitExport("sheet.pdf", "?revision=1", outsider, kitA, outsiderWs)).status).toBe(404);
  });
});

describe("the comparison's sheet", () => {
  it("one page set per item, in order, each naming its kit and revision in its title block and header", async () => {
    const items = `${kitA}@1,${kitA},${kitB}`;
    const res = await compareSheet(`?items=${items}&unit=mm`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="compare-harrow-8-pinned-sheet-test-rev1-harrow-8-pinned-sheet-test-rev2-harrow-8-cvd-rev1-sheet.pdf"');
    const pages = pdfPages(res.bytes, "compare-three");
    expect(pdfPageCount(res.bytes, "compare-three")).toBe(pages.length);
    const expected = [
      { kit: RENAMED, revision: 1, row: `${wsName} Oda Thornquist 14 Mar 2026`, sf: safetyFactor(TARNWICK_10_BASE) },
      { kit: RENAMED, revision: 2, row: `${wsName} Bram Ekwueme 02 Jun 2026`, sf: safetyFactor(TARNWICK_10_THIN_NECK) },
      { kit: "Harrow 8 — CVD", revision: 1, row: null, sf: safetyFactor(TARNWICK_10_CVD) },
    ];
    let at = 0;
    for (const item of expected) {
      const first = pages[at]!;
      // The page set's first page: the drawing with the title block naming the kit, the revision and "1 of N".
      expect(first).toContain("Dimension sheet");
      const title = new RegExp(`${esc(item.kit)} +${item.revision} +1 of (\\d+)`).exec(first);
      expect(title, `page ${at + 1}: ${item.kit} @${item.revision}`).not.toBeNull();
      const count = Number(title![1]);
      expect(count).toBeGreaterThanOrEqual(2);
      if (item.row) expect(titleBlockRow(first)).toBe(item.row);
      const set = pages.slice(at, at + count);
      expect(set).toHaveLength(count);
      set.slice(1).forEach((page, i) => {
        expect(page).toContain(`${item.kit} · revision ${item.revision} · ${wsName}`);
        expect(page).toContain(`Sheet ${i + 2} of ${count}`);
      });
      expect(set.join("\n")).toMatch(new RegExp(`Safety factor at the neck\\s+${item.sf}`));
      at += count;
    }
    expect(at).toBe(pages.length);
  });

  it("names the file after every item, each kit's name cut between words", () => {
    expect(kitSlug("Tarnwick 10 — 5.0 mm steel dogbone, long arms", 40)).toBe("tarnwick-10-5-0-mm-steel-dogbone-long");
    expect(kitSlug("Tarnwick 10 — 5.0 mm steel dogbone", 40)).toBe("tarnwick-10-5-0-mm-steel-dogbone");
    expect(kitSlug("Supercalifragilisticexpialidocious-corner", 10)).toBe("supercalif");
    expect(kitSlug("—", 40)).toBe("kit");
  });

  it("takes the kit sheet's paper, orientation and unit", async () => {
    const res = await compareSheet(`?items=${kitB},${kitA}@1&paper=letter&orientation=landscape&unit=in`);
    expect(res.status).toBe(200);
    const file = path.join(OUT, "compare-letter.pdf");
    mkdirSync(OUT, { recursive: true });
    writeFileSync(file, res.bytes);
    expect(execFileSync("pdfinfo", [file], { encoding: "utf8" })).toMatch(/Page size:\s+792 x 612 pts \(letter\)/);
    const pages = pdfPages(res.bytes, "compare-letter");
    const drawings = pages.filter((p) => p.includes("Dimension sheet"));
    expect(drawings).toHaveLength(2);
    for (const page of drawings) expect(page).toContain("inches, degrees");
    expect(drawings[0]).toMatch(/Harrow 8 — CVD +1 +1 of \d/);
    expect(pages.join("\n")).toContain("Inputs (lengths in inches)");
  });

  it("who may download it: anonymous 401, outsider 403, viewer 200; a kit of another workspace is 404", async () => {
    const items = `?items=${kitA},${kitB}`;
    expect((await compareSheet(items, null)).status).toBe(401);
    const stranger = await compareSheet(items, outsider);
    expect(stranger.status).toBe(403);
    expect(stranger.json.error.code).toBe("not_a_member");
    const asViewer = await compareSheet(items, viewer);
    expect(asViewer.status).toBe(200);
    expect(asViewer.bytes.subarray(0, 5).toString()).toBe("%PDF-");
    // Our kit named from the outsider's own workspace, or theirs named from ours: not found either way.
    const fromTheirs = await compareSheet(`?items=${outsiderKit},${kitA}`, outsider, outsiderWs);
    expect(fromTheirs.status).toBe(404);
    expect(fromTheirs.json.error.code).toBe("not_found");
    const intoOurs = await compareSheet(`?items=${kitA},${outsiderKit}`, owner);
    expect(intoOurs.status).toBe(404);
  });

  it("bad items are 422 naming the field; a revision that is not there is 404", async () => {
    const cases: [string, RegExp][] = [
      ["", /items must name 2 to 4 kits or revisions/],
      [`?items=${kitA}`, /name 2 to 4 kits or revisions, comma-separated \(got 1\)/],
      [`?items=${[kitA, kitB, `${kitA}@1`, `${kitA}@2`, `${kitB}@1`].join(",")}`, /\(got 5\)/],
      [`?items=${kitA},not-a-kit`, /“not-a-kit” is not a kit id/],
      [`?items=${kitA},${kitB}@0`, /the revision after @ must be a whole number from 1/],
      [`?items=${kitA},${kitA}`, /is named twice/],
    ];
    for (const [query, message] of cases) {
      const res = await compareSheet(query);
      expect(res.status, query).toBe(422);
      expect(res.json.error.fields[0].path).toBe("items");
      expect(res.json.error.fields[0].message).toMatch(message);
    }
    const paper = await compareSheet(`?items=${kitA},${kitB}&paper=a3`);
    expect(paper.status).toBe(422);
    expect(paper.json.error.fields[0]).toEqual({ path: "paper", message: "paper must be a4 or letter" });
    const unknown = await compareSheet(`?items=${kitA},${kitB}&revision=1`);
    expect(unknown.status).toBe(422);
    expect(unknown.json.error.fields[0]).toEqual({ path: "revision", message: "Not a parameter of this export" });
    const missing = await compareSheet(`?items=${kitA}@7,${kitB}`);
    expect(missing.status).toBe(404);
    expect(missing.json.error.message).toMatch(/Revision/);
    const noKit = await compareSheet(`?items=${kitA},00000000-0000-4000-8000-000000000000`);
    expect(noKit.status).toBe(404);
  });
});
