"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";

/** Copies the page's own address, so a member can send the comparison to another. */
export function CopyLinkButton() {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  return (
    <span className="flex items-center gap-2">
      <Button
        variant="secondary"
        onClick={() => {
          navigator.clipboard.writeText(window.location.href).then(() => setState("copied"), () => setState("failed"));
        }}
      >
        Copy link
      </Button>
      <span role="status" className="text-xs text-ink-muted">{state === "copied" ? "Link copied" : state === "failed" ? "Copy the address from the address bar" : ""}</span>
    </span>
  );
}
