import type { AnalysisResult } from "@/engine";
import type { Layout } from "./layout";
import type { Targets } from "./targets";

// A comparison of two to four kits or revisions has its own URL: /workspaces/{w}/compare?items=A,B@3,C
// (a kit id alone is its head revision; `@n` picks revision n). Any member can open what another sends.

export const COMPARE_MIN = 2;
export const COMPARE_MAX = 4;

export type CompareRef = { readonly kitId: string; readonly revision: number | null };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function parseCompareItems(raw: string): { ok: true; items: CompareRef[] } | { ok: false; message: string } {
  const parts = raw.split(",").map((p) => p.trim()).filter((p) => p !== "");
  if (parts.length < COMPARE_MIN || parts.length > COMPARE_MAX) return { ok: false, message: `name ${COMPARE_MIN} to ${COMPARE_MAX} kits or revisions, comma-separated (got ${parts.length})` };
  const items: CompareRef[] = [];
  for (const p of parts) {
    const [id, rev, extra] = p.split("@");
    if (extra !== undefined || !UUID.test(id ?? "")) return { ok: false, message: `“${p.slice(0, 60)}” is not a kit id, or a kit id with @revision` };
    let revision: number | null = null;
    if (rev !== undefined) {
      if (!/^[1-9]\d{0,8}$/.test(rev)) return { ok: false, message: `“${p.slice(0, 60)}”: the revision after @ must be a whole number from 1` };
      revision = Number(rev);
    }
    const kitId = id!.toLowerCase();
    if (items.some((i) => i.kitId === kitId && i.revision === revision)) return { ok: false, message: `“${p.slice(0, 60)}” is named twice` };
    items.push({ kitId, revision });
  }
  return { ok: true, items };
}

export const compareItemText = (r: CompareRef) => (r.revision === null ? r.kitId : `${r.kitId}@${r.revision}`);

export function compareHref(workspaceId: string, refs: readonly CompareRef[]): string {
  return `/workspaces/${workspaceId}/compare?items=${refs.map(compareItemText).join(",")}`;
}

export interface ComparedItem {
  readonly kitId: string;
  readonly kitName: string;
  readonly scale: string;
  readonly revision: number;
  readonly isHead: boolean;
  readonly headRevision: number;
  readonly layout: Layout | null;
  readonly analysis: AnalysisResult | null;
  /** Why there is no analysis (a layout that cannot be read or solved). */
  readonly problem: string | null;
  /** The kit's effective targets (the workspace's with its overrides). */
  readonly targets: Targets;
}

export interface Comparison {
  readonly items: ComparedItem[];
  readonly workspaceTargets: Targets;
}
