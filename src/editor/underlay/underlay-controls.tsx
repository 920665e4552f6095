"use client";
// A view's underlay controls, opened from its header: put a photo or drawing under the view, show or hide it,
// fade it, scale and level it by two points a known distance apart, move it, remove it.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { ACCEPTED_IMAGE_TYPES, formatBytes } from "@/contracts/attachments";
import { imageToPlane, placeByPicks, UNDERLAY_VIEW_LABELS, type ImagePt, type UnderlayView } from "@/contracts/underlays";
import { UPLOAD_LIMIT_BYTES } from "../test-log/run-form";
import type { PlaneBox } from "@/drawing/view-transform";
import { useUnderlays } from "./underlay-context";
import { VIEW_AXES } from "./underlay-geometry";

const num = (t: string) => (t.trim() === "" ? Number.NaN : Number(t));
const round = (v: number, d = 1) => Number(v.toFixed(d));

/** Asks the distance between the two picked points (and where the first lies), then scales the picture by them. */
function ScaleDialog({ view, points, onClose }: { view: UnderlayView; points: readonly ImagePt[]; onClose: () => void }) {
  const u = useUnderlays()!;
  const id = useId();
  const shown = u.of(view);
  const axes = VIEW_AXES[view];
  const aPlane = shown && points[0] ? imageToPlane(shown.placement, points[0]) : [0, 0];
  const aCar = axes.fromPlane(aPlane[0], aPlane[1]);
  const [f, setF] = useState({
    ax: String(round(points[0]?.x ?? 0)), ay: String(round(points[0]?.y ?? 0)), bx: String(round(points[1]?.x ?? 0)), by: String(round(points[1]?.y ?? 0)),
    distance: "", level: true, move: false, atU: String(round(aCar[0])), atV: String(round(aCar[1])),
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (k: keyof typeof f) => (e: { target: { value: string } }) => setF((cur) => ({ ...cur, [k]: e.target.value }));
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const errs: Record<string, string> = {};
    const a = { x: num(f.ax), y: num(f.ay) };
    const b = { x: num(f.bx), y: num(f.by) };
    const d = num(f.distance);
    for (const [k, v] of Object.entries({ ax: a.x, ay: a.y, bx: b.x, by: b.y })) if (!Number.isFinite(v)) errs[k] = "Enter a pixel position";
    if (!Number.isFinite(d) || d <= 0) errs.distance = "Enter the real distance between the two points, in mm (more than 0)";
    else if (d > 10_000) errs.distance = "At most 10 000 mm";
    if (!errs.ax && !errs.bx && Math.hypot(b.x - a.x, b.y - a.y) < 1) errs.bx = "The two points must be at least a pixel apart";
    const at = f.move ? axes.toPlane(num(f.atU), num(f.atV)) : undefined;
    if (at && !at.every(Number.isFinite)) errs.atU = "Enter both coordinates, in mm";
    setErrors(errs);
    if (Object.keys(errs).length || !shown) return;
    u.save(view, placeByPicks(shown.placement, a, b, d, { level: f.level, aAtMm: at }));
    onClose();
  };
  return (
    <form className="flex flex-col gap-3" onSubmit={submit} noValidate>
      <p className="text-sm">The picture is scaled so the two points lie this far apart; the first point stays where it is, unless you place it.</p>
      <div className="grid grid-cols-2 gap-2">
        <TextField id={`${id}-ax`} label="First point, picture x (px)" inputMode="decimal" value={f.ax} onChange={set("ax")} error={errors.ax} />
        <TextField id={`${id}-ay`} label="First point, picture y (px)" inputMode="decimal" value={f.ay} onChange={set("ay")} error={errors.ay} />
        <TextField id={`${id}-bx`} label="Second point, picture x (px)" inputMode="decimal" value={f.bx} onChange={set("bx")} error={errors.bx} />
        <TextField id={`${id}-by`} label="Second point, picture y (px)" inputMode="decimal" value={f.by} onChange={set("by")} error={errors.by} />
      </div>
      <TextField id={`${id}-distance`} label="Distance between them (mm)" inputMode="decimal" value={f.distance} onChange={set("distance")} error={errors.distance} autoFocus />
      <label className="flex items-center gap-2 text-sm"><input type="checkbox" checked={f.level} onChange={(e) => setF((cur) => ({ ...cur, level: e.target.checked }))} /> Level them: the line from the first to the second point runs along {axes.u}</label>
      <label className="flex items-center gap-2 text-sm"><input type="checkbox" checked={f.move} onChange={(e) => setF((cur) => ({ ...cur, move: e.target.checked }))} /> Place the first point at a known position</label>
      {f.move ? (
        <div className="grid grid-cols-2 gap-2">
          <TextField id={`${id}-atu`} label={`${axes.u} (mm)`} inputMode="decimal" value={f.atU} onChange={set("atU")} error={errors.atU} />
          <TextField id={`${id}-atv`} label={`${axes.v} (mm)`} inputMode="decimal" value={f.atV} onChange={set("atV")} />
        </div>
      ) : null}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onClose}>Cancel</Button>
        <Button type="submit">Scale the picture</Button>
      </div>
    </form>
  );
}

export function UnderlayControls({ view, box }: { view: UnderlayView; box: PlaneBox }) {
  const u = useUnderlays();
  const [open, setOpen] = useState(false);
  const [tooBig, setTooBig] = useState<string | null>(null);
  const id = useId();
  if (!u) return null;
  const shown = u.of(view);
  const label = UNDERLAY_VIEW_LABELS[view];
  const picking = u.mode.kind === "pick" && u.mode.view === view ? u.mode : null;
  const moving = u.mode.kind === "move" && u.mode.view === view;
  const onFile = (e: React.ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0];
    e.target.value = "";
    setTooBig(null);
    if (!file) return;
    if (file.size > UPLOAD_LIMIT_BYTES) {
      setTooBig(`${file.name} is ${formatBytes(file.size)}: larger than ${formatBytes(UPLOAD_LIMIT_BYTES)}. Scale it down first.`);
      return;
    }
    // A first placement over the drawing: centred on what the view shows, as wide as the layout.
    void u.upload(view, file, { centreMm: [(box.minU + box.maxU) / 2, (box.minV + box.maxV) / 2], widthMm: Math.max(box.maxU - box.minU, 20) * 1.2 });
  };
  return (
    <div className="relative">
      <button type="button" className={`rounded px-1.5 text-xs hover:bg-ink/5 ${shown ? "text-steel" : "text-ink/80"}`} aria-expanded={open} aria-controls={`${id}-panel`} onClick={() => setOpen((o) => !o)} data-testid={`underlay-button-${view}`}>
        Underlay{shown ? (shown.visible ? " ●" : " ○") : ""}
      </button>
      {open ? (
        <div id={`${id}-panel`} role="group" aria-label={`Underlay of the ${label.toLowerCase()}`} data-testid={`underlay-panel-${view}`} className="absolute right-0 top-6 z-20 flex w-72 flex-col gap-2 rounded-md border border-ink/20 bg-white p-2 text-xs shadow-lg">
          {shown ? (
            <>
              <p className="truncate" title={shown.underlay.file.fileName}>{shown.underlay.file.fileName} <span className="text-ink-muted">({formatBytes(shown.underlay.file.byteSize)})</span></p>
              <p className="text-ink-muted">
                {shown.placement.picks ? `Scaled by two points ${shown.placement.picks.distanceMm} mm apart (${(1 / shown.placement.mmPerPx).toFixed(2)} px/mm).` : "Not to scale yet: scale it by two points a known distance apart."}
              </p>
              <label className="flex items-center gap-2"><input type="checkbox" checked={shown.visible} onChange={(e) => u.setVisible(view, e.target.checked)} data-testid={`underlay-visible-${view}`} /> Show the underlay</label>
              <label className="flex items-center gap-2">
                Opacity
                <input type="range" min={0.05} max={1} step={0.05} value={shown.opacity} onChange={(e) => u.setOpacity(view, Number(e.target.value))} className="flex-1" aria-valuetext={`${Math.round(shown.opacity * 100)} %`} />
                <span className="w-9 text-right tabular-nums">{Math.round(shown.opacity * 100)} %</span>
              </label>
              {u.canWrite ? (
                <div className="flex flex-wrap gap-1.5">
                  <Button variant="secondary" className="px-2 py-1 text-xs" aria-pressed={!!picking} onClick={() => {
                    u.setMode(picking ? { kind: "idle" } : { kind: "pick", view, points: [] });
                    // Out of the way of the picture: the points are picked on the view.
                    setOpen(false);
                  }}>{picking ? "Stop picking" : "Scale by two points"}</Button>
                  <Button variant="secondary" className="px-2 py-1 text-xs" aria-pressed={moving} onClick={() => {
                    u.setMode(moving ? { kind: "idle" } : { kind: "move", view });
                    setOpen(false);
                  }}>{moving ? "Done moving" : "Move"}</Button>
                  <Button variant="ghost" className="px-2 py-1 text-xs text-red-800" onClick={() => void u.remove(view)}>Remove</Button>
                </div>
              ) : (
                <p className="text-ink-muted">Showing and fading are for you only; editors place the picture.</p>
              )}
            </>
          ) : (
            <p className="text-ink-muted">No picture under the {label.toLowerCase()}.</p>
          )}
          {u.canWrite ? (
            <label className="flex flex-col gap-1">
              <span>{shown ? "Replace it with another picture" : "Put a photo or drawing under this view"}</span>
              <input type="file" accept={Object.keys(ACCEPTED_IMAGE_TYPES).join(",")} onChange={onFile} data-testid={`underlay-file-${view}`} className="text-xs file:mr-2 file:rounded file:border file:border-ink/20 file:bg-white file:px-2 file:py-0.5" />
              <span className="text-ink-muted">JPEG, PNG or WebP, up to {formatBytes(UPLOAD_LIMIT_BYTES)}; a drawing as a picture (export it as PNG).</span>
            </label>
          ) : null}
          {u.busy ? <p role="status" className="text-ink-muted">{u.busy}</p> : null}
          {u.error || tooBig ? <p role="alert" className="text-red-700">{tooBig ?? u.error}</p> : null}
        </div>
      ) : null}
      <ModalDialog open={!!picking && picking.points.length >= 2} title={`Scale the underlay of the ${label.toLowerCase()}`} onClose={() => u.setMode({ kind: "idle" })} testId={`underlay-scale-${view}`}>
        {picking && picking.points.length >= 2 ? <ScaleDialog view={view} points={picking.points} onClose={() => u.setMode({ kind: "idle" })} /> : null}
      </ModalDialog>
    </div>
  );
}
