"use client";
// The kit's place in the design library, beside the editor store: the targets it is judged against (the
// workspace's with the kit's overrides), whether the person may change the kit, and which revision is shown.
import { createContext, useContext, useMemo, useState, type ReactNode } from "react";
import { effectiveTargets, type TargetOverrides, type Targets } from "@/contracts/targets";

export interface KitLibraryInit {
  readonly workspaceTargets: Targets;
  readonly overrides: TargetOverrides;
  readonly canWrite: boolean;
  /** Set when an earlier revision is shown (read-only). */
  readonly viewing: { readonly revision: number; readonly note: string; readonly authorName: string | null; readonly createdAt: string } | null;
  readonly origin: { readonly kitId: string | null; readonly kitName: string | null; readonly revision: number } | null;
  readonly tags: readonly string[];
}

export interface KitLibrary extends KitLibraryInit {
  readonly targets: Targets;
  setOverrides(o: TargetOverrides): void;
  setTags(t: readonly string[]): void;
}

const Ctx = createContext<KitLibrary | null>(null);

export function KitLibraryProvider({ init, children }: { init: KitLibraryInit; children: ReactNode }) {
  const [overrides, setOverrides] = useState(init.overrides);
  const [tags, setTags] = useState(init.tags);
  const value = useMemo<KitLibrary>(
    () => ({ ...init, overrides, tags, targets: effectiveTargets(init.workspaceTargets, overrides), setOverrides, setTags }),
    [init, overrides, tags],
  );
  return <Ctx.Provider value={value}>{children}</Ctx.Provider>;
}

/** The library context, or null where the editor runs without one (tests, a bare editor). */
export function useKitLibrary(): KitLibrary | null {
  return useContext(Ctx);
}

/** The targets this kit is judged against, or null without a library context. */
export function useKitTargets(): Targets | null {
  return useContext(Ctx)?.targets ?? null;
}
