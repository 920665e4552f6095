"use client";
// Steer and travel shown in the views (they never change the layout), and a sweep that plays both.
// Viewers have these too: previewing is reading.
import { useEffect, useId, useRef } from "react";
import { Button } from "@/components/ui/button";
import { useEditor, useEditorStore } from "../store/editor-context";
import { formatLength } from "@/figures/length-unit";
import { sweepAt } from "./sweep-path";

function Slider({ label, value, min, max, step, text, onChange, testId }: {
  label: string;
  value: number;
  min: number;
  max: number;
  step: number;
  text: string;
  onChange: (v: number) => void;
  testId: string;
}) {
  const id = useId();
  return (
    <div className="flex min-w-44 flex-1 items-center gap-2">
      <label htmlFor={id} className="w-12 shrink-0 text-xs font-medium">{label}</label>
      <input
        id={id}
        data-testid={testId}
        type="range"
        min={min}
        max={max}
        step={step}
        value={value}
        aria-valuetext={text}
        onChange={(e) => onChange(Number(e.target.value))}
        className="h-1.5 flex-1 accent-steel"
      />
      <output htmlFor={id} className="w-20 shrink-0 text-right text-xs tabular-nums">{text}</output>
    </div>
  );
}

export function PreviewControls() {
  const store = useEditorStore();
  const preview = useEditor((s) => s.preview);
  const unit = useEditor((s) => s.settings.lengthUnit);
  const rackMax = useEditor((s) => (s.draft ?? s.layout).topView.steeringInput.travelMm);
  const droop = useEditor((s) => (s.draft ?? s.layout).frontView.droopTravelMm);
  const bump = useEditor((s) => (s.draft ?? s.layout).frontView.bumpTravelMm);
  const range = useRef({ rackMm: rackMax, droopMm: droop, bumpMm: bump });
  useEffect(() => {
    range.current = { rackMm: rackMax, droopMm: droop, bumpMm: bump };
  }, [rackMax, droop, bump]);

  useEffect(() => {
    if (!preview.sweeping) return;
    let frame = 0;
    const started = performance.now();
    const tick = (now: number) => {
      store.getState().setPreview(sweepAt((now - started) / 1000, range.current));
      frame = requestAnimationFrame(tick);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [preview.sweeping, store]);

  const set = (p: { rackMm?: number; travelMm?: number }) => store.getState().setPreview({ ...p, sweeping: false });
  const rackText = preview.rackMm === 0 ? "centred" : `${formatLength(Math.abs(preview.rackMm), unit, 1)} ${preview.rackMm > 0 ? "left" : "right"}`;
  const travelText = preview.travelMm === 0 ? "static" : `${formatLength(Math.abs(preview.travelMm), unit, 1)} ${preview.travelMm > 0 ? "bump" : "droop"}`;

  return (
    <div role="group" aria-label="Preview of motion" className="flex flex-wrap items-center gap-x-4 gap-y-1 border-b border-ink/10 bg-white px-3 py-1.5">
      <Slider label="Steer" testId="preview-steer" value={preview.rackMm} min={-rackMax} max={rackMax} step={rackMax / 50} text={rackText} onChange={(rackMm) => set({ rackMm })} />
      <Slider label="Travel" testId="preview-travel" value={preview.travelMm} min={-droop} max={bump} step={(droop + bump) / 50} text={travelText} onChange={(travelMm) => set({ travelMm })} />
      <div className="flex gap-1">
        <Button variant="secondary" aria-pressed={preview.sweeping} onClick={() => store.getState().setPreview({ sweeping: !preview.sweeping })}>
          {preview.sweeping ? "Stop sweep" : "Sweep"}
        </Button>
        <Button variant="ghost" onClick={() => store.getState().setPreview({ rackMm: 0, travelMm: 0, sweeping: false })} disabled={!preview.sweeping && preview.rackMm === 0 && preview.travelMm === 0}>
          Straight, static
        </Button>
      </div>
    </div>
  );
}
