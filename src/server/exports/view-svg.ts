import "server-only";
// One view as an SVG file: the editor's drawing of it (the same scene, fitted to an 800 × 560 canvas as the
// editor fits it), with its title, the axes, a scale bar and the view's notes. Every mark carries its part
// (data-part) and kind of part (class), so a reader can pick out the lower arm or the dimensions.
import type { Scene } from "@/drawing/scene";
import { sceneMarks, type ScreenMark } from "@/drawing/screen-scene";
import { fitBox, scaleBarMm } from "@/drawing/view-transform";
import { formatLength, type LengthUnit } from "@/figures/length-unit";
import type { ExportMeta } from "./export-kit";

export const SVG_SIZE = { width: 800, height: 560 } as const;
const FIT_MARGIN_PX = 28;
const FONT = "Inter, system-ui, -apple-system, 'Segoe UI', sans-serif";

const escapeXml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const num = (v: number) => String(Math.round(v * 1000) / 1000);

function markSvg(m: ScreenMark): string {
  const common = `class="${m.layer}" data-part="${escapeXml(m.part)}"`;
  switch (m.kind) {
    case "stroke": {
      const points = m.points.map((p) => `${num(p[0])},${num(p[1])}`).join(" ");
      const attrs = [
        `stroke="${m.colour}"`,
        `stroke-width="${num(m.width)}"`,
        `fill="${m.fill ?? "none"}"`,
        m.dash ? `stroke-dasharray="${m.dash.map(num).join(" ")}"` : "",
        m.opacity !== undefined ? `opacity="${num(m.opacity)}"` : "",
        m.round ? `stroke-linecap="round" stroke-linejoin="round"` : "",
      ].filter(Boolean).join(" ");
      return `<${m.closed ? "polygon" : "polyline"} ${common} points="${points}" ${attrs}/>`;
    }
    case "circle":
      return `<circle ${common} cx="${num(m.at[0])}" cy="${num(m.at[1])}" r="${num(m.radius)}" fill="${m.fill}"${m.stroke ? ` stroke="${m.stroke}" stroke-width="${num(m.width ?? 1.5)}"` : ""}/>`;
    case "text": {
      // Aligned in its box as the canvas aligns it; one tspan a line, a line being the type's size high.
      const w = m.width ?? 0;
      const x = m.align === "center" ? m.at[0] + w / 2 : m.align === "right" ? m.at[0] + w : m.at[0];
      const anchor = m.align === "center" ? ` text-anchor="middle"` : m.align === "right" ? ` text-anchor="end"` : "";
      const lines = m.text.split("\n");
      const body = lines.length === 1 ? escapeXml(m.text) : lines.map((l, i) => `<tspan x="${num(x)}" dy="${i === 0 ? 0 : num(m.size)}">${escapeXml(l)}</tspan>`).join("");
      return `<text ${common} x="${num(x)}" y="${num(m.at[1])}" font-size="${num(m.size)}"${m.bold ? ` font-weight="bold"` : ""} fill="${m.colour}"${anchor} dominant-baseline="hanging">${body}</text>`;
    }
  }
}

export function viewSvg(scene: Scene, meta: ExportMeta, unit: LengthUnit): string {
  const { width, height } = SVG_SIZE;
  const t = fitBox(scene.box, width, height, FIT_MARGIN_PX);
  const marks = sceneMarks(scene, t, { left: 0, width });
  const bar = scaleBarMm(t.scale);
  const barPx = bar * t.scale;
  const notes = scene.notes.map((note, i) => `<text class="note" x="${width - 8}" y="${height - 8 - (scene.notes.length - 1 - i) * 14}" font-size="11" fill="#1f2937" text-anchor="end">${escapeXml(note)}</text>`);
  return [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="${FONT}" data-view="${scene.view}" data-px-per-mm="${num(t.scale)}">`,
    `<title>${escapeXml(`${scene.title} — ${meta.kitName}, revision ${meta.revision}`)}</title>`,
    `<desc>${escapeXml(`${scene.axes}. ${meta.workspaceName}. Lengths in ${unit === "in" ? "inches" : "millimetres"}; ${num(t.scale)} px per mm.`)}</desc>`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    ...marks.map(markSvg),
    `<g class="scale-bar" data-part="scale-bar"><text x="8" y="${height - 24}" font-size="11" fill="#1f2937">${escapeXml(formatLength(bar, unit, bar < 1 ? 2 : 0))}</text><polyline points="8,${height - 14} 8,${height - 8} ${num(8 + barPx)},${height - 8} ${num(8 + barPx)},${height - 14}" fill="none" stroke="#374151" stroke-width="2"/></g>`,
    `<text class="heading" x="8" y="8" font-size="12" font-weight="bold" fill="#1f2937" dominant-baseline="hanging">${escapeXml(scene.title)}<tspan font-weight="normal" fill="#4b5563"> ${escapeXml(scene.axes)}</tspan></text>`,
    ...notes,
    `</svg>`,
    "",
  ].join("\n");
}
