// Every route handler under src/app/api, found by walking the folder (a route added later is fuzzed without
// editing this file), called in-process with odd path ids, query strings, bodies, media types, headers and
// callers (owner, viewer, outsider, anonymous, a forged cookie), against the real database, object store and
// mail catcher: never a 5xx, and no "Unhandled error" line in the server's log. fast-check prints the shrunk
// case of a failure. Real ids of every kind are made in beforeAll through the routes themselves.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { and, eq, ne, sql } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import schema1Documents from "../contracts/fixtures/schema-1-documents.json";
import { EXPORT_FILES } from "@/contracts/exports";
import { LIBRARY_SORTS, LOCK_LIMITS } from "@/contracts/library";
import { applyShelfItem } from "@/contracts/shelf";
import { DEFAULT_TARGETS, READOUT_KEYS } from "@/contracts/targets";
import { UNDERLAY_VIEWS } from "@/contracts/underlays";
import { db } from "@/server/db/client";
import { designSearches, kitUnderlays, kits, shelfItems, testRuns, workspaceSettings } from "@/server/db/schema";
import { searchBoss, stopSearchBoss } from "@/server/search/search-queue";
import { cancelSearch } from "@/server/search/searches";
import { BASE, fromAddress, randomClientIp, signUp, uniqueEmail } from "../helpers/api";
import { addMemberByInvitation, invite } from "../helpers/invitations";
import { linkIn, waitForMail } from "../helpers/mail";
import { jpegBytes, PDF_BYTES, pngBytes } from "../helpers/object-store";

// ---------------------------------------------------------------------------------------------------------
// The routes: every route.ts under src/app/api but better-auth's catch-all, and each method it exports.

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];
type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
/** `upload`: the handler takes a file's raw bytes (it is made with one of the route helpers for uploads). */
type FoundHandler = { key: string; method: Method; route: string; segments: string[]; upload: boolean; handler: Handler };

const API_DIR = path.join(process.cwd(), "src", "app", "api");

function routeFiles(dir: string): string[] {
  return readdirSync(dir).sort().flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name.startsWith("[...") || name.startsWith("[[...") ? [] : routeFiles(full);
    return name === "route.ts" ? [full] : [];
  });
}

async function discoverHandlers(): Promise<FoundHandler[]> {
  const found: FoundHandler[] = [];
  for (const file of routeFiles(API_DIR)) {
    const rel = path.relative(API_DIR, path.dirname(file)).split(path.sep).join("/");
    const route = `/api/${rel}`.replace(/\/$/, "");
    const segments = [...route.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1]!);
    const mod = (await import(/* @vite-ignore */ file)) as Record<string, unknown>;
    const source = readFileSync(file, "utf8");
    for (const method of METHODS) {
      const handler = mod[method];
      const upload = new RegExp(`export const ${method} = \\w*Upload\\w*[<(]`).test(source);
      if (typeof handler === "function") found.push({ key: `${method} ${route}`, method, route, segments, upload, handler: handler as Handler });
    }
  }
  // Deletes last, the deepest first (a photo before its run, a run before its kit), so a real id deleted
  // early does not leave the routes after it nothing real to work on.
  const depth = (h: FoundHandler) => h.route.split("/").length;
  return [...found.filter((h) => h.method !== "DELETE"), ...found.filter((h) => h.method === "DELETE").sort((a, b) => depth(b) - depth(a))];
}

const HANDLERS = await discoverHandlers();
// KB_FUZZ_ONLY=analyze fuzzes only the handlers whose "METHOD /api/…" matches (a longer hunt on a few).
const ONLY = process.env.KB_FUZZ_ONLY ? new RegExp(process.env.KB_FUZZ_ONLY) : null;
const FUZZED = HANDLERS.filter((h) => !ONLY || ONLY.test(h.key));

// Cases per handler: heavy work (a PDF, an analysis, a queued search) gets fewer.
const DEFAULT_RUNS = 120;
const RUNS: Record<string, number> = {
  // The library's query has 29 parameters: more cases to try them.
  "GET /api/workspaces/[workspaceId]/kits": 300,
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/searches": 20,
  "GET /api/workspaces/[workspaceId]/kits/[kitId]/exports/[file]": 60,
  "GET /api/share/[token]/exports/[file]": 60,
  "GET /api/workspaces/[workspaceId]/compare/sheet.pdf": 50,
  "GET /api/workspaces/[workspaceId]/compare": 60,
  "POST /api/analyze": 60,
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/analyze": 60,
};
// KB_FUZZ_RUNS=10 runs ten times as many cases (a longer hunt than the suite's).
const RUNS_FACTOR = Number(process.env.KB_FUZZ_RUNS ?? "1") || 1;
const runsOf = (key: string) => Math.round((RUNS[key] ?? DEFAULT_RUNS) * RUNS_FACTOR);

// ---------------------------------------------------------------------------------------------------------
// The real things each path segment can name, made through the routes in beforeAll.

type Person = Awaited<ReturnType<typeof signUp>>;
let owner: Person;
let viewer: Person;
let outsider: Person;
const fx = {
  ws: "",
  kit: "",
  kit2: "",
  revisions: ["1"],
  run: "",
  photo: "",
  underlayFile: "",
  comment: "",
  linkId: "",
  tokens: [] as string[],
  material: "",
  joint: "",
  invitation: "",
  invitationToken: "",
  memberId: "",
  search: "",
  /** The derate the material's calibration proposes (what a person applying it would send). */
  derate: 0.6,
  // Current versions, read again before each write so a body can be one the route accepts.
  versions: { kit: 1, kit2: 1, material: 1, run: 1, underlay: 1, targets: 1, kitHead: 1 },
};

function realValues(segment: string): string[] {
  switch (segment) {
    case "workspaceId":
      return [fx.ws];
    case "kitId":
      return [fx.kit, fx.kit2];
    case "revision":
      return fx.revisions;
    case "runId":
      return [fx.run];
    case "fileId":
      return [fx.photo, fx.underlayFile];
    case "commentId":
      return [fx.comment];
    case "linkId":
      return [fx.linkId];
    case "token":
      return fx.tokens;
    case "itemId":
      return [fx.material, fx.joint];
    case "materialId":
      return [fx.material];
    case "invitationId":
      return [fx.invitation];
    case "memberId":
      return [fx.memberId];
    case "searchId":
      return [fx.search];
    case "view":
      return [...UNDERLAY_VIEWS];
    case "file":
      return [...EXPORT_FILES];
    default:
      return []; // a segment this file does not know yet: odd values only
  }
}

// ---------------------------------------------------------------------------------------------------------
// Odd values.

const ODD_TEXT = [
  "",
  "\u0000",
  "a\u0000b",
  "\u0001\u0002\u001b\u007f",
  "\u200b",
  "\ud800",
  "x\udfff",
  "\u2028\u2029",
  "x".repeat(300),
  "-1",
  "0",
  "1e999",
  "99999999999999999999",
  "NaN",
  "Infinity",
  "0x10",
  " 1",
  "1.5",
  "../..",
  "..%2F..",
  "%00",
  "%zz",
  "%E0%A4%A",
  "null",
  "<script>alert(1)</script>",
  "🛞".repeat(40),
];
const oddText = fc.oneof({ arbitrary: fc.constantFrom(...ODD_TEXT), weight: 4 }, { arbitrary: fc.string(), weight: 1 }, { arbitrary: fc.string({ unit: "binary", maxLength: 40 }), weight: 1 });
const oddId = fc.oneof({ arbitrary: fc.constantFrom(...ODD_TEXT), weight: 3 }, { arbitrary: fc.uuid(), weight: 2 }, { arbitrary: fc.string(), weight: 2 }, { arbitrary: fc.stringMatching(/^[A-Za-z0-9_-]{43}$/), weight: 1 });

function paramsArb(segments: string[], onlyReal = false): fc.Arbitrary<Record<string, string>> {
  if (segments.length === 0) return fc.constant({});
  const real = (s: string) => (realValues(s).length > 0 ? fc.constantFrom(...realValues(s)) : oddId);
  const allReal = fc.record(Object.fromEntries(segments.map((s) => [s, real(s)])));
  if (onlyReal) return allReal;
  const allOdd = fc.record(Object.fromEntries(segments.map((s) => [s, oddId])));
  const oneOdd = fc.tuple(allReal, fc.nat({ max: segments.length - 1 }), oddId).map(([p, i, odd]) => ({ ...p, [segments[i]!]: odd }));
  return fc.oneof({ arbitrary: allReal, weight: 5 }, { arbitrary: oneOdd, weight: 3 }, { arbitrary: allOdd, weight: 2 });
}

// Every query parameter a route reads (src/contracts/library.ts, exports.ts, the compare and file routes),
// each with values a route takes and values it must refuse; any other key is fuzzed too.
const QUERY_VALUES: Record<string, fc.Arbitrary<string>> = {
  q: fc.constantFrom("kit", "%", "_", "'", "\\", "a".repeat(121)),
  scale: fc.constantFrom("1:10", "1:8", "1:10,1:8", "1:10,".repeat(30), ","),
  tags: fc.constantFrom("a", "a,b", "x".repeat(60), ",".repeat(5)),
  author: fc.constantFrom("abc", "a".repeat(65)),
  updatedFrom: fc.constantFrom("2026-01-01", "2026-02-30", "2026-13-45", "0000-00-00", "0000-01-01", "0001-01-01", "9999-12-31", "9999-12-31T23:59:59Z", "2026-01-01T99:99:99Z", "2026-01-01T00:00:00+99:99", "275760-09-13", "2026-01-01T1"),
  updatedTo: fc.constantFrom("2026-12-31", "2026-02-30", "1900-01-01", "0000-01-01", "9999-12-31", "9999-12-31T23:59:59.999Z", "1969-12-31T23:59:59-12:00", "2026-01-01T00:00:00.000000000001Z", "9999-99-99"),
  status: fc.constantFrom("active", "archived", "all"),
  verdict: fc.constantFrom("any", "meets", "misses"),
  limitedBy: fc.constantFrom(...LOCK_LIMITS, "neck-contact,toggle"),
  sort: fc.constantFrom(...LIBRARY_SORTS),
  dir: fc.constantFrom("asc", "desc"),
  page: fc.constantFrom("1", "2", "100000", "100001", "0", "1.5", "1e5", "0x10", " 2"),
  size: fc.constantFrom("10", "25", "100", "101", "0", "-5"),
  items: fc.constantFrom("KIT,KIT2", "KIT,KIT@1", "KIT@1,KIT2@1,KIT@2", "KIT,KIT", "KIT", "KIT@0,KIT2", "KIT@999999999,KIT2", "KIT,KIT2,KIT,KIT2,KIT", "KIT@1@2,KIT2"),
  paper: fc.constantFrom("a4", "letter", "A4"),
  orientation: fc.constantFrom("portrait", "landscape"),
  unit: fc.constantFrom("mm", "in"),
  revision: fc.constantFrom("1", "2", "3", "9999999999", "2147483647", "2147483648"),
  travelSteps: fc.constantFrom("2", "41", "121", "122", "9999"),
  steerSteps: fc.constantFrom("3", "61", "121", "0"),
  download: fc.constantFrom("1", "0", "true"),
  ...Object.fromEntries(READOUT_KEYS.flatMap((k) => [`${k}Min`, `${k}Max`]).map((k) => [k, fc.constantFrom("0", "-1", "1e6", "1000001", "1e999", "-0", "0.5")])),
};
const QUERY_KEYS = Object.keys(QUERY_VALUES);
const withRealIds = (v: string) => v.replaceAll("KIT2", fx.kit2).replaceAll("KIT", fx.kit);

const LIBRARY_KEYS = ["q", "scale", "tags", "author", "updatedFrom", "updatedTo", "status", "verdict", "limitedBy", "sort", "dir", "page", "size", ...READOUT_KEYS.flatMap((k) => [`${k}Min`, `${k}Max`])];
const EXPORT_KEYS = ["paper", "orientation", "unit", "revision", "travelSteps", "steerSteps"];
/** The query parameters each route reads (read from the handlers and the contracts they parse with). */
const ROUTE_QUERY: Record<string, string[]> = {
  "GET /api/workspaces/[workspaceId]/kits": LIBRARY_KEYS,
  "GET /api/workspaces/[workspaceId]/kits/[kitId]/exports/[file]": EXPORT_KEYS,
  "GET /api/share/[token]/exports/[file]": EXPORT_KEYS,
  "GET /api/workspaces/[workspaceId]/compare": ["items"],
  "GET /api/workspaces/[workspaceId]/compare/sheet.pdf": ["items", "paper", "orientation", "unit"],
  "GET /api/workspaces/[workspaceId]/files/[fileId]": ["download"],
};

/** A query string of `keys` (and now and then a key no route reads), each with a value a route takes or an odd one. */
function queryOf(keys: string[]): fc.Arbitrary<string> {
  const key = fc.oneof({ arbitrary: fc.constantFrom(...keys), weight: 8 }, { arbitrary: fc.string(), weight: 1 });
  const pair = key.chain((k) => fc.oneof({ arbitrary: Object.hasOwn(QUERY_VALUES, k) ? QUERY_VALUES[k]! : oddText, weight: 3 }, { arbitrary: oddText, weight: 1 }).map((v) => [k, v] as const));
  return fc.array(pair, { maxLength: Math.min(6, keys.length + 1) }).map((pairs) => {
    const p = new URLSearchParams();
    for (const [k, v] of pairs) p.append(k, v);
    const text = p.toString();
    return text ? `?${text}` : "";
  });
}

// Written as is, not encoded: stray percent signs, brackets, repeated keys.
const rawQuery = fc.constantFrom("?items=%zz", "?page=%00", "?items[]=a&items[]=b", "?q=%E0%A4%A", "?&&&=", "?revision=1&revision=2", "?unit=mm&unit=in", "?=x", "?%00=1", "?items=KIT%2CKIT2", "?items=KIT,,KIT2,");

/** The route's own parameters, each there or not, mostly with a value it takes: so one odd value at a time reaches the work. */
function ownQuery(keys: string[]): fc.Arbitrary<string> {
  // One to three of them (more and nearly every query fails its check before the work), one in five odd.
  return fc
    .shuffledSubarray(keys, { minLength: 1, maxLength: Math.min(3, keys.length) })
    .chain((chosen) => fc.tuple(...chosen.map((k) => fc.oneof({ arbitrary: QUERY_VALUES[k] ?? oddText, weight: 4 }, { arbitrary: oddText, weight: 1 }).map((v) => [k, v] as const))))
    .map((pairs) => `?${new URLSearchParams(pairs as [string, string][]).toString()}`);
}

function queryArb(h: FoundHandler): fc.Arbitrary<string> {
  const own = ROUTE_QUERY[h.key];
  return fc.oneof(
    { arbitrary: fc.constant(""), weight: own ? 1 : 3 },
    ...(own ? [{ arbitrary: ownQuery(own), weight: 8 }] : []),
    { arbitrary: queryOf(own ?? QUERY_KEYS), weight: own ? 8 : 2 },
    { arbitrary: queryOf(QUERY_KEYS), weight: 1 },
    { arbitrary: rawQuery, weight: 1 },
  );
}

// ---------------------------------------------------------------------------------------------------------
// Bodies: the route's own contract with fields swapped for wrong ones, and anything else.

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

const layout = TARNWICK_10_BASE as unknown as Json;
// A layout as the previous release stored it (schema 1: the tie-rod inner ball was `rackEnd`): upgraded on the way in.
const schema1Layout = (schema1Documents as { base: { document: Json } }).base.document;
const materialSpec = { printed: true, tensileYieldMpa: 60, yieldSource: "across-layer coupons (invented)", shearRule: "distortion-energy", derate: 0.6, derateSource: "club print settings (invented)" };
const setup = { motor: { kind: "torque", torqueNm: 0.5 }, gearRatios: [3, 2], lockDeg: 28, load: "1.6 kg car" };
const placement = { anchorPx: { x: 10, y: 20 }, anchorMm: { u: 0, v: 0 }, mmPerPx: 0.3, rotationDeg: 0, picks: { aPx: { x: 0, y: 0 }, bPx: { x: 100, y: 0 }, distanceMm: 30 } };
const pin = { revision: 1, view: "front", xMm: 1.5, yMm: -2 };

/**
 * A value filled in when the case is sent, not when it is made: the current version of a row (each write
 * bumps it), so a body can still be one the route accepts after the cases before it.
 */
type Live = keyof typeof fx.versions | "derate";
const live = (name: Live): Json => `@live:${name}`;
const fillLive = (text: string) => text.replace(/"@live:(\w+)"/g, (_m, name: string) => String(name === "derate" ? fx.derate : fx.versions[name as keyof typeof fx.versions]));

type Template = () => Json;

/** Bodies each route accepts, as functions of the real things: the fuzz starts from them and breaks them. */
const TEMPLATES: Record<string, Template[]> = {
  "POST /api/analyze": [() => ({ layout, grid: { travelSteps: 5, steerSteps: 7 } }), () => ({ layout: schema1Layout, grid: { travelSteps: 3, steerSteps: 5 } })],
  "POST /api/invitations/accept": [() => ({ token: fx.invitationToken })],
  "PUT /api/me/preferences": [() => ({ lengthUnit: "in" })],
  // A comment through a link is pinned to the revision the link shows (the kit's head for the first link).
  "POST /api/share/[token]/comments": [() => ({ body: "Looks right", authorName: "Reviewer", ...pin, revision: live("kitHead") }), () => ({ body: "Agreed", authorName: "Second reviewer", parentId: fx.comment })],
  "POST /api/workspaces": [() => ({ name: "Fuzzed club" })],
  "POST /api/workspaces/[workspaceId]/calibration/[materialId]": [() => ({ version: live("material"), runs: 5, derate: live("derate"), kits: [{ id: fx.kit2, version: live("kit2") }] })],
  "POST /api/workspaces/[workspaceId]/kits": [() => ({ name: "Fuzzed kit", scale: "1:10", notes: "n", tags: ["fuzz"], layout }), () => ({ name: "Old kit", scale: "1:8", layout: schema1Layout })],
  "PATCH /api/workspaces/[workspaceId]/kits/[kitId]": [() => ({ version: live("kit"), name: "Fuzz kit", notes: "n", tags: ["a"], archived: false, targets: { minLockDeg: 30 } })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/analyze": [() => ({ grid: { travelSteps: 5, steerSteps: 7 } })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/comments": [() => ({ body: "Check the neck", ...pin }), () => ({ body: "Done", parentId: fx.comment })],
  "PATCH /api/workspaces/[workspaceId]/kits/[kitId]/comments/[commentId]": [() => ({ resolved: true })],
  "PUT /api/workspaces/[workspaceId]/kits/[kitId]/layout": [() => ({ version: live("kit"), layout, note: "fuzz" }), () => ({ version: live("kit"), layout: schema1Layout })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/revisions/[revision]/restore": [() => ({ version: live("kit"), note: "back" })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/searches": [
    () => ({ moves: [{ key: "neckDiameterMm", min: 3.5, max: 6 }, { key: "jointType", choices: ["dogbone", "cvd"] }] as Json[], aims: { ...DEFAULT_TARGETS }, prefer: "most-lock", samples: 16 }),
  ],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/share-links": [() => ({ revision: 1, allowComments: true, expiresInDays: 30, label: "for review" })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/test-runs": [
    () => ({ revision: 1, testedOn: "2026-01-10", part: "left dogbone", materialId: fx.material, setup, outcome: "broke", failureLocation: "neck", notes: "n" }),
    () => ({ revision: 2, testedOn: "2026-01-12", part: "right dogbone", materialId: fx.material, setup: { ...setup, motor: { kind: "kv", kvRpmPerV: 4000, currentA: 80 }, lockDeg: null }, outcome: "held" }),
  ],
  "PATCH /api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]": [() => ({ version: live("run"), testedOn: "2026-01-11", part: "right dogbone", materialId: fx.material, setup, outcome: "held", notes: "n" })],
  "PATCH /api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]": [() => ({ version: live("underlay"), placement, opacity: 0.5, visible: true })],
  "POST /api/workspaces/[workspaceId]/kits/[kitId]/variants": [() => ({ name: "Fuzz variant", revision: 1, scale: "1:10", notes: "", tags: ["v"] })],
  "POST /api/workspaces/[workspaceId]/members": [() => ({ email: "fuzz-invitee@fuzz.example", role: "viewer" })],
  "PATCH /api/workspaces/[workspaceId]/members/[memberId]": [() => ({ role: "editor" })],
  "POST /api/workspaces/[workspaceId]/shelf": [
    () => ({ kind: "material", name: "Fuzz bar", spec: materialSpec }),
    () => ({ kind: "joint", name: "Fuzz joint", spec: { jointType: "cvd", ratedAngleDeg: 45, ratedAngleSource: "invented", plungeMm: 2, plungeSource: "invented" } }),
    () => ({ kind: "shaft", name: "Fuzz shaft", spec: { neckDiameterMm: 5, boreDiameterMm: 1, lengthMm: 70, materialId: fx.material } }),
  ],
  "PATCH /api/workspaces/[workspaceId]/shelf/[itemId]": [() => ({ version: live("material"), name: "PA12 print", spec: materialSpec, kits: [{ id: fx.kit2, version: live("kit2") }] })],
  "PUT /api/workspaces/[workspaceId]/targets": [() => ({ version: live("targets"), targets: { ...DEFAULT_TARGETS } })],
};

/** Every path to a value inside `v` (the root too). */
function pathsOf(v: Json, at: (string | number)[] = []): (string | number)[][] {
  const here = [at];
  if (Array.isArray(v)) return here.concat(...v.map((x, i) => pathsOf(x, [...at, i])));
  if (v && typeof v === "object") return here.concat(...Object.entries(v).map(([k, x]) => pathsOf(x, [...at, k])));
  return here;
}

const REMOVE = Symbol("remove");
function setAt(v: Json, at: (string | number)[], value: Json | typeof REMOVE): Json {
  if (at.length === 0) return value === REMOVE ? {} : value;
  const [head, ...rest] = at;
  if (Array.isArray(v)) {
    const copy = [...v];
    if (rest.length === 0 && value === REMOVE) copy.splice(head as number, 1);
    else copy[head as number] = setAt(copy[head as number]!, rest, value);
    return copy;
  }
  const copy = { ...(v as Record<string, Json>) };
  if (rest.length === 0 && value === REMOVE) delete copy[head as string];
  else copy[head as string] = setAt(copy[head as string]!, rest, value);
  return copy;
}

const oddNumber = fc.oneof(
  fc.constantFrom(0, -1, 0.5, 1e308, -1e308, 2 ** 31, 2 ** 31 - 1, 2 ** 53 + 2, Number.MIN_VALUE, 1e-320, 123456789),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);
const oddValue: fc.Arbitrary<Json | typeof REMOVE> = fc.oneof(
  { arbitrary: oddText, weight: 4 },
  { arbitrary: oddNumber, weight: 3 },
  { arbitrary: fc.boolean(), weight: 1 },
  { arbitrary: fc.constant(null), weight: 1 },
  { arbitrary: fc.constantFrom<Json>([], {}, [null], { "": "" }, ["a", 1]), weight: 1 },
  { arbitrary: fc.jsonValue({ maxDepth: 2 }) as fc.Arbitrary<Json>, weight: 1 },
  { arbitrary: fc.constant(REMOVE), weight: 2 },
);

/** One of the templates: its index, so a counterexample names it. */
const templateOf = (templates: Template[]) => fc.nat({ max: templates.length - 1 }).map((i) => templates[i]!());

/**
 * A template with 1–3 values swapped for odd ones (or removed); a number sometimes only moved (scaled, made
 * fractional or negative), so it passes the schema and reaches the work; maybe a key it does not know added.
 */
function mutated(templates: Template[]): fc.Arbitrary<string> {
  // How a number moves instead of being replaced: scaled, nudged by a whole step (revision 2 of a kit with one),
  // or set to an edge of the integer columns.
  const move = fc.oneof(
    { arbitrary: fc.constant(null), weight: 3 },
    { arbitrary: fc.double({ min: -3, max: 3, noNaN: true }).map((times) => ({ times })), weight: 1 },
    { arbitrary: fc.integer({ min: -2, max: 3 }).map((plus) => ({ plus })), weight: 1 },
    { arbitrary: fc.constantFrom(2_147_483_647, 2_147_483_648, 1e6, 0.001).map((to) => ({ to })), weight: 1 },
  );
  const apply = (n: number, m: { times: number } | { plus: number } | { to: number }) => ("times" in m ? n * m.times : "plus" in m ? n + m.plus : m.to);
  const swap = fc.tuple(fc.nat(), oddValue, move);
  return fc
    .tuple(templateOf(templates), fc.array(swap, { minLength: 1, maxLength: 3 }), fc.option(fc.tuple(fc.constantFrom("extra", "__proto__", "constructor", "version", ""), oddValue)))
    .map(([start, swaps, extra]) => {
      let v = start;
      for (const [n, odd, moved] of swaps) {
        const paths = pathsOf(v);
        const at = paths[n % paths.length]!;
        const old = at.reduce<Json>((x, k) => (x as Record<string, Json>)[k as string]!, v);
        v = setAt(v, at, typeof old === "number" && moved !== null ? apply(old, moved) : odd);
      }
      let text = JSON.stringify(v) ?? "{}";
      if (extra && extra[1] !== REMOVE && text.startsWith("{")) text = `{${JSON.stringify(extra[0])}:${JSON.stringify(extra[1])}${text === "{}" ? "" : ","}${text.slice(1)}`;
      return text;
    });
}

/** A template's text with one number literal swapped for one JSON allows and JavaScript reads oddly. */
function hugeNumbers(templates: Template[]): fc.Arbitrary<string> {
  return fc.tuple(templateOf(templates), fc.nat(), fc.constantFrom("1e999", "-1e999", "99999999999999999999", "1e-999", "123456789012345678901234567890.5", "2147483648", "9007199254740993", "-0", "1E2", "4.9e-324")).map(([start, n, lit]) => {
    const text = JSON.stringify(start);
    const numbers = [...text.matchAll(/(?<=[:[,])-?\d+(\.\d+)?([eE][+-]?\d+)?/g)];
    if (numbers.length === 0) return text.replace(/^\{/, `{"n":${lit},`);
    const m = numbers[n % numbers.length]!;
    return text.slice(0, m.index) + lit + text.slice(m.index! + m[0].length);
  });
}

const DEEP_ARRAY = `${"[".repeat(5000)}${"]".repeat(5000)}`;
const DEEP_OBJECT = `${'{"a":'.repeat(5000)}1${"}".repeat(5000)}`;

function deep(templates: Template[] | undefined): fc.Arbitrary<string> {
  const plain = fc.constantFrom(DEEP_ARRAY, DEEP_OBJECT, "[".repeat(5000), `{"layout":${DEEP_ARRAY}}`, `[${"0,".repeat(200_000)}0]`);
  if (!templates) return plain;
  return fc.oneof(
    plain,
    fc.tuple(templateOf(templates), fc.nat()).map(([start, n]) => {
      const text = JSON.stringify(start);
      const keys = [...text.matchAll(/"([^"\\]+)":/g)];
      const m = keys[n % Math.max(keys.length, 1)];
      if (!m) return DEEP_OBJECT;
      // The value after that key becomes 5,000 levels of arrays (the rest of the text is left as is: broken JSON too).
      return `${text.slice(0, m.index! + m[0].length)}${DEEP_ARRAY},"z":${text.slice(m.index! + m[0].length)}`;
    }),
  );
}

type Body = { bytes?: Uint8Array | string; type?: string };

let PNG: Buffer;
let JPEG: Buffer;

function multipartOf(png: Buffer): Buffer {
  return Buffer.concat([Buffer.from('--right\r\nContent-Disposition: form-data; name="file"; filename="a.png"\r\nContent-Type: image/png\r\n\r\n'), png, Buffer.from("\r\n--right--\r\n")]);
}

const JSON_TYPES = ["application/json", "application/json; charset=utf-8", "APPLICATION/JSON", "application/json;charset=latin1"];
const OTHER_TYPES = ["text/plain", "text/plain;charset=UTF-8", "multipart/form-data; boundary=wrong", "multipart/form-data", "application/x-www-form-urlencoded", "application/octet-stream", "image/png", "application/jsonx", "application/json; a=\u0001", ";", "*/*"];

/** A file's bytes (an image, a truncated one, a PDF, random bytes, an image in a multipart form), mostly as application/octet-stream. */
function filesArb(ownType = false): fc.Arbitrary<Body> {
  return fc
    .tuple(
      fc.oneof(
        { arbitrary: fc.constant(0).map(() => PNG), weight: 4 },
        { arbitrary: fc.constant(0).map(() => JPEG), weight: 1 },
        { arbitrary: fc.constant(0).map(() => PNG.subarray(0, 40)), weight: 1 },
        { arbitrary: fc.constant(PDF_BYTES), weight: 1 },
        { arbitrary: fc.constant(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')), weight: 1 },
        { arbitrary: fc.constant(Buffer.from("GIF89a\u0001\u0000\u0001\u0000")), weight: 1 },
        { arbitrary: fc.uint8Array({ maxLength: 256 }), weight: 2 },
        { arbitrary: fc.constant(0).map(() => multipartOf(PNG)), weight: 2 },
      ),
      ownType ? fc.constantFrom("application/octet-stream", "application/octet-stream; x=y") : fc.oneof({ arbitrary: fc.constant("application/octet-stream"), weight: 6 }, { arbitrary: fc.constantFrom("application/octet-stream; x=y", ...OTHER_TYPES, ...JSON_TYPES, undefined), weight: 4 }),
    )
    .map(([bytes, type]): Body => ({ bytes, type }));
}

const noBody = fc.constantFrom<Body>({}, { type: "application/json" }, { type: "application/octet-stream" }, { type: "multipart/form-data; boundary=x" });

function bodyArb(templates: Template[] | undefined): fc.Arbitrary<Body> {
  const jsonText = fc.oneof(
    ...(templates
      ? [
          { arbitrary: templateOf(templates).map((t) => JSON.stringify(t)), weight: 2 },
          { arbitrary: mutated(templates), weight: 8 },
          { arbitrary: hugeNumbers(templates), weight: 2 },
          { arbitrary: fc.tuple(templateOf(templates), fc.nat()).map(([t, n]) => { const text = JSON.stringify(t); return text.slice(0, n % text.length); }), weight: 1 },
          { arbitrary: templateOf(templates).map((t) => `\ufeff${JSON.stringify(t)}`), weight: 1 },
        ]
      : []),
    { arbitrary: fc.json(), weight: 2 },
    { arbitrary: fc.string(), weight: 1 },
    { arbitrary: deep(templates), weight: 1 },
    { arbitrary: fc.constantFrom("", "null", "[]", "{}", "\"\"", "0", "{\"__proto__\":{\"polluted\":1}}", "{\"a\":1,\"a\":\"x\"}", "\u0000", "{\"x\":\"\\u0000\"}"), weight: 1 },
  );
  const json = fc.tuple(jsonText, fc.oneof({ arbitrary: fc.constantFrom(...JSON_TYPES), weight: 8 }, { arbitrary: fc.constantFrom(...OTHER_TYPES, undefined), weight: 2 })).map(([bytes, type]): Body => ({ bytes, type }));
  return fc.oneof({ arbitrary: json, weight: 7 }, { arbitrary: filesArb(), weight: 2 }, { arbitrary: noBody, weight: 1 });
}

/** A body in the route's own media type: its contract broken in every way for JSON routes, a file for uploads. */
function focusedBodyArb(h: FoundHandler, templates: Template[] | undefined): fc.Arbitrary<Body> {
  const all = bodyArb(templates);
  if (h.upload) return fc.oneof({ arbitrary: filesArb(true), weight: 4 }, { arbitrary: all, weight: 1 });
  if (!templates) return fc.oneof({ arbitrary: fc.constantFrom<Body>({}, { type: "application/json" }), weight: 3 }, { arbitrary: all, weight: 1 });
  return all.filter((b) => typeof b.bytes === "string" && b.type !== undefined && b.type.toLowerCase().startsWith("application/json"));
}

// Headers some routes read: the uploaded file's name, an underlay's first placement, the client address, a
// cached file's tag, and the Origin a write is checked for.
const headerText = fc.oneof(fc.constantFrom("", "../../etc/passwd", "%00", "%E0%A4%A", "a%2Fb.png", "C:\\x\\y.png", "x".repeat(300), "%F0%9F%9B%9E.png", "name.png"), fc.string({ unit: fc.constantFrom(...' abc%/\\."{}:,0123456789'.split("")), maxLength: 30 }));
const extraHeadersArb = fc.record(
  {
    "x-file-name": headerText,
    "x-underlay-placement": fc.oneof(fc.constant(encodeURIComponent(JSON.stringify(placement))), fc.constantFrom("{", "null", "%zz", "[]", encodeURIComponent('{"mmPerPx":1e999}'), encodeURIComponent(DEEP_ARRAY)), headerText),
    // A declared length that is not the body's: none at all, zero with a body, not a number, past the limit.
    "content-length": fc.constantFrom("0", "1", "abc", "-1", "1e3", "99999999999"),
    "x-kb-socket-address": fc.oneof(fc.constant("").map(() => randomClientIp()), fc.constantFrom("", "not-an-address", "::1", "::ffff:10.0.0.1", "999.1.1.1", "x".repeat(300))),
    "if-none-match": fc.oneof(headerText, fc.constant("*")),
    origin: fc.constantFrom("null", "https://elsewhere.example", "", BASE.replace("127.0.0.1", "localhost")),
  },
  { requiredKeys: [] },
);

type Who = "owner" | "viewer" | "outsider" | "anonymous" | "forged";
const whoArb = fc.oneof({ arbitrary: fc.constant<Who>("owner"), weight: 12 }, { arbitrary: fc.constant<Who>("viewer"), weight: 3 }, { arbitrary: fc.constant<Who>("anonymous"), weight: 2 }, { arbitrary: fc.constantFrom<Who>("outsider", "forged"), weight: 1 });
const forgedCookie = fc.oneof(fc.constantFrom("better-auth.session_token=abc.def", "better-auth.session_token=%zz", "better-auth.session_token=\"x", "better-auth.session_token=", "__Secure-better-auth.session_token=a.b; better-auth.session_token=c.d"), fc.string({ unit: fc.constantFrom(..."abc=;.% \"".split("")), maxLength: 40 }).map((s) => `better-auth.session_token=${s}`));

const cookieOf = (who: Who) => (who === "owner" ? owner.cookie : who === "viewer" ? viewer.cookie : who === "outsider" ? outsider.cookie : undefined);

function caseArb(h: FoundHandler) {
  const templates = TEMPLATES[h.key];
  // Anything goes: any caller, any ids, any media type, odd headers.
  const wild = fc.record({
    who: whoArb,
    forged: forgedCookie,
    params: paramsArb(h.segments),
    query: queryArb(h),
    body: h.method === "GET" ? fc.constant<Body>({}) : bodyArb(templates),
    headers: fc.oneof({ arbitrary: fc.constant({}), weight: 2 }, { arbitrary: extraHeadersArb, weight: 1 }),
  });
  // Past the guard: the owner, real ids, the route's own media type, so the odd values reach the work itself.
  const focused = fc.record({
    who: fc.constant<Who>("owner"),
    forged: fc.constant(""),
    params: fc.oneof({ arbitrary: paramsArb(h.segments), weight: 1 }, { arbitrary: paramsArb(h.segments, true), weight: 3 }),
    query: queryArb(h),
    body: h.method === "GET" ? fc.constant<Body>({}) : focusedBodyArb(h, templates),
    headers: fc.oneof(
      { arbitrary: fc.constant({}), weight: 1 },
      { arbitrary: fc.record({ "x-file-name": headerText, "x-underlay-placement": extraHeadersArb.map((x) => x["x-underlay-placement"] ?? "") }, { requiredKeys: [] }), weight: 1 },
    ),
  });
  return fc.oneof({ arbitrary: wild, weight: 2 }, { arbitrary: focused, weight: 3 });
}
type Case = ReturnType<typeof caseArb> extends fc.Arbitrary<infer C> ? C : never;

// ---------------------------------------------------------------------------------------------------------
// Calling a handler as Next would, and watching the server's log.

const logged: string[] = [];
const BAD_LOG = /Unhandled error|Comment notice not queued|file store:|Data store unavailable/;

async function send(h: FoundHandler, c: Case): Promise<{ status: number; text: string }> {
  const headers = new Headers();
  headers.set("x-kb-socket-address", randomClientIp());
  if (h.method !== "GET") headers.set("origin", new URL(BASE).origin);
  for (const [k, v] of Object.entries(c.headers)) if (v !== undefined) headers.set(k, v);
  if (c.who === "forged") headers.set("cookie", c.forged);
  else if (cookieOf(c.who)) headers.set("cookie", cookieOf(c.who)!);
  if (c.body.type !== undefined) headers.set("content-type", c.body.type);
  // The path as a browser would write it (a lone surrogate cannot be percent-encoded: as U+FFFD); the
  // handler gets the params as they are.
  const pathText = h.route.replace(/\[([^\]]+)\]/g, (_m, s: string) => encodeURIComponent((c.params[s] ?? "").toWellFormed()));
  const req = new Request(`${BASE}${pathText}${withRealIds(c.query)}`, { method: h.method, headers, body: c.body.bytes === undefined ? undefined : typeof c.body.bytes === "string" ? fillLive(c.body.bytes) : new Uint8Array(c.body.bytes) });
  const res = await h.handler(req, { params: Promise.resolve(c.params) });
  // The whole answer is read: a streamed file that fails halfway is a failure too.
  const text = res.headers.get("content-type")?.startsWith("application/json") ? await res.text() : `(${(await res.arrayBuffer()).byteLength} bytes)`;
  return { status: res.status, text };
}

async function refreshVersions(): Promise<void> {
  const one = async <T>(q: Promise<{ v: T }[]>) => (await q)[0]?.v;
  const [kit, kit2, material, run, underlay, targets, kitHead] = await Promise.all([
    one(db.select({ v: kits.version }).from(kits).where(eq(kits.id, fx.kit))),
    one(db.select({ v: kits.version }).from(kits).where(eq(kits.id, fx.kit2))),
    one(db.select({ v: shelfItems.version }).from(shelfItems).where(eq(shelfItems.id, fx.material))),
    one(db.select({ v: testRuns.version }).from(testRuns).where(eq(testRuns.id, fx.run))),
    one(db.select({ v: kitUnderlays.version }).from(kitUnderlays).where(and(eq(kitUnderlays.kitId, fx.kit), eq(kitUnderlays.view, "front")))),
    one(db.select({ v: workspaceSettings.version }).from(workspaceSettings).where(eq(workspaceSettings.workspaceId, fx.ws))),
    one(db.select({ v: kits.headRevision }).from(kits).where(eq(kits.id, fx.kit))),
  ]);
  fx.versions = { kit: kit ?? 1, kit2: kit2 ?? 1, material: material ?? 1, run: run ?? 1, underlay: underlay ?? 1, targets: targets ?? 1, kitHead: kitHead ?? 1 };
}

/** Cancels the searches this file started (all but the one kept running for the routes to read, unless `all`). */
async function cancelSearches(all: boolean): Promise<void> {
  const running = await db
    .select({ id: designSearches.id, kitId: designSearches.kitId })
    .from(designSearches)
    .where(and(eq(designSearches.workspaceId, fx.ws), eq(designSearches.status, "running"), ...(all ? [] : [ne(designSearches.id, fx.search)])));
  const boss = await searchBoss("app");
  for (const s of running) await cancelSearch(boss, fx.ws, s.kitId, s.id).catch(() => {});
}

// ---------------------------------------------------------------------------------------------------------

// eslint-disable-next-line @typescript-eslint/no-explicit-any
async function made<T>(what: string, res: Promise<Response>, status: number, pick: (json: any) => T): Promise<T> {
  const r = await res;
  const text = await r.text();
  if (r.status !== status) throw new Error(`setup: ${what} answered ${r.status}: ${text.slice(0, 300)}`);
  return pick(JSON.parse(text));
}

function handlerOf(key: string): FoundHandler {
  const h = HANDLERS.find((x) => x.key === key);
  if (!h) throw new Error(`setup needs ${key}, which is not there any more`);
  return h;
}

/** A call made to set things up (a write from the app's origin as the owner, JSON unless bytes are given). */
function setupCall(key: string, params: Record<string, string>, body?: unknown, opts: { bytes?: Buffer; cookie?: string; headers?: Record<string, string> } = {}) {
  const h = handlerOf(key);
  const headers: Record<string, string> = { cookie: opts.cookie ?? owner.cookie, ...fromAddress(randomClientIp()), ...opts.headers };
  if (h.method !== "GET") headers.origin = new URL(BASE).origin;
  let payload: BodyInit | undefined;
  if (opts.bytes) {
    headers["content-type"] = "application/octet-stream";
    payload = new Uint8Array(opts.bytes);
  } else if (body !== undefined) {
    headers["content-type"] = "application/json";
    payload = JSON.stringify(body);
  }
  const pathText = h.route.replace(/\[([^\]]+)\]/g, (_m, s: string) => params[s] ?? "");
  return h.handler(new Request(`${BASE}${pathText}`, { method: h.method, headers, body: payload }), { params: Promise.resolve(params) });
}

const originalError = console.error;
const originalWarn = console.warn;

beforeAll(async () => {
  PNG = await pngBytes(32, 24);
  JPEG = await jpegBytes(32, 24);
  // Names a page or a sheet must print as they are: markup, scripts beyond Latin, right-to-left, emoji.
  owner = await signUp("Fuzz Ωwner <b>🛞</b> 漢字");
  viewer = await signUp("Fuzz Viewer");
  outsider = await signUp("Fuzz Outsider");
  const editor = await signUp("Fuzz Editor");
  const ws = (fx.ws = await made("workspace", setupCall("GET /api/workspaces", {}), 200, (j) => j.workspaces[0].id as string));
  await addMemberByInvitation(owner, ws, viewer, "viewer");
  await addMemberByInvitation(owner, ws, editor, "editor");
  fx.memberId = await made("members", setupCall("GET /api/workspaces/[workspaceId]/members", { workspaceId: ws }), 200, (j) => j.members.find((m: { email: string }) => m.email === editor.email.toLowerCase()).id as string);

  const shelfItem = (body: unknown) => made("shelf item", setupCall("POST /api/workspaces/[workspaceId]/shelf", { workspaceId: ws }, body), 201, (j) => j.item as { id: string });
  const material = await shelfItem({ kind: "material", name: "Fuzz PA12 print ‘עברית’", spec: materialSpec });
  fx.material = material.id;
  fx.joint = (await shelfItem({ kind: "joint", name: "Fuzz dogbone", spec: { jointType: "dogbone", ratedAngleDeg: 40, ratedAngleSource: "invented", plungeMm: null, plungeSource: "" } })).id;

  const newKit = (name: string, layoutDoc: unknown) => made("kit", setupCall("POST /api/workspaces/[workspaceId]/kits", { workspaceId: ws }, { name, scale: "1:10", tags: ["fuzz", "ünïcode"], layout: layoutDoc }), 201, (j) => j.kit.id as string);
  fx.kit = await newKit("Fuzz kit", TARNWICK_10_BASE);
  // The second kit takes its figures from the shelf material: a shelf edit or a calibration rewrites it.
  fx.kit2 = await newKit("Ωmega 🛞 漢字 עברית e\u0301 <script>", applyShelfItem(TARNWICK_10_BASE, material as unknown as Parameters<typeof applyShelfItem>[1]));
  const K = { workspaceId: ws, kitId: fx.kit };
  const K2 = { workspaceId: ws, kitId: fx.kit2 };
  await made("layout save", setupCall("PUT /api/workspaces/[workspaceId]/kits/[kitId]/layout", K, { version: 1, layout: TARNWICK_10_BASE, note: "second 🛞" }), 200, () => null);
  fx.revisions = ["1", "2"];

  // Runs on the second kit that separate held from broke, so the material has a calibration to apply.
  const runs: string[] = [];
  for (const [torqueNm, outcome] of [[0.1, "held"], [0.12, "held"], [0.15, "worn"], [0.2, "broke"], [0.25, "broke"]] as const) {
    const body = { revision: 1, testedOn: "2026-04-02", part: "dogbone", materialId: fx.material, setup: { ...setup, motor: { kind: "torque", torqueNm } }, outcome, ...(outcome === "broke" ? { failureLocation: "neck" } : {}) };
    runs.push(await made("test run", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/test-runs", K2, body), 201, (j) => j.run.id as string));
  }
  fx.run = runs[0]!;
  fx.derate = await made("calibration", setupCall("GET /api/workspaces/[workspaceId]/calibration", { workspaceId: ws }), 200, (j) => j.materials.find((m: { material: { id: string } }) => m.material.id === fx.material).proposal.derateAfter as number);
  fx.photo = await made("photo", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos", { ...K2, runId: fx.run }, undefined, { bytes: PNG, headers: { "x-file-name": "neck%20%F0%9F%9B%9E.png" } }), 201, (j) => j.photo.id as string);
  fx.underlayFile = await made("underlay", setupCall("PUT /api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]", { ...K, view: "front" }, undefined, { bytes: PNG }), 201, (j) => j.underlay.file.id as string);
  fx.comment = await made("comment", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/comments", K, { body: "First <b>look</b> 🛞", ...pin }), 201, (j) => j.comment.id as string);
  const link = await made("share link", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/share-links", K, { allowComments: true }), 201, (j) => j as { link: { id: string }; token: string });
  const pinned = await made("pinned share link", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/share-links", K, { revision: 1, allowComments: false }), 201, (j) => j.token as string);
  fx.linkId = link.link.id;
  fx.tokens = [link.token, pinned];

  const invitee = uniqueEmail("fuzz-invitee");
  expect((await invite(owner, ws, invitee, "editor")).status).toBe(202);
  fx.invitation = await made("invitations", setupCall("GET /api/workspaces/[workspaceId]/invitations", { workspaceId: ws }), 200, (j) => j.invitations.find((i: { email: string }) => i.email === invitee).id as string);
  fx.invitationToken = linkIn(await waitForMail(invitee, /invited you/), `${BASE}/invitations/`).slice(`${BASE}/invitations/`.length);
  fx.search = await made("search", setupCall("POST /api/workspaces/[workspaceId]/kits/[kitId]/searches", K, TEMPLATES["POST /api/workspaces/[workspaceId]/kits/[kitId]/searches"]![0]!()), 202, (j) => j.search.id as string);

  for (const [k, v] of Object.entries(fx)) if (v === "") throw new Error(`setup: ${k} was not made`);
  console.error = (...args: unknown[]) => {
    logged.push(args.map(String).join(" "));
    originalError(...args);
  };
  console.warn = (...args: unknown[]) => {
    logged.push(args.map(String).join(" "));
    originalWarn(...args);
  };
}, 120_000);

afterAll(async () => {
  console.error = originalError;
  console.warn = originalWarn;
  await cancelSearches(true);
  await stopSearchBoss();
});

const exercised = new Map<string, number>();
/** Per handler, how many cases got each status: shows how deep the cases reached (a route that only ever answers 404 is not being fuzzed). */
const statuses = new Map<string, Map<number, number>>();
const started = Date.now();

describe("every route, fuzzed, never answers 5xx", () => {
  it("finds the routes under src/app/api, with the methods they export", () => {
    expect(HANDLERS.length).toBeGreaterThan(0);
    // The routes the kits, shelf, share and search work added are among them (a walk that missed folders would not find these).
    for (const key of ["PUT /api/workspaces/[workspaceId]/targets", "DELETE /api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos/[fileId]", "POST /api/share/[token]/comments", "GET /api/workspaces/[workspaceId]/compare/sheet.pdf"]) {
      expect(HANDLERS.map((h) => h.key)).toContain(key);
    }
    expect(HANDLERS.some((h) => h.route.includes("[..."))).toBe(false);
    // The uploads are told apart (they get files, not JSON, in the focused cases).
    expect(HANDLERS.filter((h) => h.upload).map((h) => h.key)).toEqual(expect.arrayContaining(["POST /api/workspaces/[workspaceId]/kits/[kitId]/test-runs/[runId]/photos", "PUT /api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]"]));
    expect(HANDLERS.find((h) => h.key === "PATCH /api/workspaces/[workspaceId]/kits/[kitId]/underlays/[view]")?.upload).toBe(false);
    // Every template belongs to a route that is still there.
    for (const key of Object.keys(TEMPLATES)) expect(HANDLERS.map((h) => h.key)).toContain(key);
  });

  for (const h of FUZZED) {
    const runs = runsOf(h.key);
    it(`${h.key} (${runs} cases)`, async () => {
      // A kit archived by an earlier case takes no edits: each route starts from a kit that does.
      await db.update(kits).set({ archivedAt: null }).where(sql`${kits.id} in (${fx.kit}, ${fx.kit2})`);
      if (h.method === "DELETE") await cancelSearches(true);
      await fc.assert(
        fc.asyncProperty(caseArb(h), async (c) => {
          exercised.set(h.key, (exercised.get(h.key) ?? 0) + 1);
          if (h.method !== "GET" && TEMPLATES[h.key]) await refreshVersions();
          const before = logged.length;
          const res = await send(h, c);
          const seen = statuses.get(h.key) ?? new Map<number, number>();
          statuses.set(h.key, seen.set(res.status, (seen.get(res.status) ?? 0) + 1));
          const lines = logged.slice(before).filter((l) => BAD_LOG.test(l));
          expect(res.status, `${h.key} answered ${res.status}: ${res.text.slice(0, 500)}`).toBeLessThan(500);
          expect(lines, `${h.key} logged`).toEqual([]);
        }),
        { numRuns: runs },
      );
      if (h.key === "POST /api/workspaces/[workspaceId]/kits/[kitId]/searches") await cancelSearches(false);
    }, 120_000);
  }

  it("exercised every handler it found, each with all its cases", () => {
    expect(FUZZED.length).toBeGreaterThan(0);
    for (const h of FUZZED) expect(exercised.get(h.key) ?? 0, h.key).toBeGreaterThanOrEqual(runsOf(h.key));
    const cases = [...exercised.values()].reduce((a, b) => a + b, 0);
    for (const [key, seen] of statuses) console.log(`fuzz: ${key}: ${[...seen].sort((a, b) => a[0] - b[0]).map(([s, n]) => `${s}×${n}`).join(" ")}`);
    console.log(`fuzz: ${FUZZED.length} handlers, ${cases} cases, ${((Date.now() - started) / 1000).toFixed(1)} s`);
  });
});
