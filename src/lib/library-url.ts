// The library table's state lives in the page URL (filters, sort, page, the columns shown), so a view can
// be bookmarked or sent. The same parameters, less `cols`, are the API's query (contracts/library.ts).
import { libraryQuerySchema, type LibraryQuery } from "@/contracts/library";
import { READOUT_KEYS } from "@/contracts/targets";

export const LIBRARY_COLUMNS = ["name", "scale", "author", "updatedAt", "headRevision", "tags", ...READOUT_KEYS] as const;
export type LibraryColumn = (typeof LIBRARY_COLUMNS)[number];
export const DEFAULT_COLUMNS: readonly LibraryColumn[] = ["name", "scale", "author", "updatedAt", "lockDeg", "maxJointAngleDeg", "ackermannPct", "safetyFactor", "neckClearanceMm"];

export type LibraryView = LibraryQuery & { readonly cols: readonly LibraryColumn[] };

const DEFAULTS = libraryQuerySchema.parse({});

function readColumns(raw: string | null): LibraryColumn[] {
  if (raw === null) return [...DEFAULT_COLUMNS];
  const picked = raw.split(",").filter((c): c is LibraryColumn => (LIBRARY_COLUMNS as readonly string[]).includes(c));
  // The name always shows: a row must say which kit it is.
  return picked.includes("name") ? picked : ["name", ...picked];
}

/** The view a URL describes; a parameter that does not parse is dropped (the page shows the rest). */
export function readLibraryView(params: URLSearchParams): LibraryView {
  const input: Record<string, string> = {};
  for (const [k, v] of params) if (k !== "cols" && !(k in input)) input[k] = v;
  for (let tries = 0; tries < 20; tries++) {
    const parsed = libraryQuerySchema.safeParse(input);
    if (parsed.success) return { ...parsed.data, cols: readColumns(params.get("cols")) };
    const bad = new Set(parsed.error.issues.map((i) => String(i.path[0] ?? "")));
    if (bad.has("")) for (const k of Object.keys(input)) if (!(k in libraryQuerySchema.shape)) delete input[k];
    for (const k of bad) delete input[k];
  }
  return { ...DEFAULTS, cols: [...DEFAULT_COLUMNS] };
}

function put(out: URLSearchParams, view: LibraryView, withCols: boolean) {
  for (const [k, v] of Object.entries(view)) {
    if (k === "cols") continue;
    if (v === undefined || v === "" || (Array.isArray(v) && v.length === 0)) continue;
    if ((DEFAULTS as Record<string, unknown>)[k] === v) continue;
    out.set(k, Array.isArray(v) ? v.join(",") : String(v));
  }
  if (withCols && view.cols.join(",") !== DEFAULT_COLUMNS.join(",")) out.set("cols", view.cols.join(","));
}

/** The page URL's query for a view: only what differs from the defaults, so a plain library link stays plain. */
export function libraryViewSearch(view: LibraryView): string {
  const out = new URLSearchParams();
  put(out, view, true);
  return out.toString();
}

/** The API's query for a view (the columns shown are the page's business, not the server's). */
export function libraryApiSearch(view: LibraryView): string {
  const out = new URLSearchParams();
  put(out, view, false);
  return out.toString();
}

/** A changed view: filters reset the page to the first; paging keeps the rest. */
export function withView(view: LibraryView, change: Partial<LibraryView>): LibraryView {
  const keepsPage = Object.keys(change).every((k) => k === "page" || k === "cols");
  return { ...view, ...change, page: keepsPage ? (change.page ?? view.page) : 1 };
}
