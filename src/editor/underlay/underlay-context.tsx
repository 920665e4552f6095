"use client";
// The kit's reference underlays beside the editor store (they are not part of the layout: no revision, no
// undo): one picture per view, its placement, opacity and visibility, and the gesture under way (picking two
// points to scale it, or moving it). Editors' changes are saved; a viewer's show/hide and opacity stay local.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import type { AttachmentInfo } from "@/contracts/attachments";
import { initialPlacement, type ImagePt, type PlanePt, type Underlay, type UnderlayPlacement, type UnderlayView } from "@/contracts/underlays";
import { api, ApiError, uploadFile } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

export type UnderlayMode =
  | { readonly kind: "idle" }
  | { readonly kind: "pick"; readonly view: UnderlayView; readonly points: readonly ImagePt[] }
  | { readonly kind: "move"; readonly view: UnderlayView };

type Local = { opacity?: number; visible?: boolean; placement?: UnderlayPlacement };

export interface ViewUnderlay {
  readonly underlay: Underlay;
  readonly image: HTMLImageElement | null;
  readonly placement: UnderlayPlacement;
  readonly opacity: number;
  readonly visible: boolean;
}

export interface Underlays {
  readonly canWrite: boolean;
  readonly mode: UnderlayMode;
  readonly error: string | null;
  readonly busy: string | null;
  of(view: UnderlayView): ViewUnderlay | null;
  upload(view: UnderlayView, file: File, where: { centreMm: PlanePt; widthMm: number }): Promise<void>;
  setOpacity(view: UnderlayView, opacity: number): void;
  setVisible(view: UnderlayView, visible: boolean): void;
  /** Shows a placement while it changes (a move); `save` writes it. */
  preview(view: UnderlayView, placement: UnderlayPlacement): void;
  save(view: UnderlayView, placement: UnderlayPlacement): void;
  remove(view: UnderlayView): Promise<void>;
  setMode(mode: UnderlayMode): void;
  clearError(): void;
}

const Ctx = createContext<Underlays | null>(null);

/** The picture's natural size, read in the browser before it is sent (for its first placement). */
function naturalSize(file: File): Promise<{ width: number; height: number }> {
  return new Promise((resolve, reject) => {
    const url = URL.createObjectURL(file);
    const img = new window.Image();
    img.onload = () => {
      resolve({ width: img.naturalWidth, height: img.naturalHeight });
      URL.revokeObjectURL(url);
    };
    img.onerror = () => {
      URL.revokeObjectURL(url);
      reject(new Error("This file is not a picture the browser can show: use a JPEG, PNG or WebP image."));
    };
    img.src = url;
  });
}

function useImages(underlays: readonly Underlay[]): Record<string, HTMLImageElement> {
  const [images, setImages] = useState<Record<string, HTMLImageElement>>({});
  const urls = underlays.map((u) => u.file.url).join("|");
  useEffect(() => {
    let live = true;
    for (const u of underlays) {
      if (images[u.file.url]) continue;
      const img = new window.Image();
      img.onload = () => live && setImages((cur) => ({ ...cur, [u.file.url]: img }));
      img.src = u.file.url;
    }
    return () => {
      live = false;
    };
    // Only a new picture needs loading.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [urls]);
  return images;
}

export function UnderlayProvider({ workspaceId, kitId, canWrite, children }: { workspaceId: string; kitId: string; canWrite: boolean; children: ReactNode }) {
  const qc = useQueryClient();
  const key = queryKeys.underlays(workspaceId, kitId);
  const base = `/api/workspaces/${workspaceId}/kits/${kitId}/underlays`;
  const query = useQuery({ queryKey: key, queryFn: ({ signal }) => api<{ underlays: Underlay[] }>(base, { signal }).then((r) => r.underlays) });
  const list = useMemo(() => query.data ?? [], [query.data]);
  const images = useImages(list);
  const [local, setLocal] = useState<Partial<Record<UnderlayView, Local>>>({});
  const [mode, setMode] = useState<UnderlayMode>({ kind: "idle" });
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const timers = useRef<Partial<Record<UnderlayView, ReturnType<typeof setTimeout>>>>({});

  const replace = useCallback((u: Underlay) => {
    qc.setQueryData<Underlay[]>(key, (cur) => [...(cur ?? []).filter((x) => x.view !== u.view), u]);
  }, [qc, key]);

  const patch = useCallback(async (view: UnderlayView, changes: { placement?: UnderlayPlacement; opacity?: number; visible?: boolean }) => {
    const current = (qc.getQueryData<Underlay[]>(key) ?? []).find((u) => u.view === view);
    if (!current) return;
    try {
      const res = await api<{ underlay: Underlay }>(`${base}/${view}`, { method: "PATCH", body: { version: current.version, ...changes } });
      replace(res.underlay);
      setLocal((cur) => ({ ...cur, [view]: {} }));
    } catch (e) {
      setError(e instanceof ApiError && e.status === 409 ? "Someone else changed this underlay meanwhile: it shows their version now." : e instanceof Error ? e.message : String(e));
      setLocal((cur) => ({ ...cur, [view]: {} }));
      void qc.invalidateQueries({ queryKey: key });
    }
  }, [base, key, qc, replace]);

  const value = useMemo<Underlays>(() => ({
    canWrite,
    mode,
    error,
    busy,
    of(view) {
      const u = list.find((x) => x.view === view);
      if (!u) return null;
      const l = local[view] ?? {};
      return { underlay: u, image: images[u.file.url] ?? null, placement: l.placement ?? u.placement, opacity: l.opacity ?? u.opacity, visible: l.visible ?? u.visible };
    },
    async upload(view, file, where) {
      setError(null);
      setBusy(`Sending ${file.name}…`);
      try {
        const size = await naturalSize(file);
        const placement = initialPlacement(size, where.centreMm, where.widthMm);
        const res = await uploadFile<{ underlay: Underlay & { file: AttachmentInfo } }>(`${base}/${view}`, file, { method: "PUT", headers: { "x-underlay-placement": encodeURIComponent(JSON.stringify(placement)) } });
        replace(res.underlay);
        setLocal((cur) => ({ ...cur, [view]: {} }));
      } catch (e) {
        setError(e instanceof Error ? e.message : String(e));
      } finally {
        setBusy(null);
      }
    },
    setOpacity(view, opacity) {
      setLocal((cur) => ({ ...cur, [view]: { ...cur[view], opacity } }));
      if (!canWrite) return;
      clearTimeout(timers.current[view]);
      timers.current[view] = setTimeout(() => void patch(view, { opacity }), 400);
    },
    setVisible(view, visible) {
      setLocal((cur) => ({ ...cur, [view]: { ...cur[view], visible } }));
      if (canWrite) void patch(view, { visible });
    },
    preview(view, placement) {
      setLocal((cur) => ({ ...cur, [view]: { ...cur[view], placement } }));
    },
    save(view, placement) {
      setLocal((cur) => ({ ...cur, [view]: { ...cur[view], placement } }));
      void patch(view, { placement });
    },
    async remove(view) {
      setError(null);
      try {
        await api(`${base}/${view}`, { method: "DELETE" });
        qc.setQueryData<Underlay[]>(key, (cur) => (cur ?? []).filter((u) => u.view !== view));
        setMode({ kind: "idle" });
      } catch (e) {
        setError(e instanceof Error ? e.message : String(e));
      }
    },
    setMode,
    clearError: () => setError(null),
  }), [base, busy, canWrite, error, images, key, list, local, mode, patch, qc, replace]);

  return <Ctx.Provider value={value}>{children}</Ctx.Provider>;
}

/** The underlays, or null where the editor runs without them (compare, tests). */
export function useUnderlays(): Underlays | null {
  return useContext(Ctx);
}
