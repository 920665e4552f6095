"use client";
// Makes a new kit from this kit's latest revision or an earlier one; the new kit remembers where it came from.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ModalDialog } from "@/components/ui/modal-dialog";
import type { KitDetail } from "@/contracts/kits";
import { api } from "@/lib/api-client";

export function VariantDialog({ open, onClose, workspaceId, kitId, kitName, revision }: { open: boolean; onClose: () => void; workspaceId: string; kitId: string; kitName: string; revision: number }) {
  const router = useRouter();
  const [name, setName] = useState(`${kitName} — variant`.slice(0, 120));
  const make = useMutation({
    mutationFn: () => api<{ kit: KitDetail }>(`/api/workspaces/${workspaceId}/kits/${kitId}/variants`, { method: "POST", body: { name: name.trim(), revision } }),
    onSuccess: ({ kit }) => router.push(`/workspaces/${workspaceId}/kits/${kit.id}`),
  });
  return (
    <ModalDialog open={open} title={`Make a variant of revision ${revision}`} onClose={onClose} testId="variant-dialog">
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (name.trim()) make.mutate();
        }}
      >
        <p className="text-sm">A new kit starts from revision {revision} of “{kitName}” and remembers it came from there. This kit is not changed.</p>
        <TextField id="variant-name" label="Name of the new kit" value={name} maxLength={120} autoFocus onChange={(e) => setName(e.target.value)} error={make.isError ? make.error.message : !name.trim() ? "Name is required" : undefined} />
        <div className="flex justify-end gap-2">
          <Button type="button" variant="secondary" onClick={onClose}>Cancel</Button>
          <Button type="submit" busy={make.isPending} disabled={!name.trim()}>Make the variant</Button>
        </div>
      </form>
    </ModalDialog>
  );
}
