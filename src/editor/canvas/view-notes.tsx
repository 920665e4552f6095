"use client";
// What the views say over the drawing: the fault (the part to blame, in red) and what binds at the
// previewed steer and travel.
import { limitLabel, fmt } from "@/figures/format";
import type { PreviewBinding } from "@/drawing/preview-state";

export function FaultNote({ message }: { message: string }) {
  return <p className="rounded bg-red-50/95 px-1.5 py-0.5 font-medium text-red-800" data-testid="view-fault">{message}</p>;
}

export function bindingText(b: PreviewBinding): string | null {
  switch (b.kind) {
    case "joint":
      return `Binds (${b.wheel} wheel): ${limitLabel(b.by)} at ${fmt(b.limitDeg, 1, "°")} — joint at ${fmt(b.angleDeg, 1, "°")}`;
    case "tie-rod":
      return `Binds (${b.wheel} wheel): the tie rod cannot reach the steering arm here`;
    case "rack-end":
      return "End of rack travel";
    default:
      return null;
  }
}

export function BindingNote({ binding }: { binding: PreviewBinding }) {
  const text = bindingText(binding);
  if (!text) return null;
  const tone = binding.kind === "rack-end" ? "text-ink bg-white/90" : "text-red-800 bg-red-50/95";
  return <p className={`mt-0.5 rounded px-1.5 py-0.5 font-medium ${tone}`} data-testid="view-binding">{text}</p>;
}
