"use client";
// The comments of the revision shown, between the views (markers, and the point a new comment pins to) and
// the comments list. The place comments come from is handed in: the workspace's routes in the editor, a
// share link's in the shared page. New comments arrive by polling (TanStack Query), so a member sees
// another's comment without reloading.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { createContext, useContext, useMemo, useState, type ReactNode } from "react";
import type { CommentRow, CommentThread, CommentView } from "@/contracts/sharing";
import { api } from "@/lib/api-client";

/** How often the list is asked again while the page is open. */
export const COMMENT_POLL_MS = 5_000;

/** Where comments are read and written. */
export interface CommentSource {
  /** The query key of the list (one per kit or share link). */
  readonly key: readonly unknown[];
  /** GET: { threads }. POST: a new comment. */
  readonly listUrl: string;
  /** PATCH (resolve/reopen) and DELETE of one comment; null where that is not offered (a share link). */
  readonly itemUrl: ((id: string) => string) | null;
  /** The reviewer's display name goes with each comment (a share link). */
  readonly needsName: boolean;
}

export type PendingPin = { readonly view: CommentView; readonly xMm: number; readonly yMm: number };

export interface CommentsState {
  readonly revision: number;
  readonly source: CommentSource;
  readonly threads: readonly CommentThread[];
  readonly status: "pending" | "error" | "success";
  readonly error: Error | null;
  /** Numbered in order of writing, so a marker and its list entry share a number. */
  readonly numberOf: (id: string) => number;
  readonly showResolved: boolean;
  setShowResolved(v: boolean): void;
  /** Picking a point on a view for a new comment. */
  readonly picking: boolean;
  setPicking(v: boolean): void;
  readonly pending: PendingPin | null;
  setPending(p: PendingPin | null): void;
  readonly selected: string | null;
  select(id: string | null): void;
  post(body: Record<string, unknown>): Promise<CommentRow>;
  setResolved(id: string, resolved: boolean): Promise<unknown>;
  remove(id: string): Promise<unknown>;
}

const Ctx = createContext<CommentsState | null>(null);

export function CommentsProvider({ source, revision, children }: { source: CommentSource; revision: number; children: ReactNode }) {
  const client = useQueryClient();
  const list = useQuery({
    queryKey: source.key,
    queryFn: ({ signal }) => api<{ threads: CommentThread[] }>(source.listUrl, { signal }),
    refetchInterval: COMMENT_POLL_MS,
    staleTime: 0,
  });
  const [showResolved, setShowResolved] = useState(false);
  const [picking, setPicking] = useState(false);
  const [pending, setPending] = useState<PendingPin | null>(null);
  const [selected, select] = useState<string | null>(null);
  const refresh = () => client.invalidateQueries({ queryKey: source.key });
  const post = useMutation({ mutationFn: (body: Record<string, unknown>) => api<{ comment: CommentRow }>(source.listUrl, { method: "POST", body }).then((r) => r.comment), onSuccess: refresh });
  const patch = useMutation({ mutationFn: ({ id, resolved }: { id: string; resolved: boolean }) => api(source.itemUrl!(id), { method: "PATCH", body: { resolved } }), onSuccess: refresh });
  const del = useMutation({ mutationFn: (id: string) => api(source.itemUrl!(id), { method: "DELETE" }), onSuccess: refresh });

  const all = list.data?.threads;
  const value = useMemo<CommentsState>(() => {
    const threads = (all ?? []).filter((t) => t.revision === revision);
    const numbers = new Map(threads.map((t, i) => [t.id, i + 1]));
    return {
      revision,
      source,
      threads,
      status: list.status,
      error: list.error,
      numberOf: (id) => numbers.get(id) ?? 0,
      showResolved,
      setShowResolved,
      picking,
      setPicking,
      pending,
      setPending,
      selected,
      select,
      post: (body) => post.mutateAsync(body),
      setResolved: (id, resolved) => patch.mutateAsync({ id, resolved }),
      remove: (id) => del.mutateAsync(id),
    };
    // The mutations' mutateAsync are stable; the rest is what the list shows.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [all, revision, source, list.status, list.error, showResolved, picking, pending, selected]);
  return <Ctx.Provider value={value}>{children}</Ctx.Provider>;
}

/** The comments beside the editor, or null where there are none (a bare editor, compare). */
export function useComments(): CommentsState | null {
  return useContext(Ctx);
}

/** The markers one view draws: the threads pinned to it (resolved ones only when shown), and the new pin. */
export function markersOf(state: CommentsState, view: CommentView) {
  return state.threads.filter((t) => t.view === view && (state.showResolved || t.resolvedAt === null));
}
