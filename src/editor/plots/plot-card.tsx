"use client";
// The frame every plot sits in: a figure named by its caption, with an "out of date" mark (words and a
// dashed amber border, never a faded plot: faded text would fall below AA contrast).
import { useId, type ReactNode } from "react";

export interface PlotCardProps {
  readonly title: string;
  /** True when the figures are not of the layout on screen (a newer edit computing, or a fault). */
  readonly stale?: boolean;
  /** Why it is out of date, shown after the mark (default: the figures are of an earlier layout). */
  readonly staleNote?: string;
  /** A line under the title: what the plot shows, in words. */
  readonly description?: string;
  readonly testId?: string;
  /** Gets the caption's id, for the chart or svg to name itself by (aria-labelledby). */
  readonly children: ReactNode | ((captionId: string) => ReactNode);
}

export function PlotCard({ title, stale = false, staleNote, description, testId, children }: PlotCardProps) {
  const captionId = useId();
  const descriptionId = useId();
  return (
    <figure
      data-testid={testId}
      data-stale={stale ? "true" : "false"}
      aria-labelledby={captionId}
      aria-describedby={description ? descriptionId : undefined}
      className={`rounded-lg border bg-white p-3 ${stale ? "border-dashed border-amber-600" : "border-ink/10"}`}
    >
      <figcaption className="mb-2 flex flex-wrap items-baseline gap-x-2">
        <span id={captionId} className="text-sm font-medium text-ink">{title}</span>
        {stale ? (
          <span data-testid="plot-stale" className="rounded bg-amber-50 px-1.5 text-xs font-medium text-amber-900">
            Out of date{staleNote ? `: ${staleNote}` : ""}
          </span>
        ) : null}
        {description ? <span id={descriptionId} className="basis-full text-xs text-ink-muted">{description}</span> : null}
      </figcaption>
      {typeof children === "function" ? children(captionId) : children}
    </figure>
  );
}

/** What a plot shows when it has nothing to plot. */
export function PlotEmpty({ children }: { children: ReactNode }) {
  return <p data-testid="plot-empty" className="flex h-40 items-center justify-center rounded bg-paper px-3 text-center text-sm text-ink-muted">{children}</p>;
}
