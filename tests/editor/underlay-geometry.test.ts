// The underlay's placement (contracts/underlays) and its drawing on the canvas (editor/underlay): pure maths,
// checked by hand-worked cases and by composing the transforms both ways.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { imageToPlane, initialPlacement, movedPlacement, placeByPicks, planeToImage, type UnderlayPlacement } from "@/contracts/underlays";
import { pictureAttrs, pictureToScreen, screenToPicture } from "@/editor/underlay/underlay-geometry";
import type { ViewTransform } from "@/drawing/view-transform";

const base: UnderlayPlacement = { anchorPx: { x: 100, y: 50 }, anchorMm: { u: 10, v: 20 }, mmPerPx: 0.5, rotationDeg: 0, picks: null };

describe("placement", () => {
  it("maps the anchor to its point, and a pixel right/down to +u/−v scaled by mm per px (hand-worked)", () => {
    expect(imageToPlane(base, { x: 100, y: 50 })).toEqual([10, 20]);
    expect(imageToPlane(base, { x: 120, y: 70 })).toEqual([20, 10]);
  });

  it("turns by rotationDeg counter-clockwise on the plane: +90° takes picture-right to plane-up", () => {
    const [u, v] = imageToPlane({ ...base, rotationDeg: 90 }, { x: 120, y: 50 });
    expect(u).toBeCloseTo(10, 12);
    expect(v).toBeCloseTo(30, 12);
  });

  it("planeToImage undoes imageToPlane for any placement", () => {
    const num = (a: number, b: number) => fc.double({ min: a, max: b, noNaN: true });
    fc.assert(
      fc.property(num(-500, 500), num(-500, 500), num(0.01, 5), num(-180, 180), num(-2000, 2000), num(-2000, 2000), (u, v, s, r, x, y) => {
        const pl = { ...base, anchorMm: { u, v }, mmPerPx: s, rotationDeg: r };
        const back = planeToImage(pl, imageToPlane(pl, { x, y }));
        expect(back.x).toBeCloseTo(x, 6);
        expect(back.y).toBeCloseTo(y, 6);
      }),
    );
  });

  it("two picks 400 px apart, 100 mm: 0.25 mm/px, and a tilted pair is levelled (a crooked scan, 1.5°)", () => {
    const tilt = (1.5 * Math.PI) / 180;
    const a = { x: 175, y: 511.5 };
    const b = { x: a.x + 400 * Math.cos(tilt), y: a.y + 400 * Math.sin(tilt) };
    const pl = placeByPicks(base, a, b, 100, { level: true, aAtMm: [0, 0] });
    expect(pl.mmPerPx).toBeCloseTo(0.25, 12);
    expect(pl.rotationDeg).toBeCloseTo(1.5, 12);
    const [bu, bv] = imageToPlane(pl, b);
    expect(bu).toBeCloseTo(100, 9);
    expect(bv).toBeCloseTo(0, 9);
    expect(pl.picks).toEqual({ aPx: a, bPx: b, distanceMm: 100 });
  });

  it("without levelling keeps the turn, and leaves the first point where it was", () => {
    const turned = { ...base, rotationDeg: 12 };
    const a = { x: 30, y: 40 };
    const before = imageToPlane(turned, a);
    const pl = placeByPicks(turned, a, { x: 130, y: 40 }, 20);
    expect(pl.rotationDeg).toBe(12);
    expect(pl.mmPerPx).toBeCloseTo(0.2, 12);
    const after = imageToPlane(pl, a);
    expect(after[0]).toBeCloseTo(before[0], 9);
    expect(after[1]).toBeCloseTo(before[1], 9);
  });

  it("a first placement centres the picture at the given width; a move shifts the anchor", () => {
    const pl = initialPlacement({ width: 800, height: 600 }, [50, 30], 200);
    expect(pl).toMatchObject({ anchorPx: { x: 400, y: 300 }, anchorMm: { u: 50, v: 30 }, mmPerPx: 0.25, rotationDeg: 0, picks: null });
    expect(movedPlacement(pl, 5, -2).anchorMm).toEqual({ u: 55, v: 28 });
  });
});

describe("on the canvas", () => {
  const t: ViewTransform = { scale: 3, ox: 200, oy: 400 };

  it("Konva's top-left, turn and scale put every corner where the transforms do", () => {
    const pl = { ...base, rotationDeg: 30 };
    const k = pictureAttrs(pl, t);
    const r = (k.rotation * Math.PI) / 180;
    // Konva: screen = (x, y) + R(rotation) · scale · p, R clockwise on a y-down screen.
    for (const p of [{ x: 0, y: 0 }, { x: 640, y: 0 }, { x: 0, y: 480 }, { x: 640, y: 480 }]) {
      const konva = [k.x + k.scale * (p.x * Math.cos(r) - p.y * Math.sin(r)), k.y + k.scale * (p.x * Math.sin(r) + p.y * Math.cos(r))];
      const expected = pictureToScreen(pl, t, p);
      expect(konva[0]).toBeCloseTo(expected[0], 9);
      expect(konva[1]).toBeCloseTo(expected[1], 9);
    }
    expect(k.scale).toBeCloseTo(1.5, 12);
  });

  it("a click on the screen finds the picture pixel under it", () => {
    const pl = { ...base, rotationDeg: -20, mmPerPx: 0.3 };
    const p = screenToPicture(pl, t, pictureToScreen(pl, t, { x: 222, y: 111 }));
    expect(p.x).toBeCloseTo(222, 9);
    expect(p.y).toBeCloseTo(111, 9);
  });
});
