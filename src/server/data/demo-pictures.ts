import "server-only";

import type { Layout } from "@/contracts/layout";
import type { TestOutcome } from "@/contracts/test-log";

// Pictures for the demo, drawn here (no photograph of anyone's part): a dogbone on a cutting mat beside a
// ruler, whole, worn at the pin or broken at the neck; and a pencil drawing of the front corner to put under
// the front view. SVG rendered to JPEG/PNG by sharp at seed time (loaded only then: a dev dependency).

/** A small deterministic random sequence, so the same demo draws the same pictures. */
function prng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return (s >>> 0) / 4_294_967_296;
  };
}

export interface BenchPhoto {
  readonly outcome: TestOutcome;
  readonly neckMm: number;
  readonly printed: boolean;
  readonly seed: number;
}

const PX_PER_MM = 8;

function shaftShape(p: BenchPhoto, cx: number, cy: number, fill: string): string {
  const s = PX_PER_MM;
  const half = 35.5 * s;
  const neck = (p.neckMm * s) / 2;
  const ball = 4.3 * s;
  const pin = `<rect x="-${ball + 10}" y="-5" width="${2 * ball + 20}" height="10" rx="4" fill="#9aa3ab" stroke="#4b535b" stroke-width="2"/>`;
  const end = (x: number) => `<g transform="translate(${x} 0)"><circle r="${ball}" fill="${fill}" stroke="#20262c" stroke-width="2"/>${pin}<ellipse rx="${ball * 0.45}" ry="${ball * 0.25}" cx="-${ball * 0.3}" cy="-${ball * 0.45}" fill="#ffffff" opacity="0.35"/></g>`;
  const body = `<rect x="${-half + ball}" y="${-neck}" width="${2 * (half - ball)}" height="${2 * neck}" fill="${fill}" stroke="#20262c" stroke-width="2"/>`;
  const shine = `<rect x="${-half + ball}" y="${-neck * 0.55}" width="${2 * (half - ball)}" height="${neck * 0.35}" fill="#ffffff" opacity="0.28"/>`;
  const layers = p.printed
    ? Array.from({ length: Math.floor((2 * neck) / 5) }, (_, i) => `<line x1="${-half + ball}" x2="${half - ball}" y1="${-neck + 5 * (i + 0.5)}" y2="${-neck + 5 * (i + 0.5)}" stroke="#000" stroke-opacity="0.25" stroke-width="1"/>`).join("")
    : "";
  const r = prng(p.seed);
  if (p.outcome === "broke") {
    // Split at the neck next to the left ball: a jagged face, the short piece knocked aside.
    const at = -half + ball + 10 * s;
    const jag = Array.from({ length: 7 }, (_, i) => `${at + (r() - 0.5) * 14},${-neck + (i * 2 * neck) / 6}`).join(" ");
    const clip = (left: boolean) => `<clipPath id="c${left ? "l" : "r"}${p.seed}"><polygon points="${left ? `${-half - ball - 20},${-neck - ball - 20} ${jag} ${-half - ball - 20},${neck + ball + 20}` : `${half + ball + 20},${-neck - ball - 20} ${jag} ${half + ball + 20},${neck + ball + 20}`}"/></clipPath>`;
    const whole = `${body}${shine}${layers}${end(-half)}${end(half)}`;
    return `<defs>${clip(true)}${clip(false)}</defs>
      <g transform="translate(${cx} ${cy})"><g clip-path="url(#cr${p.seed})">${whole}</g></g>
      <g transform="translate(${cx - 34} ${cy + 22}) rotate(-9)"><g clip-path="url(#cl${p.seed})">${whole}</g></g>`;
  }
  const wear = p.outcome === "worn"
    ? `<ellipse cx="${half - ball - 6}" cy="0" rx="7" ry="${neck + 1}" fill="#d8dde2" stroke="#7a828a" stroke-width="1.5"/><path d="M ${half - ball - 30} ${-neck + 3} l 18 4 M ${half - ball - 34} ${neck - 5} l 20 -3" stroke="#e8ecef" stroke-width="2"/>`
    : "";
  return `<g transform="translate(${cx} ${cy}) rotate(${(r() - 0.5) * 6})">${body}${shine}${layers}${wear}${end(-half)}${end(half)}</g>`;
}

/** A photo-like picture of the part after a run, 960 × 720. */
export function benchPhotoSvg(p: BenchPhoto): string {
  const r = prng(p.seed * 7919);
  const w = 960;
  const h = 720;
  const grid = Array.from({ length: 25 }, (_, i) => `<line x1="${i * 40}" y1="0" x2="${i * 40}" y2="${h}"/><line x1="0" y1="${i * 40}" x2="${w}" y2="${i * 40}"/>`).join("");
  const ticks = Array.from({ length: 101 }, (_, i) => `<line x1="${80 + i * PX_PER_MM}" y1="600" x2="${80 + i * PX_PER_MM}" y2="${600 + (i % 10 === 0 ? 26 : i % 5 === 0 ? 18 : 11)}"/>`).join("");
  const specks = Array.from({ length: 140 }, () => `<circle cx="${(r() * w).toFixed(1)}" cy="${(r() * h).toFixed(1)}" r="${(r() * 1.6 + 0.3).toFixed(2)}" fill="#ffffff" opacity="${(r() * 0.12).toFixed(3)}"/>`).join("");
  const fill = p.printed ? "#2b2d30" : "url(#steel)";
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">
    <defs>
      <radialGradient id="light" cx="45%" cy="40%" r="75%"><stop offset="0" stop-color="#3d6b50"/><stop offset="1" stop-color="#1f3a2b"/></radialGradient>
      <linearGradient id="steel" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#cfd5da"/><stop offset="0.5" stop-color="#8a939b"/><stop offset="1" stop-color="#5d656c"/></linearGradient>
    </defs>
    <rect width="${w}" height="${h}" fill="url(#light)"/>
    <g stroke="#9fd0b2" stroke-opacity="0.22" stroke-width="1">${grid}</g>
    <rect x="60" y="590" width="850" height="70" rx="4" fill="#d9dcdf" stroke="#8c9196"/>
    <g stroke="#30353a" stroke-width="1.5">${ticks}</g>
    <rect x="640" y="90" width="200" height="120" rx="6" fill="#f4efe1" transform="rotate(4 740 150)"/>
    <path d="M 660 130 q 20 -14 40 0 t 40 0 t 40 0 M 660 160 q 25 10 50 0 t 50 0 M 660 186 q 18 -8 36 0" stroke="#24467a" stroke-width="3" fill="none" transform="rotate(4 740 150)"/>
    ${shaftShape(p, 470, 360, fill)}
    ${specks}
  </svg>`;
}

export interface CornerDrawing {
  readonly svg: string;
  /** Where the two reference marks (the centreline at the ground, and 100 mm out along it) are in the picture, px. */
  readonly marks: readonly [{ x: number; y: number }, { x: number; y: number }];
  readonly markDistanceMm: number;
}

/**
 * A pencil drawing of a layout's front view (arms, upright, wheel, ground and centreline), drawn at 4 px/mm
 * and turned 1.5° as a crooked scan would be, with two marks 100 mm apart on the ground line to scale it by.
 */
export function cornerDrawingSvg(layout: Layout): CornerDrawing {
  const s = 4;
  const w = 1000;
  const h = 640;
  const ox = 180;
  const oy = 520;
  const turnDeg = 1.5;
  const f = layout.frontView;
  const P = (y: number, z: number) => ({ x: ox + y * s, y: oy - z * s });
  const line = (a: { x: number; y: number }, b: { x: number; y: number }, width = 4) => `<line x1="${a.x}" y1="${a.y}" x2="${b.x}" y2="${b.y}" stroke-width="${width}"/>`;
  const wc = P(f.wheelCentre.y, f.wheelCentre.z);
  const tyre = `<rect x="${wc.x - (f.tyreWidthMm * s) / 2}" y="${wc.y - f.tyreRadiusMm * s}" width="${f.tyreWidthMm * s}" height="${2 * f.tyreRadiusMm * s}" rx="${8 * s}" fill="none" stroke-width="4.5"/>`;
  const marks = [P(0, 0), P(100, 0)] as const;
  const cross = (m: { x: number; y: number }) => `<path d="M ${m.x - 18} ${m.y} h 36 M ${m.x} ${m.y - 18} v 36" stroke="#9b1c1c" stroke-width="4"/><circle cx="${m.x}" cy="${m.y}" r="11" fill="none" stroke="#9b1c1c" stroke-width="3"/>`;
  const body = [
    line(P(-40, 0), P(200, 0), 3),
    `<line x1="${ox}" y1="${oy + 40}" x2="${ox}" y2="${oy - 90 * s}" stroke-dasharray="10 6" stroke-width="2.5"/>`,
    line(P(f.lowerInner.y, f.lowerInner.z), P(f.lowerOuter.y, f.lowerOuter.z), 6),
    line(P(f.upperInner.y, f.upperInner.z), P(f.upperOuter.y, f.upperOuter.z), 6),
    line(P(f.lowerOuter.y, f.lowerOuter.z), P(f.upperOuter.y, f.upperOuter.z), 6),
    tyre,
    `<circle cx="${wc.x}" cy="${wc.y}" r="5" fill="#2d2a26"/>`,
    line(P(layout.drive.inboardJoint.y, layout.drive.inboardJoint.z), P(layout.drive.outboardJoint.y, layout.drive.outboardJoint.z), 3),
    ...[f.lowerInner, f.lowerOuter, f.upperInner, f.upperOuter].map((q) => `<circle cx="${P(q.y, q.z).x}" cy="${P(q.y, q.z).y}" r="8" fill="#f6f1e4" stroke-width="3.5"/>`),
    `<path d="M ${marks[0].x} ${marks[0].y + 40} h ${100 * s} M ${marks[0].x} ${marks[0].y + 30} v 20 M ${marks[1].x} ${marks[1].y + 30} v 20" stroke-width="1.4"/>`,
  ].join("");
  const cx = w / 2;
  const cy = h / 2;
  const rad = (turnDeg * Math.PI) / 180;
  const turn = (m: { x: number; y: number }) => ({
    x: cx + (m.x - cx) * Math.cos(rad) - (m.y - cy) * Math.sin(rad),
    y: cy + (m.x - cx) * Math.sin(rad) + (m.y - cy) * Math.cos(rad),
  });
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">
    <rect width="${w}" height="${h}" fill="#f6f1e4"/>
    <g transform="rotate(${turnDeg} ${cx} ${cy})">
      <g stroke="#1f1c19" stroke-linecap="round" fill="none">${body}</g>
      ${cross(marks[0])}${cross(marks[1])}
    </g>
  </svg>`;
  return { svg, marks: [turn(marks[0]), turn(marks[1])], markDistanceMm: 100 };
}

/** Renders an SVG to image bytes with sharp (loaded only when the demo is seeded). */
export async function renderSvg(svg: string, as: "jpeg" | "png"): Promise<Buffer> {
  const sharp = (await import("sharp")).default;
  const image = sharp(Buffer.from(svg));
  return as === "jpeg" ? image.jpeg({ quality: 82 }).toBuffer() : image.png({ compressionLevel: 9 }).toBuffer();
}
