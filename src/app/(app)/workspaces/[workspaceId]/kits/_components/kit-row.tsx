"use client";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";
import type { KitDetail, KitSummary } from "@/contracts/kits";

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function KitRow({ kit, workspaceId, canWrite }: { kit: KitSummary; workspaceId: string; canWrite: boolean }) {
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(kit.name);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const refresh = () => queryClient.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) });

  const rename = useMutation({
    mutationFn: (name: string) =>
      api<{ kit: KitDetail }>(`/api/workspaces/${workspaceId}/kits/${kit.id}`, { method: "PATCH", body: { version: kit.version, name } }),
    onSuccess: () => {
      setEditing(false);
      return refresh();
    },
    onError: (error) => {
      if (error instanceof ApiError && error.status === 409) void refresh();
    },
  });
  const remove = useMutation({
    mutationFn: () => api<void>(`/api/workspaces/${workspaceId}/kits/${kit.id}`, { method: "DELETE" }),
    onSuccess: refresh,
  });

  const submitRename = () => {
    const name = draft.trim();
    if (!name || name === kit.name) return setEditing(false);
    rename.mutate(name);
  };

  return (
    <li className="flex flex-wrap items-center gap-3 px-4 py-3" data-kit-id={kit.id}>
      <div className="min-w-0 flex-1">
        {editing ? (
          <form
            onSubmit={(e) => {
              e.preventDefault();
              submitRename();
            }}
            className="flex items-center gap-2"
          >
            <label htmlFor={`rename-${kit.id}`} className="sr-only">New name for {kit.name}</label>
            <input
              id={`rename-${kit.id}`}
              autoFocus
              value={draft}
              maxLength={120}
              onChange={(e) => setDraft(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === "Escape") {
                  setDraft(kit.name);
                  setEditing(false);
                }
              }}
              className="w-full max-w-sm rounded-md border border-ink/20 px-2 py-1 text-sm focus:border-steel focus:outline-none focus:ring-2 focus:ring-steel/30"
            />
            <Button type="submit" busy={rename.isPending} disabled={!draft.trim()}>Save</Button>
            <Button type="button" variant="ghost" onClick={() => { setDraft(kit.name); setEditing(false); }}>Cancel</Button>
          </form>
        ) : (
          <Link href={`/workspaces/${workspaceId}/kits/${kit.id}`} className="block truncate font-medium hover:text-steel hover:underline" data-testid="kit-name">{kit.name}</Link>
        )}
        {rename.isError ? <p role="alert" className="mt-1 text-xs text-red-700">{rename.error.message}</p> : null}
        {remove.isError ? <p role="alert" className="mt-1 text-xs text-red-700">{remove.error.message}</p> : null}
        <p className="mt-0.5 text-xs text-ink-muted">
          {kit.scale} · updated {dateFormat.format(new Date(kit.updatedAt))}
          {kit.createdByName ? ` · by ${kit.createdByName}` : ""} · v{kit.version}
        </p>
      </div>
      {canWrite && !editing ? (
        <div className="flex gap-2">
          {confirmDelete ? (
            <>
              <span className="text-sm text-ink-muted">Delete this kit?</span>
              <Button variant="danger" busy={remove.isPending} onClick={() => remove.mutate()}>Delete</Button>
              {/* The Delete button that had focus is gone: focus the safe choice. */}
              <Button variant="ghost" autoFocus onClick={() => setConfirmDelete(false)}>Keep</Button>
            </>
          ) : (
            <>
              <Button variant="secondary" onClick={() => { setDraft(kit.name); setEditing(true); }} aria-label={`Rename ${kit.name}`}>Rename</Button>
              <Button variant="ghost" onClick={() => setConfirmDelete(true)} aria-label={`Delete ${kit.name}`}>Delete</Button>
            </>
          )}
        </div>
      ) : null}
    </li>
  );
}
