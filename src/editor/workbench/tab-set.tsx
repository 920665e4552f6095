"use client";
// Tabs with the ARIA tabs pattern: arrow keys move between tabs, only the chosen panel is mounted.
import { useId, useRef, useState, type ReactNode } from "react";

export interface TabDef {
  readonly id: string;
  readonly label: string;
  readonly content: () => ReactNode;
}

export function TabSet({ label, tabs, initial, className = "" }: { label: string; tabs: readonly TabDef[]; initial?: string; className?: string }) {
  const [active, setActive] = useState(initial ?? tabs[0]!.id);
  const base = useId();
  const refs = useRef<Record<string, HTMLButtonElement | null>>({});
  const current = tabs.find((t) => t.id === active) ?? tabs[0]!;
  const move = (delta: number) => {
    const i = tabs.findIndex((t) => t.id === current.id);
    const next = tabs[(i + delta + tabs.length) % tabs.length]!;
    setActive(next.id);
    refs.current[next.id]?.focus();
  };
  return (
    <div className={`flex min-h-0 flex-col ${className}`}>
      <div role="tablist" aria-label={label} className="flex shrink-0 flex-wrap gap-x-1 border-b border-ink/10 px-1">
        {tabs.map((t) => (
          <button
            key={t.id}
            ref={(el) => {
              refs.current[t.id] = el;
            }}
            type="button"
            role="tab"
            id={`${base}-tab-${t.id}`}
            aria-selected={t.id === current.id}
            aria-controls={`${base}-panel-${t.id}`}
            tabIndex={t.id === current.id ? 0 : -1}
            data-testid={`tab-${t.id}`}
            onClick={() => setActive(t.id)}
            onKeyDown={(e) => {
              if (e.key === "ArrowRight") move(1);
              else if (e.key === "ArrowLeft") move(-1);
              else return;
              e.preventDefault();
            }}
            className={`-mb-px border-b-2 px-2 py-1.5 text-xs font-medium ${t.id === current.id ? "border-steel text-ink" : "border-transparent text-ink/75 hover:text-ink"}`}
          >
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`${base}-panel-${current.id}`} aria-labelledby={`${base}-tab-${current.id}`} tabIndex={0} className="min-h-0 flex-1 overflow-auto p-2">
        {current.content()}
      </div>
    </div>
  );
}
