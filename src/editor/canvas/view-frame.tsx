"use client";
// One view of the corner: a canvas on the millimetre grid with zoom (wheel), pan (drag on empty space),
// fit, a scale bar, and the handles of its points. Pointer events are read here on the element (not by
// Konva, whose layers do not listen) and handed to the drag tool; each handle also has a focusable
// button over it, so Tab moves between handles and the arrow keys nudge the one focused.
import { useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { Circle, Image as KonvaImage, Layer, Line, Stage } from "react-konva";
import { movedPlacement, type UnderlayPlacement } from "@/contracts/underlays";
import { nudgeHandle } from "../commands/edit-commands";
import { handlePlanePoint, type HandleDef } from "../document/handles";
import { selectShownLayout } from "../store/editor-store";
import { useEditor, useEditorStore } from "../store/editor-context";
import { createHandleDragTool, type PointerInput } from "../tools/handle-drag-tool";
import { nudgeDelta } from "../tools/snapping";
import { useUnderlays } from "../underlay/underlay-context";
import { markersOf, useComments } from "../comments/comments-context";
import { COMMENT_VIEWS, type CommentView } from "@/contracts/sharing";
import { UnderlayControls } from "../underlay/underlay-controls";
import { pictureAttrs, pictureToScreen, screenToPicture } from "../underlay/underlay-geometry";
import { formatLength } from "@/figures/length-unit";
import { INK } from "@/drawing/drawing-colours";
import { GridShape } from "./grid-shape";
import { useElementSize } from "./use-element-size";
import { fitBox, panBy, planeToScreen, scaleBarMm, screenToPlane, zoomAt, type PlaneBox, type PlanePoint, type ScreenPoint, type ViewTransform } from "@/drawing/view-transform";

const HIT_RADIUS_PX = 10;

/** The reference picture under the drawing, placed by its underlay's placement. */
function UnderlayPicture({ image, attrs, opacity }: { image: HTMLImageElement; attrs: ReturnType<typeof pictureAttrs>; opacity: number }) {
  return <KonvaImage listening={false} image={image} x={attrs.x} y={attrs.y} rotation={attrs.rotation} scaleX={attrs.scale} scaleY={attrs.scale} opacity={opacity} perfectDrawEnabled={false} />;
}

export interface ViewFrameProps {
  readonly id: string;
  readonly title: string;
  /** Which way the plane's axes point, in words, for the caption. */
  readonly axes: string;
  readonly box: PlaneBox;
  readonly handles?: readonly HandleDef[];
  readonly children: (t: ViewTransform, size: { width: number; height: number }) => ReactNode;
  /** Text shown over the drawing's bottom edge (what binds, what is wrong). */
  readonly notes?: ReactNode;
}

export function ViewFrame({ id, title, axes, box, handles = [], children, notes }: ViewFrameProps) {
  const store = useEditorStore();
  const layout = useEditor(selectShownLayout);
  const selected = useEditor((s) => s.selectedHandle);
  const faultHandle = useEditor((s) => s.live.fault?.handleId ?? null);
  const readOnly = useEditor((s) => s.readOnly);
  const gridStepMm = useEditor((s) => s.settings.gridStepMm);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const containerRef = useRef<HTMLDivElement>(null);
  const size = useElementSize(containerRef);
  // Until the user zooms or pans, the view frames the layout as first shown, at whatever size it has.
  const [userT, setUserT] = useState<ViewTransform | null>(null);
  const [firstBox] = useState(box);
  const t = userT ?? (size.width > 0 && size.height > 0 ? fitBox(firstBox, size.width, size.height, 28) : null);
  const tRef = useRef(t);
  useEffect(() => {
    tRef.current = t;
  });
  const setT = (next: ViewTransform | ((cur: ViewTransform) => ViewTransform)) =>
    setUserT((cur) => {
      const base = cur ?? tRef.current;
      if (!base) return cur;
      return typeof next === "function" ? next(base) : next;
    });
  const [cursor, setCursor] = useState("default");
  const tool = useMemo(() => createHandleDragTool(store), [store]);
  const pan = useRef<{ from: ScreenPoint; start: ViewTransform } | null>(null);
  const [announce, setAnnounce] = useState("");
  // The reference picture under this view (front and top only), and the gesture on it under way.
  const underlays = useUnderlays();
  const uView = id === "front" || id === "top" ? id : null;
  const picture = uView && underlays ? underlays.of(uView) : null;
  const uMode = underlays?.mode;
  const picking = uMode?.kind === "pick" && uMode.view === uView ? uMode : null;
  const moving = uMode?.kind === "move" && uMode.view === uView;
  const moveDrag = useRef<{ from: PlanePoint; start: UnderlayPlacement; last: UnderlayPlacement } | null>(null);
  // Comments pinned to this view, and picking the point a new one pins to.
  const comments = useComments();
  const cView = (COMMENT_VIEWS as readonly string[]).includes(id) ? (id as CommentView) : null;
  const pinning = comments?.picking && cView ? comments : null;
  const pinAt = (plane: PlanePoint) => {
    if (!pinning || !cView) return;
    pinning.setPending({ view: cView, xMm: Math.round(plane[0] * 100) / 100, yMm: Math.round(plane[1] * 100) / 100 });
    pinning.setPicking(false);
  };

  const fit = () => size.width > 0 && setUserT(fitBox(box, size.width, size.height, 28));

  useEffect(() => {
    const el = containerRef.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      const at: ScreenPoint = [e.clientX - r.left, e.clientY - r.top];
      setUserT((cur) => {
        const base = cur ?? tRef.current;
        return base ? zoomAt(base, at, Math.exp(-e.deltaY * 0.0015)) : cur;
      });
    };
    el.addEventListener("wheel", onWheel, { passive: false });
    return () => el.removeEventListener("wheel", onWheel);
  }, []);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape") return;
      if (tool.state().kind !== "idle") tool.cancel();
      // Escape also ends picking points on, or moving, this view's underlay (not while a dialog is open).
      const m = underlays?.mode;
      if (m && m.kind !== "idle" && m.view === uView && !document.querySelector("dialog[open]")) underlays!.setMode({ kind: "idle" });
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [tool, underlays, uView]);

  // Escape also stops picking a point for a comment.
  const stopPinning = pinning?.setPicking;
  useEffect(() => {
    if (!stopPinning) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape" && !document.querySelector("dialog[open]")) stopPinning(false);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [stopPinning]);

  const screenPoints = t ? handles.map((h) => ({ h, at: planeToScreen(t, handlePlanePoint(layout, h)) })) : [];

  const hit = (p: ScreenPoint): HandleDef | null => {
    let best: HandleDef | null = null;
    let bestD = HIT_RADIUS_PX;
    for (const { h, at } of screenPoints) {
      const d = Math.hypot(at[0] - p[0], at[1] - p[1]) - (h.id === selected ? 1 : 0);
      if (d <= bestD) {
        best = h;
        bestD = d;
      }
    }
    return best;
  };

  // The view's box, read once per press: it does not move under a drag, and reading it on every move
  // would force a layout of the page's last changes in the middle of the move.
  const pressBox = useRef<DOMRect | null>(null);
  const input = (e: React.PointerEvent, cur: ViewTransform): PointerInput => {
    const r = pressBox.current ?? containerRef.current!.getBoundingClientRect();
    const screen: ScreenPoint = [e.clientX - r.left, e.clientY - r.top];
    return { screen, plane: screenToPlane(cur, screen), free: e.altKey || e.ctrlKey || e.metaKey };
  };

  const onPointerDown = (e: React.PointerEvent) => {
    if (!t || e.button !== 0) return;
    pressBox.current = containerRef.current!.getBoundingClientRect();
    const p = input(e, t);
    if (pinning) {
      pinAt(p.plane);
      return;
    }
    if (picture && underlays && uView && picking) {
      const at = screenToPicture(picture.placement, t, p.screen);
      underlays.setMode({ kind: "pick", view: uView, points: [...picking.points, at].slice(-2) });
      return;
    }
    if (picture && moving) {
      containerRef.current!.setPointerCapture(e.pointerId);
      moveDrag.current = { from: p.plane, start: picture.placement, last: picture.placement };
      setCursor("grabbing");
      return;
    }
    const h = hit(p.screen);
    containerRef.current!.setPointerCapture(e.pointerId);
    if (h) {
      tool.pointerDown(h.id, p);
      setCursor(readOnly ? "default" : "grabbing");
    } else {
      pan.current = { from: p.screen, start: t };
      setCursor("move");
    }
  };
  const onPointerMove = (e: React.PointerEvent) => {
    if (!t) return;
    const p = input(e, t);
    if (moveDrag.current && uView && underlays) {
      const m = moveDrag.current;
      m.last = movedPlacement(m.start, p.plane[0] - m.from[0], p.plane[1] - m.from[1]);
      underlays.preview(uView, m.last);
      return;
    }
    if (pan.current) {
      const { from, start } = pan.current;
      setT(panBy(start, p.screen[0] - from[0], p.screen[1] - from[1]));
    } else if (tool.state().kind !== "idle") {
      tool.pointerMove(p);
    } else {
      const over = hit(p.screen);
      setCursor(over ? (readOnly ? "pointer" : "grab") : "default");
    }
  };
  const end = (cancelled: boolean) => {
    if (moveDrag.current && uView && underlays) {
      const m = moveDrag.current;
      moveDrag.current = null;
      if (cancelled) underlays.preview(uView, m.start);
      else if (m.last !== m.start) underlays.save(uView, m.last);
      setCursor("move");
      return;
    }
    pan.current = null;
    pressBox.current = null;
    if (cancelled) tool.cancel();
    else tool.pointerUp();
    setCursor("default");
  };

  const describe = (h: HandleDef) => {
    const [u, v] = handlePlanePoint(store.getState().layout, h);
    const [un, vn] = h.view === "front" ? ["y", "z"] : ["y", "x"];
    const vv = h.view === "front" ? v : -v;
    return `${h.label}: ${un} ${formatLength(u, unit)}, ${vn} ${formatLength(vv, unit)}`;
  };

  const onHandleKey = (h: HandleDef) => (e: React.KeyboardEvent) => {
    const delta = nudgeDelta(e.key, e.shiftKey, store.getState().settings.gridStepMm);
    if (!delta) return;
    e.preventDefault();
    if (readOnly) {
      setAnnounce("This kit is read-only for you.");
      return;
    }
    const s = store.getState();
    s.commit(nudgeHandle(s.layout, h.id, delta[0], delta[1]), { coalesce: `nudge:${h.id}` });
    setAnnounce(describe(h));
  };

  const bar = t ? scaleBarMm(t.scale) : 0;
  return (
    <section aria-label={title} className="flex h-full min-h-0 flex-col overflow-hidden rounded-md border border-ink/15 bg-white">
      <header className="flex items-center gap-2 border-b border-ink/10 px-2 py-1">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink/80">{title}</h3>
        <span className="text-xs text-ink-muted">{axes}</span>
        <span className="ml-auto flex gap-1">
          {uView && underlays ? <UnderlayControls view={uView} box={box} /> : null}
          <button type="button" className="rounded px-1.5 text-xs text-ink/80 hover:bg-ink/5" aria-label={`Zoom in, ${title}`} onClick={() => t && setT(zoomAt(t, [size.width / 2, size.height / 2], 1.25))}>+</button>
          <button type="button" className="rounded px-1.5 text-xs text-ink/80 hover:bg-ink/5" aria-label={`Zoom out, ${title}`} onClick={() => t && setT(zoomAt(t, [size.width / 2, size.height / 2], 0.8))}>−</button>
          <button type="button" className="rounded px-1.5 text-xs text-ink/80 hover:bg-ink/5" onClick={fit}>Fit</button>
        </span>
      </header>
      <div
        ref={containerRef}
        data-testid={`view-${id}`}
        data-scale={t ? t.scale.toFixed(4) : undefined}
        data-ox={t ? t.ox.toFixed(2) : undefined}
        data-oy={t ? t.oy.toFixed(2) : undefined}
        className="relative min-h-0 flex-1 touch-none select-none"
        style={{ cursor: picking || pinning ? "crosshair" : moving && cursor === "default" ? "move" : cursor }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={() => end(false)}
        onPointerCancel={() => end(true)}
      >
        {t && size.width > 0 ? (
          <Stage width={size.width} height={size.height} listening={false}>
            <Layer listening={false}>
              {picture?.visible && picture.image ? <UnderlayPicture image={picture.image} attrs={pictureAttrs(picture.placement, t)} opacity={picture.opacity} /> : null}
              <GridShape t={t} width={size.width} height={size.height} stepMm={gridStepMm} />
              {children(t, size)}
            </Layer>
            <Layer listening={false}>
              {picking && picture
                ? picking.points.map((pt, i) => {
                    const [x, y] = pictureToScreen(picture.placement, t, pt);
                    return <Line key={i} listening={false} points={[x - 9, y, x + 9, y, x, y, x, y - 9, x, y + 9]} stroke={INK.fault} strokeWidth={2} />;
                  })
                : null}
              {screenPoints.map(({ h, at }) => {
                const isSel = h.id === selected;
                const isFault = h.id === faultHandle;
                return (
                  <Circle
                    key={h.id}
                    listening={false}
                    x={at[0]}
                    y={at[1]}
                    radius={isSel ? 6.5 : 5}
                    fill={isSel ? INK.handle : INK.handleFill}
                    stroke={isFault ? INK.fault : INK.handle}
                    strokeWidth={isFault ? 3 : 2}
                  />
                );
              })}
            </Layer>
          </Stage>
        ) : null}
        {screenPoints.map(({ h, at }) => (
          <button
            key={h.id}
            type="button"
            data-handle={h.id}
            aria-label={describe(h)}
            aria-pressed={h.id === selected}
            className="pointer-events-none absolute h-4 w-4 -translate-x-1/2 -translate-y-1/2 rounded-full opacity-0 focus-visible:opacity-100 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-blue-700"
            style={{ left: at[0], top: at[1] }}
            onFocus={() => store.getState().select(h.id)}
            onKeyDown={onHandleKey(h)}
          />
        ))}
        {t ? (
          <div className="pointer-events-none absolute bottom-1.5 left-2 flex flex-col items-start text-[11px] text-ink/80" aria-hidden="true">
            <span>{formatLength(bar, unit, bar < 1 ? 2 : 0)}</span>
            <span className="block h-1.5 border-x-2 border-b-2 border-ink/70" style={{ width: bar * t.scale }} />
          </div>
        ) : null}
        {notes ? <div className="pointer-events-none absolute bottom-1.5 right-2 max-w-[70%] text-right text-xs">{notes}</div> : null}
        {picking || moving ? (
          <div className="absolute left-2 top-1.5 flex items-center gap-2 rounded bg-white/90 px-1.5 py-0.5 text-xs text-ink shadow">
            <p role="status" data-testid={`underlay-hint-${id}`}>
              {picking ? (picking.points.length === 0 ? "Click the first of two points a known distance apart on the picture" : "Click the second point") : "Drag the picture to move it"}
            </p>
            {/* Its press must not reach the view, where it would pick a point or start a move. */}
            <button type="button" className="rounded border border-ink/20 px-1.5 hover:bg-ink/5" onPointerDown={(e) => e.stopPropagation()} onClick={() => underlays?.setMode({ kind: "idle" })}>
              {picking ? "Stop" : "Done"}
            </button>
          </div>
        ) : null}
        {t && comments && cView
          ? markersOf(comments, cView).map((th) => {
              const [x, y] = planeToScreen(t, [th.xMm, th.yMm]);
              const n = comments.numberOf(th.id);
              const on = comments.selected === th.id;
              return (
                <button
                  key={th.id}
                  type="button"
                  data-comment-marker={n}
                  aria-label={`Comment ${n} by ${th.authorName}${th.resolvedAt ? ", resolved" : ""}`}
                  aria-pressed={on}
                  className={`absolute flex h-5 min-w-5 -translate-x-1/2 -translate-y-full items-center justify-center rounded-full rounded-bl-none border px-1 text-[11px] font-semibold shadow focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-blue-700 ${th.resolvedAt ? "border-ink/40 bg-white text-ink" : on ? "border-amber-900 bg-amber-300 text-ink" : "border-amber-800 bg-amber-100 text-ink"}`}
                  style={{ left: x, top: y }}
                  onPointerDown={(e) => e.stopPropagation()}
                  onClick={() => comments.select(th.id)}
                >
                  {n}
                </button>
              );
            })
          : null}
        {t && comments?.pending && comments.pending.view === cView ? (
          <span
            aria-hidden="true"
            data-testid="comment-pending-pin"
            className="pointer-events-none absolute flex h-5 w-5 -translate-x-1/2 -translate-y-full items-center justify-center rounded-full rounded-bl-none border border-blue-800 bg-blue-100 text-[11px] font-semibold text-ink shadow"
            style={{ left: planeToScreen(t, [comments.pending.xMm, comments.pending.yMm])[0], top: planeToScreen(t, [comments.pending.xMm, comments.pending.yMm])[1] }}
          >
            +
          </span>
        ) : null}
        {pinning && t ? (
          <div className="absolute left-2 top-1.5 flex items-center gap-2 rounded bg-white/90 px-1.5 py-0.5 text-xs text-ink shadow">
            <p role="status" data-testid={`comment-hint-${id}`}>Click the point to comment on</p>
            <button type="button" className="rounded border border-ink/20 px-1.5 hover:bg-ink/5" onPointerDown={(e) => e.stopPropagation()} onClick={() => pinAt(screenToPlane(t, [size.width / 2, size.height / 2]))}>
              Pin at the centre
            </button>
            <button type="button" className="rounded border border-ink/20 px-1.5 hover:bg-ink/5" onPointerDown={(e) => e.stopPropagation()} onClick={() => pinning.setPicking(false)}>
              Stop
            </button>
          </div>
        ) : null}
        <p className="sr-only" aria-live="polite">{announce}</p>
      </div>
    </section>
  );
}
