import "server-only";
import type { Action, Resource } from "@/contracts/roles";
import { requireSession, requireWorkspaceAccess, type Signed, type WorkspaceAccess } from "../data/guard";
import { errorResponse, HttpError } from "./errors";

type RouteContext<P> = { params: Promise<P> };

/** Maps thrown errors to JSON; anything unexpected is logged and answered without internals. */
export function toErrorResponse(error: unknown): Response {
  if (error instanceof HttpError) return errorResponse(error);
  if (error && typeof error === "object" && (error as { name?: string }).name === "GeometryError") {
    const e = error as { message: string; part?: string; reason?: string };
    return errorResponse(new HttpError(422, "impossible_geometry", e.message, undefined, { part: e.part, reason: e.reason }));
  }
  console.error("Unhandled error in route handler:", error);
  return errorResponse(new HttpError(500, "internal", "Something went wrong on our side; nothing was changed."));
}

/** The one place a handler's errors become JSON responses. */
function handled<P>(run: (req: Request, params: P) => Promise<Response>) {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      return await run(req, await ctx.params);
    } catch (error) {
      return toErrorResponse(error);
    }
  };
}

/** A route open to anyone (schema documents, health). Still never answers a raw 500. */
export const publicRoute = handled;

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
