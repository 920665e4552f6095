import { z } from "zod";
import type { SteerLimitReason } from "@/engine";
import { KIT_SCALES, kitTag, type KitSummary } from "./kits";
import { READOUT_KEYS, type ReadoutKey, type Targets } from "./targets";
import { isStorableText } from "./text";

// The library table's query: GET /api/workspaces/{w}/kits?… Every parameter optional; the page, the order and
// the filters are all decided on the server, so a page of 50 out of thousands costs one indexed query.

export const LIBRARY_SORTS = ["name", "scale", "author", "updatedAt", "createdAt", "headRevision", ...READOUT_KEYS] as const;
export type LibrarySort = (typeof LIBRARY_SORTS)[number];
export const LIBRARY_STATUSES = ["active", "archived", "all"] as const;
export const LIBRARY_VERDICTS = ["any", "meets", "misses"] as const;
export const LIBRARY_PAGE_SIZES = [10, 25, 50, 100] as const;
export const LOCK_LIMITS: readonly SteerLimitReason[] = ["neck-contact", "slot-limit", "rated-angle", "toggle", "input-travel"];

/** "a,b,c" → ["a", "b", "c"], each judged by `item`; an empty string is no filter. */
function csv<O>(item: z.ZodType<O, string>, field: string, max = 20) {
  return z
    .string()
    .max(2000, `${field} is too long`)
    .transform((s) => s.split(",").map((p) => p.trim()).filter((p) => p !== ""))
    .pipe(z.array(item).max(max, `${field} takes at most ${max} values`));
}

const bound = (field: string) =>
  z.coerce
    .number({ error: `${field} must be a number` })
    .refine(Number.isFinite, `${field} must be a number`)
    .refine((n) => Math.abs(n) <= 1e6, `${field} must be between -1000000 and 1000000`);

// The moments a date filter may name: PostgreSQL has no year 0, and the end of 9999-12-31 (the next day, which
// a bare "to" date reaches up to) is past the timestamps it reads back from JavaScript.
const EARLIEST_DAY = "0001-01-01";
const LATEST_DAY = "9999-12-30";
const inDayRange = (s: string) => {
  const t = Date.parse(s);
  return t >= Date.parse(`${EARLIEST_DAY}T00:00:00Z`) && t < Date.parse(`${LATEST_DAY}T00:00:00Z`) + 86_400_000;
};

const day = (field: string) =>
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}(T[\d:.]+(Z|[+-]\d{2}:\d{2})?)?$/, `${field} must be a date (YYYY-MM-DD)`)
    .refine((s) => !Number.isNaN(Date.parse(s)), `${field} must be a real date`)
    .refine(inDayRange, `${field} must be between ${EARLIEST_DAY} and ${LATEST_DAY}`);

const rangeFields = Object.fromEntries(
  READOUT_KEYS.flatMap((k) => [
    [`${k}Min`, bound(`${k}Min`).optional()],
    [`${k}Max`, bound(`${k}Max`).optional()],
  ]),
) as Record<`${ReadoutKey}${"Min" | "Max"}`, z.ZodOptional<ReturnType<typeof bound>>>;

export const libraryQuerySchema = z
  .strictObject({
    // PostgreSQL refuses U+0000 in a pattern, and no name or tag holds a control character to find.
    q: z.string().trim().max(120, "q must be at most 120 characters").refine((s) => isStorableText(s), "q must not contain control characters").optional(),
    scale: csv(z.enum(KIT_SCALES, { error: `scale must be among ${KIT_SCALES.join(", ")}` }), "scale").optional(),
    tags: csv(kitTag, "tags", 12).optional(),
    author: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, "author must be a user id").optional(),
    updatedFrom: day("updatedFrom").optional(),
    updatedTo: day("updatedTo").optional(),
    status: z.enum(LIBRARY_STATUSES, { error: `status must be one of ${LIBRARY_STATUSES.join(", ")}` }).default("active"),
    verdict: z.enum(LIBRARY_VERDICTS, { error: `verdict must be one of ${LIBRARY_VERDICTS.join(", ")}` }).default("any"),
    limitedBy: csv(z.enum(LOCK_LIMITS as [SteerLimitReason, ...SteerLimitReason[]], { error: `limitedBy must be among ${LOCK_LIMITS.join(", ")}` }), "limitedBy").optional(),
    sort: z.enum(LIBRARY_SORTS, { error: `sort must be one of ${LIBRARY_SORTS.join(", ")}` }).default("updatedAt"),
    dir: z.enum(["asc", "desc"], { error: "dir must be asc or desc" }).default("desc"),
    page: z.coerce.number({ error: "page must be a number" }).int("page must be a whole number").min(1, "page starts at 1").max(100_000, "page must be at most 100000").default(1),
    size: z.coerce.number({ error: "size must be a number" }).int("size must be a whole number").min(1, "size must be at least 1").max(100, "size must be at most 100").default(50),
    ...rangeFields,
  })
  .refine((q) => !q.updatedFrom || !q.updatedTo || Date.parse(q.updatedFrom) <= Date.parse(q.updatedTo), { path: ["updatedTo"], message: "updatedTo must not be before updatedFrom" });
export type LibraryQuery = z.infer<typeof libraryQuerySchema>;

/** The query string's parameters as the schema reads them (the first value of each). */
export function libraryQueryInput(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of params) if (!(k in out)) out[k] = v;
  return out;
}

export interface LibraryPage {
  readonly kits: KitSummary[];
  /** Kits matching the filters, over all pages. */
  readonly total: number;
  readonly page: number;
  readonly size: number;
  /** The workspace's targets (each kit's own overrides are on the kit). */
  readonly targets: Targets;
}

export interface LibraryFacets {
  readonly tags: { tag: string; count: number }[];
  readonly authors: { id: string; name: string; count: number }[];
}
