import "server-only";
import type { z } from "zod";
import { HttpError, issuePath, type FieldIssue } from "./errors";

function queryIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.slice(0, 20).flatMap((i) =>
    i.code === "unrecognized_keys"
      ? i.keys.map((key) => ({ path: key, message: "Not a parameter of this export" }))
      : [{ path: issuePath(i.path) || "(query)", message: i.message }],
  );
}

/**
 * Parses a request's query string against a schema: 422 naming each parameter that is unknown, repeated
 * or out of range, and why.
 */
export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = new URL(req.url).searchParams;
  const values: Record<string, string> = {};
  for (const key of new Set(params.keys())) {
    const all = params.getAll(key);
    if (all.length > 1) throw new HttpError(422, "invalid", `Invalid query: ${key}: give it once`, [{ path: key, message: "Give it once" }]);
    values[key] = all[0]!;
  }
  const parsed = schema.safeParse(values);
  if (parsed.success) return parsed.data;
  const fields = queryIssues(parsed.error);
  throw new HttpError(422, "invalid", `Invalid query: ${fields[0]!.path}: ${fields[0]!.message}`, fields);
}
