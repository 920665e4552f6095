"use client";
// What an editor can do to a kit from the library: rename it, archive or restore it, or delete it. Each
// write names the version the row showed; a stale row gets the server's 409 and the list refreshes.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ModalDialog } from "@/components/ui/modal-dialog";
import type { KitDetail, KitSummary } from "@/contracts/kits";
import { api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export function KitRowActions({ kit, workspaceId }: { kit: KitSummary; workspaceId: string }) {
  const queryClient = useQueryClient();
  const [dialog, setDialog] = useState<"rename" | "delete" | null>(null);
  const [name, setName] = useState(kit.name);
  const url = `/api/workspaces/${workspaceId}/kits/${kit.id}`;
  const refresh = () => queryClient.invalidateQueries({ queryKey: queryKeys.kits(workspaceId) });
  const patch = useMutation({
    mutationFn: (body: { name?: string; archived?: boolean }) => api<{ kit: KitDetail }>(url, { method: "PATCH", body: { version: kit.version, ...body } }),
    onSuccess: () => {
      setDialog(null);
      return refresh();
    },
    onError: () => refresh(),
  });
  const remove = useMutation({ mutationFn: () => api<void>(url, { method: "DELETE" }), onSuccess: () => { setDialog(null); return refresh(); } });
  const error = patch.error ?? remove.error;

  return (
    <div className="flex justify-end gap-1">
      <Button variant="ghost" className="px-2 py-1 text-xs" onClick={() => { setName(kit.name); patch.reset(); setDialog("rename"); }} aria-label={`Rename ${kit.name}`}>Rename</Button>
      <Button variant="ghost" className="px-2 py-1 text-xs" busy={patch.isPending && dialog === null} onClick={() => patch.mutate({ archived: !kit.archivedAt })} aria-label={`${kit.archivedAt ? "Restore" : "Archive"} ${kit.name}`}>
        {kit.archivedAt ? "Restore" : "Archive"}
      </Button>
      <Button variant="ghost" className="px-2 py-1 text-xs" onClick={() => { remove.reset(); setDialog("delete"); }} aria-label={`Delete ${kit.name}`}>Delete</Button>
      {error && dialog === null ? <p role="alert" className="self-center text-xs text-red-700">{error.message}</p> : null}
      <ModalDialog open={dialog === "rename"} title={`Rename “${kit.name}”`} onClose={() => setDialog(null)} testId="rename-dialog">
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            const next = name.trim();
            if (!next || next === kit.name) return setDialog(null);
            patch.mutate({ name: next });
          }}
        >
          <TextField id={`rename-${kit.id}`} label="New name" value={name} maxLength={120} autoFocus onChange={(e) => setName(e.target.value)} error={patch.isError ? patch.error.message : undefined} />
          <div className="flex justify-end gap-2">
            <Button type="button" variant="secondary" onClick={() => setDialog(null)}>Cancel</Button>
            <Button type="submit" busy={patch.isPending} disabled={!name.trim()}>Save name</Button>
          </div>
        </form>
      </ModalDialog>
      <ModalDialog open={dialog === "delete"} title={`Delete “${kit.name}”?`} onClose={() => setDialog(null)} testId="delete-dialog">
        <p className="text-sm">The kit and all {kit.headRevision} of its revisions are removed for everyone in the workspace. Archive it instead to keep it out of the list without losing it.</p>
        {remove.isError ? <p role="alert" className="text-sm text-red-700">{remove.error.message}</p> : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" autoFocus onClick={() => setDialog(null)}>Keep</Button>
          <Button variant="danger" busy={remove.isPending} onClick={() => remove.mutate()}>Delete</Button>
        </div>
      </ModalDialog>
    </div>
  );
}
