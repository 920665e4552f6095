"use client";
// Someone saved this kit after I opened it. I choose: take theirs (mine stays one undo away), or keep mine
// as a new kit. Closing the dialog keeps editing, with nothing saved.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { useEditor, useEditorStore } from "../store/editor-context";
import { reloadServerCopy, saveAsNewKit } from "./save-actions";
import { ModalDialog } from "@/components/ui/modal-dialog";

function when(iso: string | null): string {
  if (!iso) return "";
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? "" : ` at ${d.toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" })}`;
}

export function ConflictDialog() {
  const store = useEditorStore();
  const router = useRouter();
  const save = useEditor((s) => s.save);
  const kit = useEditor((s) => s.kit);
  const [busy, setBusy] = useState<"reload" | "copy" | null>(null);
  const open = save.status === "conflict";
  const who = open ? (save.updatedByName ?? "someone") : "";

  return (
    <ModalDialog open={open} title="This kit was saved by someone else" onClose={() => store.getState().setSave({ status: "idle" })} testId="conflict-dialog">
      {open ? (
        <>
          <p className="text-sm">
            {who} saved version {save.currentVersion}{when(save.updatedAt)}, after the version {kit.version} you started from. Your edits are not saved yet.
          </p>
          <ul className="list-disc pl-5 text-sm">
            <li><strong>Load their version</strong>: the editor shows what {who} saved; your edits stay one undo (Ctrl+Z) away.</li>
            <li><strong>Save mine as a new kit</strong>: your layout becomes a kit of its own beside this one.</li>
          </ul>
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={() => store.getState().setSave({ status: "idle" })}>Keep editing</Button>
            <Button
              variant="secondary"
              busy={busy === "reload"}
              onClick={async () => {
                setBusy("reload");
                await reloadServerCopy(store);
                setBusy(null);
              }}
            >
              Load their version
            </Button>
            <Button
              busy={busy === "copy"}
              onClick={async () => {
                setBusy("copy");
                const id = await saveAsNewKit(store);
                setBusy(null);
                if (id) router.push(`/workspaces/${kit.workspaceId}/kits/${id}`);
              }}
            >
              Save mine as a new kit
            </Button>
          </div>
        </>
      ) : null}
    </ModalDialog>
  );
}
