"use client";
// The canvas views load in the browser only: Konva needs a real canvas, so they are never server-rendered.
import dynamic from "next/dynamic";

function ViewLoading({ title }: { title: string }) {
  return (
    <section aria-label={title} aria-busy="true" className="flex h-full items-center justify-center rounded-md border border-ink/15 bg-white text-xs text-ink-muted">
      Drawing the {title.toLowerCase()}…
    </section>
  );
}

export const FrontViewLoaded = dynamic(() => import("./front-view").then((m) => m.FrontView), { ssr: false, loading: () => <ViewLoading title="Front view" /> });
export const TopViewLoaded = dynamic(() => import("./top-view").then((m) => m.TopView), { ssr: false, loading: () => <ViewLoading title="Top view" /> });
export const JointSectionViewLoaded = dynamic(() => import("./joint-section-view").then((m) => m.JointSectionView), { ssr: false, loading: () => <ViewLoading title="Joint section" /> });
