import "server-only";
import { z } from "zod";
import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";
import { impossibleGeometry, layoutFieldIssues, parseLayout, upgradeLayout, type Layout } from "@/contracts/layout";
import { HttpError } from "../http/errors";

/**
 * Validates a layout sent by a client (any known schema version; upgraded to the latest). 422 names each
 * field: `invalid`, or `impossible_geometry` with `part` and `reason` when valid fields do not fit together.
 */
export function requireValidLayout(doc: unknown, prefix = "layout"): Layout {
  const parsed = parseLayout(doc);
  if (parsed.ok) return parsed.layout;
  const fields = layoutFieldIssues(parsed.issues, prefix);
  const misfit = impossibleGeometry(parsed.issues);
  if (misfit) throw new HttpError(422, "impossible_geometry", `${misfit.part}: ${misfit.reason}`, fields, misfit);
  throw new HttpError(422, "invalid", `Invalid layout: ${fields[0]!.path}: ${fields[0]!.message}`, fields);
}

// In bodies: any JSON value, judged by requireValidLayout so the error paths come from the layout contract.
export const incomingLayout = z.unknown();

/** A stored layout as the API returns it: upgraded to the latest schema (older documents stay readable). */
export function readStoredLayout(stored: unknown): unknown {
  const parsed = parseLayout(stored);
  return parsed.ok ? parsed.layout : upgradeLayout(stored);
}

/** A new kit starts from the demo car's baseline corner, so the analysis has something to show at once. */
export function starterLayout(): Layout {
  return DEMO_LAYOUTS[0]!.layout;
}
