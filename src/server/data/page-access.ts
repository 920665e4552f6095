import "server-only";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { DATA_STORE_UNAVAILABLE_DIGEST } from "@/contracts/data-store";
import type { Action, Resource } from "@/contracts/roles";
import { isDataStoreUnavailable } from "../db/unavailable";
import { describeError } from "../http/error-log";
import { HttpError } from "../http/errors";
import { requireSession, requireWorkspaceAccess, type Signed, type WorkspaceAccess } from "./guard";

// Pages use the same guard as route handlers; only the way a refusal is shown differs.

/**
 * A database outage met by a page, tagged for src/app/error.tsx, which then shows the data-store state
 * (Next passes an error's own `digest` to the browser; the message never gets there in production).
 */
function pageError(error: unknown, nextPath: string): unknown {
  if (!isDataStoreUnavailable(error)) return error;
  // One line, as the route wrapper logs an outage; Next logs the thrown error again, without the driver's.
  console.warn(`Data store unavailable in page ${nextPath.split("?", 1)[0]}: ${describeError(error).split("\n", 1)[0]}`);
  return Object.assign(new Error("The data store is unavailable."), { digest: DATA_STORE_UNAVAILABLE_DIGEST });
}

export async function pageSession(nextPath: string): Promise<Signed> {
  try {
    return await requireSession(await headers());
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`);
    throw pageError(error, nextPath);
  }
}

export async function pageWorkspace<R extends Resource>(workspaceId: string, resource: R, action: Action<R>, nextPath: string): Promise<WorkspaceAccess> {
  try {
    return await requireWorkspaceAccess(await headers(), workspaceId, resource, action);
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`);
    if (error instanceof HttpError && (error.status === 403 || error.status === 404)) notFound();
    throw pageError(error, nextPath);
  }
}
