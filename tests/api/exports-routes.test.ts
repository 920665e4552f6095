// The kit exports through their route, against the real database: the dimension sheet read back with
// poppler's pdftotext (page 1 also rendered with pdftoppm, left in .data/exports-test/), the DXF parsed with
// dxf-parser, the CSVs with csv-parse, the SVGs with @xmldom/xmldom; who may export, and what is refused.
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { parse as parseCsv } from "csv-parse/sync";
import DxfParser from "dxf-parser";
import { DOMParser, type Document as XmlDocument, type Element as XmlElement } from "@xmldom/xmldom";
import { beforeAll, describe, expect, it } from "vitest";
import * as exportRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/exports/[file]/route";
import * as kitsRoute from "@/app/api/workspaces/[workspaceId]/kits/route";
import * as layoutRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/layout/route";
import * as kitRoute from "@/app/api/workspaces/[workspaceId]/kits/[kitId]/route";
import * as workspacesRoute from "@/app/api/workspaces/route";
import { DEMO_LAYOUTS, TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { answerAnalysisRequest } from "@/editor/readouts/analysis-protocol";
import type { AnalysisResult } from "@/engine";
import { CAUTIONS } from "@/figures/cautions";
import type { LengthUnit } from "@/figures/length-unit";
import { readoutGroups } from "@/figures/readout-figures";
import { call, download, signUp } from "../helpers/api";
import { addMemberByInvitation } from "../helpers/invitations";

type P = { workspaceId: string };
type E = { workspaceId: string; kitId: string; file: string };

const OUT = path.join(process.cwd(), ".data", "exports-test");
let owner: Awaited<ReturnType<typeof signUp>>;
let viewer: Awaited<ReturnType<typeof signUp>>;
let outsider: Awaited<ReturnType<typeof signUp>>;
let ws: string;
let outsiderWs: string;
/** Demo kit ids by demo key; the base kit is saved once more, so it is at version 2. */
const kits = new Map<string, string>();

const exportPath = (w: string, k: string, file: string, query = "") => `/api/workspaces/${w}/kits/${k}/exports/${file}${query}`;
const get = (file: string, query = "", who: { cookie: string } | null = viewer, kitId = kits.get("tarnwick-10-base")!, w = ws) =>
  download<E>(exportRoute.GET, exportPath(w, kitId, file, query), { workspaceId: w, kitId, file }, who?.cookie);

/** The figures the editor's readouts show for a layout: its worker's full analysis, worded by readoutGroups. */
function editorAnalysis(layout: unknown): AnalysisResult {
  const reply = answerAnalysisRequest({ type: "analyze", id: 1, quality: "full", layout });
  if (!reply.ok) throw new Error(reply.fault.message);
  return reply.analysis;
}

/** The PDF's text as poppler's pdftotext lays it out (columns kept on their lines). */
function pdfText(bytes: Buffer, name: string): string {
  mkdirSync(OUT, { recursive: true });
  const file = path.join(OUT, `${name}.pdf`);
  writeFileSync(file, bytes);
  return execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", file, "-"], { encoding: "utf8" });
}

const squash = (s: string) => s.replace(/\s+/g, " ");

beforeAll(async () => {
  for (const tool of ["pdftotext", "pdftoppm"]) {
    // scripts/test.sh installs Debian's poppler-utils when it is missing.
    expect(() => execFileSync(tool, ["-v"], { stdio: "ignore" }), `${tool} (poppler-utils) is needed`).not.toThrow();
  }
  owner = await signUp("Isa Moorcroft");
  viewer = await signUp("Piet Lowell");
  outsider = await signUp("Runa Hale");
  ws = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: owner.cookie })).json.workspaces[0].id;
  outsiderWs = (await call(workspacesRoute.GET, "GET", "/api/workspaces", {}, { cookie: outsider.cookie })).json.workspaces[0].id;
  await addMemberByInvitation(owner, ws, viewer, "viewer");
  for (const d of DEMO_LAYOUTS) {
    const created = await call<P>(kitsRoute.POST, "POST", `/api/workspaces/${ws}/kits`, { workspaceId: ws }, { cookie: owner.cookie, body: { name: d.name, scale: "1:10", layout: d.layout } });
    expect(created.status).toBe(201);
    kits.set(d.key, created.json.kit.id);
  }
  const base = kits.get("tarnwick-10-base")!;
  const saved = await call(layoutRoute.PUT, "PUT", `/api/workspaces/${ws}/kits/${base}/layout`, { workspaceId: ws, kitId: base }, { cookie: owner.cookie, body: { version: 1, layout: TARNWICK_10_BASE } });
  expect(saved.json.kit.version).toBe(2);
  // A rename bumps the kit's version but writes no revision: the sheet names revision 2, not version 3.
  const renamed = await call(kitRoute.PATCH, "PATCH", `/api/workspaces/${ws}/kits/${base}`, { workspaceId: ws, kitId: base }, { cookie: owner.cookie, body: { version: 2, name: "Tarnwick 10 — 5.0 mm steel dogbone" } });
  expect(renamed.json.kit).toMatchObject({ version: 3, headRevision: 2 });
});

describe("the dimension sheet (PDF)", () => {
  it("names the kit, its revision, steer lock with its unit and limit, the safety factor, a source and the cautions", async () => {
    const res = await get("sheet.pdf");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="tarnwick-10-5-0-mm-steel-dogbone-rev2-sheet.pdf"');
    expect(res.bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const text = pdfText(res.bytes, "sheet-base");
    const a = editorAnalysis(TARNWICK_10_BASE);
    expect(text).toContain("Tarnwick 10 — 5.0 mm steel dogbone");
    // The title block: "Kit … Revision … Sheet" over the kit's name, its head revision (2) and "1 of N".
    expect(text).toMatch(/Kit\s+Revision\s+Sheet\s*\n/);
    expect(text).toMatch(/Tarnwick 10 — 5\.0 mm steel dogbone +2 +1 of \d/);
    // Steer lock, its unit and what limits it (the demo baseline binds at the neck: README, "The analysis").
    expect(text).toMatch(new RegExp(`Lock, worst over travel\\s+${a.steerLock.worst.innerDeg.toFixed(1)}°`));
    expect(a.steerLock.worst.limitedBy).toBe("neck-contact");
    expect(text).toMatch(/What binds\s+shaft neck meets the cup mouth/);
    expect(text).toMatch(new RegExp(`Safety factor at the neck\\s+${a.strength.safetyFactor.toFixed(2)}`));
    expect(text).toContain("Sources of the formulas");
    expect(text).toMatch(/Scrub radius\s+Barton & Fieldhouse §3\.1\.5\.3 \[F\]/);
    // Our own sheet of formulas is not a source the product cites.
    expect(text).not.toMatch(/REFERENCES|DESIGN\.md/);
    const flat = squash(text);
    for (const caution of CAUTIONS) expect(flat).toContain(caution);
    // The title block: workspace, author, units and the scales the views were drawn to.
    expect(text).toContain("Isa Moorcroft");
    expect(text).toMatch(/mm, degrees/);
    expect(text).toMatch(/front \d+:\d+ · top \d+:\d+ · joint \d+:\d+/);
  });

  it("renders page 1 to a PNG (pdftoppm), left in .data/exports-test/ to look at", async () => {
    const res = await get("sheet.pdf", "?paper=letter&orientation=landscape");
    expect(res.status).toBe(200);
    mkdirSync(OUT, { recursive: true });
    const pdf = path.join(OUT, "sheet-letter-landscape.pdf");
    writeFileSync(pdf, res.bytes);
    execFileSync("pdftoppm", ["-png", "-r", "100", "-f", "1", "-l", "1", "-singlefile", pdf, path.join(OUT, "sheet-page-1")]);
    const png = path.join(OUT, "sheet-page-1.png");
    expect(existsSync(png)).toBe(true);
    expect(statSync(png).size).toBeGreaterThan(20_000);
    // US Letter landscape (11 × 8.5 in) at 100 dpi.
    const info = execFileSync("pdfinfo", [pdf], { encoding: "utf8" });
    expect(info).toMatch(/Page size:\s+792 x 612 pts \(letter\)/);
  });

  it.each(DEMO_LAYOUTS.map((d) => [d.key, d] as const))("every figure on the sheet of %s equals the editor's readout as shown", async (key, demo) => {
    const res = await get("sheet.pdf", "?unit=mm", viewer, kits.get(key));
    expect(res.status).toBe(200);
    const text = pdfText(res.bytes, `sheet-${key}`);
    const a = editorAnalysis(demo.layout);
    const readouts = readoutGroups(a, "mm").flatMap((g) => g.readouts);
    expect(readouts.length).toBeGreaterThan(10);
    const lines = text.split("\n");
    for (const r of readouts) {
      // The figures table sets each readout's label and value on one line, as the readouts panel shows them.
      const row = lines.find((l) => l.trimStart().startsWith(r.label) && l.includes(r.value));
      expect(row, `${r.label} = ${r.value}`).toBeDefined();
    }
    // The drawing's own figures are the readouts' too (roll centre, scrub, trail, the least neck gap).
    const value = (id: string) => readouts.find((r) => r.id === id)!.value;
    const flat = squash(text);
    expect(flat).toContain(`RC ${value("roll-centre")}`);
    expect(flat).toContain(`scrub ${value("scrub")}`);
    expect(flat).toContain(`trail ${value("trail")}`);
    if (!demo.layout.drive.slottedCup) expect(flat).toContain(`gap ${value("neck-clearance")}`);
  });

  it("shows lengths in inches when asked, with the readouts' inch figures", async () => {
    const res = await get("sheet.pdf", "?unit=in&orientation=landscape");
    const text = pdfText(res.bytes, "sheet-inches");
    const readouts = readoutGroups(editorAnalysis(TARNWICK_10_BASE), "in" satisfies LengthUnit).flatMap((g) => g.readouts);
    for (const id of ["neck-clearance", "roll-centre", "scrub", "trail", "camber-gain"]) {
      const r = readouts.find((x) => x.id === id)!;
      expect(r.value).toMatch(/in/);
      expect(text.split("\n").some((l) => l.trimStart().startsWith(r.label) && l.includes(r.value)), `${r.label} = ${r.value}`).toBe(true);
    }
    expect(text).toContain("Inputs (lengths in inches)");
    expect(text).toMatch(/Lower arm chassis pivot y\s+1\.1811 in/);
  });
});

describe("the views for CAD (DXF)", () => {
  it("has a layer per kind of part and the lower arm from pivot to pivot at 1:1 in mm", async () => {
    const res = await get("views.dxf");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/dxf");
    const dxf = new DxfParser().parseSync(res.text)!;
    expect(dxf.header.$INSUNITS).toBe(4); // millimetres (DXF header group code 70 of $INSUNITS)
    const layers = Object.keys(dxf.tables.layer.layers);
    for (const l of ["ARMS", "KNUCKLE", "WHEEL", "SHAFT_JOINT", "STEERING", "CONSTRUCTION", "DIMENSIONS"]) expect(layers).toContain(l);
    const f = TARNWICK_10_BASE.frontView;
    type Line = { type: string; layer: string; vertices: { x: number; y: number }[] };
    const near = (v: { x: number; y: number }, p: { y: number; z: number }) => Math.abs(v.x - p.y) < 0.001 && Math.abs(v.y - p.z) < 0.001;
    const arms = (dxf.entities as unknown as Line[]).filter((e) => e.type === "LINE" && e.layer === "ARMS");
    const lower = arms.find((e) => near(e.vertices[0]!, f.lowerInner) && near(e.vertices[1]!, f.lowerOuter));
    expect(lower, JSON.stringify(arms.map((e) => e.vertices))).toBeDefined();
    expect(arms.some((e) => near(e.vertices[0]!, f.upperInner) && near(e.vertices[1]!, f.upperOuter))).toBe(true);
    // Every kind of part has something on its layer.
    const used = new Set((dxf.entities as unknown as Line[]).map((e) => e.layer));
    for (const l of ["KNUCKLE", "WHEEL", "SHAFT_JOINT", "STEERING", "CONSTRUCTION", "DIMENSIONS"]) expect(used).toContain(l);
  });
});

describe("the sweeps (CSV)", () => {
  it("envelope: a header naming units and one row per steer × travel point", async () => {
    const res = await get("envelope.csv", "?travelSteps=9&steerSteps=13&unit=mm");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const rows = parseCsv(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual([
      "travel_mm", "rack_mm", "left_road_wheel_deg", "right_road_wheel_deg", "left_joint_angle_deg", "right_joint_angle_deg", "left_neck_clearance_mm", "right_neck_clearance_mm",
    ]);
    expect(rows).toHaveLength(9 * 13);
    // Full droop first, full bump last; the rack from one end of its travel to the other.
    expect(Number(rows[0]!.travel_mm)).toBe(-TARNWICK_10_BASE.frontView.droopTravelMm);
    expect(Number(rows.at(-1)!.travel_mm)).toBe(TARNWICK_10_BASE.frontView.bumpTravelMm);
    expect(Number(rows[0]!.rack_mm)).toBe(-TARNWICK_10_BASE.topView.steeringInput.travelMm);
    // The right wheel mirrors the left at the opposite rack; the clearance follows the joint angle.
    const row = rows[4 * 13 + 2]!;
    const mirror = rows[4 * 13 + 10]!;
    expect(Number(row.right_road_wheel_deg)).toBeCloseTo(-Number(mirror.left_road_wheel_deg), 4);
    expect(Number(row.right_joint_angle_deg)).toBeCloseTo(Number(mirror.left_joint_angle_deg), 4);
    const d = TARNWICK_10_BASE.drive;
    const beta = (Number(row.left_joint_angle_deg) * Math.PI) / 180;
    // Neck-to-rim gap (D/2)cos β − a sin β − d/2 (the engine's neck contact, src/engine/drive/neck-contact.ts).
    expect(Number(row.left_neck_clearance_mm)).toBeCloseTo((d.cupMouthDiameterMm / 2) * Math.cos(beta) - d.pivotDepthMm * Math.sin(beta) - d.neckDiameterMm / 2, 3);
  });

  it("envelope at 121 × 121 (the finest grid), and a grid beyond it refused naming the parameter", async () => {
    const res = await get("envelope.csv", "?travelSteps=121&steerSteps=121");
    expect(res.status).toBe(200);
    expect(parseCsv(res.text, { columns: true })).toHaveLength(121 * 121);
    const big = await get("envelope.csv", "?travelSteps=122");
    expect(big.status).toBe(422);
    expect(big.json.error.fields[0]).toEqual({ path: "travelSteps", message: "travelSteps must be at most 121" });
    const word = await get("envelope.csv", "?steerSteps=many");
    expect(word.status).toBe(422);
    expect(word.json.error.fields[0].path).toBe("steerSteps");
  });

  it("travel sweep: camber, track change, roll centre height and plunge per travel step, in the unit asked", async () => {
    const res = await get("travel.csv", "?travelSteps=7&unit=in");
    const rows = parseCsv(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual([
      "travel_in", "camber_deg", "camber_gain_deg_per_in", "track_change_in", "roll_centre_height_in", "plunge_in", "joint_angle_deg", "bump_steer_deg", "kingpin_inclination_deg", "scrub_radius_in",
    ]);
    expect(rows).toHaveLength(7);
    expect(Number(rows[0]!.travel_in)).toBeCloseTo(-TARNWICK_10_BASE.frontView.droopTravelMm / 25.4, 5);
  });
});

describe("the views (SVG)", () => {
  const svgOf = (text: string) => new DOMParser().parseFromString(text, "image/svg+xml");
  /** Every element of the document, in order. */
  const elements = (doc: XmlDocument): XmlElement[] => [...doc.getElementsByTagName("*")];
  const part = (doc: XmlDocument, name: string) => elements(doc).find((e) => e.getAttribute("data-part") === name);

  it("front view: the arms, knuckle, tyre, shaft and construction, the lower arm drawn to its length", async () => {
    const res = await get("front.svg");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/svg+xml; charset=utf-8");
    const doc = svgOf(res.text);
    const svg = doc.documentElement!;
    expect(svg.tagName).toBe("svg");
    expect(svg.namespaceURI).toBe("http://www.w3.org/2000/svg");
    expect(svg.getAttribute("viewBox")).toBe("0 0 800 560");
    for (const name of ["lower-arm", "upper-arm", "knuckle", "tyre", "shaft", "kingpin-axis", "instant-centre", "roll-centre", "lower-arm-length", "scrub-radius"]) {
      expect(part(doc, name), name).toBeDefined();
    }
    const lower = part(doc, "lower-arm")!;
    expect(lower.tagName).toBe("polyline");
    expect(lower.getAttribute("class")).toBe("arms");
    const [p, q] = lower.getAttribute("points")!.split(" ").map((xy: string) => xy.split(",").map(Number));
    const pxPerMm = Number(svg.getAttribute("data-px-per-mm"));
    const f = TARNWICK_10_BASE.frontView;
    const lengthMm = Math.hypot(f.lowerOuter.y - f.lowerInner.y, f.lowerOuter.z - f.lowerInner.z);
    expect(Math.hypot(q![0]! - p![0]!, q![1]! - p![1]!) / pxPerMm).toBeCloseTo(lengthMm, 1);
    const texts = [...doc.getElementsByTagName("text")].map((t) => t.textContent);
    expect(texts).toContain("80.0 mm");
    expect(texts.some((t) => t?.startsWith("RC "))).toBe(true);
  });

  it("top view and joint section have their parts", async () => {
    const top = svgOf((await get("top.svg")).text);
    for (const name of ["left-tyre", "right-tyre", "left-steering-arm", "left-tie-rod", "rack", "caster-trail", "steering-arm-length"]) {
      expect(part(top, name), name).toBeDefined();
    }
    const joint = svgOf((await get("joint.svg", "?unit=in")).text);
    for (const name of ["cup-wall-1", "neck", "joint-pivot", "gap-label", "cup-mouth", "pivot-depth"]) {
      expect(part(joint, name), name).toBeDefined();
    }
    expect(part(joint, "gap-label")!.textContent).toMatch(/^gap -?\d\.\d{4} in$/);
  });
});

describe("who may export", () => {
  it("needs a session", async () => {
    const res = await get("sheet.pdf", "", null);
    expect(res.status).toBe(401);
  });

  it("refuses someone outside the workspace, and a kit of another workspace is not found", async () => {
    const stranger = await get("views.dxf", "", outsider);
    expect(stranger.status).toBe(403);
    expect(stranger.json.error.code).toBe("not_a_member");
    const elsewhere = await get("sheet.pdf", "", outsider, kits.get("tarnwick-10-base"), outsiderWs);
    expect(elsewhere.status).toBe(404);
    expect(elsewhere.json.error.code).toBe("not_found");
  });

  it("answers 404 for a file that is not an export and 422 naming a bad or unknown parameter", async () => {
    expect((await get("sheet.docx")).status).toBe(404);
    const paper = await get("sheet.pdf", "?paper=a3");
    expect(paper.status).toBe(422);
    expect(paper.json.error.fields[0]).toEqual({ path: "paper", message: "paper must be a4 or letter" });
    const unknown = await get("front.svg", "?colour=red");
    expect(unknown.status).toBe(422);
    expect(unknown.json.error.fields[0].path).toBe("colour");
    const twice = await get("front.svg", "?unit=mm&unit=in");
    expect(twice.status).toBe(422);
  });
});
