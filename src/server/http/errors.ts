import type { z } from "zod";
import { DATA_STORE_RETRY_AFTER_S, DATA_STORE_UNAVAILABLE_CODE, DATA_STORE_UNAVAILABLE_MESSAGE } from "@/contracts/data-store";

export type FieldIssue = { path: string; message: string };

/** An error that maps to an HTTP status and a JSON body `{ error: { code, message, fields? } }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldIssue[],
    readonly extra?: Record<string, unknown>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const unauthorized = () => new HttpError(401, "unauthenticated", "Sign in to continue.");
export const forbidden = (message = "Your role in this workspace does not allow that.") =>
  new HttpError(403, "forbidden", message);
export const notFound = (what: string) => new HttpError(404, "not_found", `${what} was not found.`);

/** The database cannot be reached (stopped, restarting, unreachable): a retry may succeed, nothing was written. */
export const dataStoreUnavailable = () =>
  new HttpError(503, DATA_STORE_UNAVAILABLE_CODE, DATA_STORE_UNAVAILABLE_MESSAGE, undefined, undefined, {
    "retry-after": String(DATA_STORE_RETRY_AFTER_S),
  });

/** Dotted path with [n] for array indices, the form the README documents. */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((acc, key) => {
    if (typeof key === "number") return `${acc}[${key}]`;
    const k = String(key);
    return acc ? `${acc}.${k}` : k;
  }, "");
}

export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.slice(0, 50).map((i) => ({ path: issuePath(i.path) || "(body)", message: i.message }));
}

export function invalid(error: z.ZodError, what = "body"): HttpError {
  const fields = fieldIssues(error);
  const first = fields[0];
  return new HttpError(422, "invalid", `Invalid ${what}: ${first ? `${first.path}: ${first.message}` : "see fields"}`, fields);
}

export function errorResponse(error: HttpError): Response {
  const body = { error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}), ...error.extra } };
  return Response.json(body, { status: error.status, headers: error.headers });
}
