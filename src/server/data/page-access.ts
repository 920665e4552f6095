import "server-only";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import type { Action, Resource } from "@/contracts/roles";
import { HttpError } from "../http/errors";
import { requireSession, requireWorkspaceAccess, type Signed, type WorkspaceAccess } from "./guard";

// Pages use the same guard as route handlers; only the way a refusal is shown differs.

export async function pageSession(nextPath: string): Promise<Signed> {
  try {
    return await requireSession(await headers());
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`);
    throw error;
  }
}

export async function pageWorkspace<R extends Resource>(workspaceId: string, resource: R, action: Action<R>, nextPath: string): Promise<WorkspaceAccess> {
  try {
    return await requireWorkspaceAccess(await headers(), workspaceId, resource, action);
  } catch (error) {
    if (error instanceof HttpError && error.status === 401) redirect(`/sign-in?next=${encodeURIComponent(nextPath)}`);
    if (error instanceof HttpError && (error.status === 403 || error.status === 404)) notFound();
    throw error;
  }
}
