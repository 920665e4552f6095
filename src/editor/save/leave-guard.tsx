"use client";
// Unsaved edits are not lost by leaving: the browser asks before unloading the page, and a click on a
// link inside the app is held (caught before Next's router sees it) until the designer confirms.
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { selectDirty } from "../store/editor-store";
import { useEditor, useEditorStore } from "../store/editor-context";
import { ModalDialog } from "@/components/ui/modal-dialog";

export function LeaveGuard() {
  const store = useEditorStore();
  const router = useRouter();
  const dirty = useEditor(selectDirty);
  const [pending, setPending] = useState<string | null>(null);
  const allowed = useRef(false);

  useEffect(() => {
    const isDirty = () => !allowed.current && selectDirty(store.getState());
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (!isDirty()) return;
      e.preventDefault();
      e.returnValue = "";
    };
    const onClick = (e: MouseEvent) => {
      if (e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
      const a = (e.target as Element | null)?.closest?.("a[href]");
      if (!(a instanceof HTMLAnchorElement) || a.target === "_blank" || a.hasAttribute("download")) return;
      const url = new URL(a.href, window.location.href);
      if (url.origin !== window.location.origin || (url.pathname === window.location.pathname && url.hash)) return;
      if (!isDirty()) return;
      e.preventDefault();
      e.stopPropagation();
      setPending(url.pathname + url.search + url.hash);
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    document.addEventListener("click", onClick, true);
    return () => {
      window.removeEventListener("beforeunload", onBeforeUnload);
      document.removeEventListener("click", onClick, true);
    };
  }, [store]);

  return (
    <ModalDialog open={pending !== null && dirty} title="Leave without saving?" onClose={() => setPending(null)} testId="leave-dialog">
      <p className="text-sm">This layout has changes that are not saved. Leaving the editor discards them.</p>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={() => setPending(null)}>Stay and keep editing</Button>
        <Button
          variant="danger"
          onClick={() => {
            allowed.current = true;
            const href = pending;
            setPending(null);
            if (href) router.push(href);
          }}
        >
          Leave and discard
        </Button>
      </div>
    </ModalDialog>
  );
}
