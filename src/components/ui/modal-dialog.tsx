"use client";
// A modal on the browser's own <dialog>: focus moves into it and stays there, Escape closes it.
import { useEffect, useRef, type ReactNode } from "react";

export function ModalDialog({ open, title, onClose, children, testId }: {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
  testId?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={testId ? `${testId}-title` : undefined}
      data-testid={testId}
      onClose={onClose}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-ink/20 bg-white p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      {open ? (
        <div className="flex flex-col gap-3 p-4">
          <h2 id={testId ? `${testId}-title` : undefined} className="text-lg font-semibold">{title}</h2>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
