import "server-only";
import { randomUUID } from "node:crypto";
import type { Action, Resource } from "@/contracts/roles";
import { requireSession, requireWorkspaceAccess, type Signed, type WorkspaceAccess } from "../data/guard";
import { trustedOrigins } from "../env";
import { isJsonMediaType, unsupportedMediaType } from "./body";
import { isDataStoreUnavailable } from "../db/unavailable";
import { dataStoreUnavailable, errorResponse, HttpError } from "./errors";
import { describeError } from "./error-log";
import { isUploadMediaType, UPLOAD_MEDIA_TYPE } from "./upload";
import { openShareLink, type OpenShareLink } from "../data/share-links";

type RouteContext<P> = { params: Promise<P> };

/** Maps thrown errors to JSON; anything unexpected is logged (without request data) and answered without internals. */
export function toErrorResponse(error: unknown, req?: Request): Response {
  if (error instanceof HttpError) return errorResponse(error);
  if (error && typeof error === "object" && (error as { name?: string }).name === "GeometryError") {
    const e = error as { message: string; part?: string; reason?: string };
    return errorResponse(new HttpError(422, "impossible_geometry", e.message, undefined, { part: e.part, reason: e.reason }));
  }
  // The line names the route and the error, never the query string, body or query parameters (names, notes,
  // e-mail addresses); the id in the answer finds the line.
  const route = req ? `${req.method} ${new URL(req.url).pathname.slice(0, 200)}` : "(route)";
  // An outage is not a bug: one line, and a 503 the client may retry.
  if (isDataStoreUnavailable(error)) {
    console.warn(`Data store unavailable in ${route}: ${describeError(error).split("\n", 1)[0]}`);
    return errorResponse(dataStoreUnavailable());
  }
  const errorId = randomUUID();
  console.error(`Unhandled error ${errorId} in ${route}: ${describeError(error)}`);
  return errorResponse(new HttpError(500, "internal", "Something went wrong on our side; nothing was changed.", undefined, { errorId }));
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);
const TRUSTED_ORIGINS = new Set(trustedOrigins().map((o) => URL.canParse(o) ? new URL(o).origin : o));

/**
 * Refuses a state-changing request another site could have made with the user's cookie: 403 `cross_origin`
 * unless its Origin is one of the trusted origins (the list the auth routes use), 415 unless a body it
 * carries is declared `application/json` (what an HTML form or a no-cors fetch can send without a CORS
 * preflight is not). Browsers send Origin on every non-GET request (Fetch standard), so a write with a
 * cookie and no Origin is refused too, as better-auth refuses it; a write with neither cookie nor Origin
 * (a script) carries no ambient authority to forge and goes on to the session check, which answers 401.
 */
function checkWriteRequest(req: Request, body: BodyKind): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get("origin");
  if (origin === null ? req.headers.has("cookie") : !TRUSTED_ORIGINS.has(origin)) {
    throw new HttpError(403, "cross_origin", origin === null
      ? "A request that changes data must carry an Origin header naming this app."
      : "Requests that change data are accepted only from this app's own pages.");
  }
  const type = req.headers.get("content-type");
  if (body === "file") {
    // Raw bytes as application/octet-stream: not a type a form or a no-cors fetch may send either.
    if (!isUploadMediaType(type)) throw new HttpError(415, "unsupported_media_type", `Send the file's bytes as the body, with Content-Type: ${UPLOAD_MEDIA_TYPE}.`);
    return;
  }
  if (type !== null && !isJsonMediaType(type)) throw unsupportedMediaType();
}

/** What a write route's body is: JSON (every route but uploads) or a file's raw bytes. */
type BodyKind = "json" | "file";

/** The one place a handler's errors become JSON responses, after the write checks every route shares. */
function handled<P>(run: (req: Request, params: P) => Promise<Response>, body: BodyKind = "json") {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      checkWriteRequest(req, body);
      return await run(req, await ctx.params);
    } catch (error) {
      return toErrorResponse(error, req);
    }
  };
}

/** A route open to anyone (schema documents, health). Still never answers a raw 500. */
export const publicRoute = <P>(run: (req: Request, params: P) => Promise<Response>) => handled(run);

/** A route for any signed-in user. */
export function sessionRoute<P>(handler: (req: Request, signed: Signed, params: P) => Promise<Response>) {
  return handled<P>(async (req, params) => handler(req, await requireSession(req.headers), params));
}

/** A route under /api/workspaces/[workspaceId]/…: session, membership and role checked before the body runs. */
export function workspaceRoute<P extends { workspaceId: string }, R extends Resource>(
  resource: R,
  action: Action<R>,
  handler: (req: Request, access: WorkspaceAccess, params: P) => Promise<Response>,
) {
  return handled<P>(async (req, params) =>
    handler(req, await requireWorkspaceAccess(req.headers, params.workspaceId, resource, action), params),
  );
}

/** An upload under /api/workspaces/[workspaceId]/…: the same checks, with the file's raw bytes as the body. */
export function workspaceUploadRoute<P extends { workspaceId: string }, R extends Resource>(
  resource: R,
  action: Action<R>,
  handler: (req: Request, access: WorkspaceAccess, params: P) => Promise<Response>,
) {
  return handled<P>(
    async (req, params) => handler(req, await requireWorkspaceAccess(req.headers, params.workspaceId, resource, action), params),
    "file",
  );
}

/** Keeps a shared kit's answers out of search engines and shared caches. */
export const SHARE_HEADERS = { "x-robots-tag": "noindex, nofollow", "cache-control": "private, no-store", "referrer-policy": "no-referrer" } as const;

function withShareHeaders(res: Response): Response {
  for (const [k, v] of Object.entries(SHARE_HEADERS)) res.headers.set(k, v);
  return res;
}

/**
 * A route under /api/share/[token]/…: no session, the link checked on every request (an unknown, revoked
 * or expired token is one 404). What it may do is what the link grants: read, and comment when allowed.
 */
export function shareRoute<P extends { token: string }>(handler: (req: Request, link: OpenShareLink, params: P) => Promise<Response>) {
  const run = handled<P>(async (req, params) => handler(req, await openShareLink(params.token), params));
  return async (req: Request, ctx: RouteContext<P>) => withShareHeaders(await run(req, ctx));
}
