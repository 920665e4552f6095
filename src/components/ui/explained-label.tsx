"use client";
// A figure's label that explains itself: a link to the figure's entry on the methods page, with a one-line
// explanation shown while the pointer is over it or the link has keyboard focus (Escape hides it; the
// pointer can move onto it). The explanation is also the link's description for a screen reader.
import { useId, useState } from "react";

export interface ExplainedLabelProps {
  readonly label: string;
  /** One line: what the figure tells a designer. */
  readonly explain: string;
  /** The methods page entry, e.g. "/methods#steer-lock". */
  readonly href: string;
  readonly className?: string;
  readonly testId?: string;
}

export function ExplainedLabel({ label, explain, href, className, testId }: ExplainedLabelProps) {
  const id = useId();
  const [open, setOpen] = useState(false);
  return (
    <span className="relative inline-block max-w-full" onMouseEnter={() => setOpen(true)} onMouseLeave={() => setOpen(false)}>
      <a
        href={href}
        target="_blank"
        rel="noopener"
        aria-describedby={id}
        data-testid={testId}
        className={`underline decoration-dotted decoration-1 underline-offset-2 hover:decoration-solid focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-steel ${className ?? ""}`}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={(e) => {
          if (e.key === "Escape" && open) {
            e.stopPropagation();
            setOpen(false);
          }
        }}
      >
        {label}
        <span className="sr-only"> (how it is worked out; opens in a new tab)</span>
      </a>
      <span
        id={id}
        role="tooltip"
        data-open={open ? "true" : "false"}
        className={`absolute left-0 top-full z-30 mt-1 w-64 rounded-md border border-ink/15 bg-white px-2 py-1.5 text-xs font-normal normal-case leading-snug tracking-normal text-ink shadow-lg ${open ? "block" : "hidden"}`}
      >
        {explain}
      </span>
    </span>
  );
}

/** The methods page entry of a key. */
export function methodHref(key: string): string {
  return `/methods#${key}`;
}
