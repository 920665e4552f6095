import { act, fireEvent, render, renderHook, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { analyzeLayout, neckTradeoff, type AnalysisResult, type EnvelopeResult } from "@/engine";
import { EditorPlots } from "@/editor/plots/editor-plots";
import { envelopeCells, limitContour, lockLines } from "@/editor/plots/envelope-map-geometry";
import { ackermannPlotRows } from "@/editor/plots/ackermann-plot";
import { neckPickTestId } from "@/editor/plots/neck-tradeoff-plot";
import { chartValue, figureText } from "@/editor/plots/plot-data";
import { travelPlotRows } from "@/editor/plots/travel-plot";
import { EditorProvider, useEditorHeldWhileDragging, useEditorStore } from "@/editor/store/editor-context";
import { undo, type EditorState, type EditorStore } from "@/editor/store/editor-store";
import { setNeckDiameter } from "@/editor/commands/edit-commands";
import { KIT } from "./editor-fixtures";

const selectLiveAnalysis = (s: EditorState) => s.live.analysis;

// One analysis of the demo baseline on a small grid, shared by the tests (the engine is checked elsewhere).
const GRID = { travelSteps: 9, steerSteps: 17 };
const ANALYSIS: AnalysisResult = analyzeLayout(TARNWICK_10_BASE, GRID);
const TRADEOFF = neckTradeoff(TARNWICK_10_BASE, { grid: { travelSteps: 5, steerSteps: 9 } });

/** A synthetic envelope: joint angle = 2·steer + travel/10 on a regular grid, so the contour is known. */
function linearEnvelope(): EnvelopeResult {
  const travelMm = [-10, 0, 10];
  const rack = [-4, -2, 0, 2, 4];
  const road = travelMm.map(() => rack.map((r) => r * 5)); // steer = 5 × rack, deg
  const joint = travelMm.map((t) => rack.map((r) => 2 * (r * 5) + t / 10));
  return { travelMm, rackMm: rack, leftRoadWheelDeg: road, jointAngleDeg: joint } as unknown as EnvelopeResult;
}

describe("plot data", () => {
  it("chartValue and figureText never give NaN: a gap or a dash instead, and no negative zero", () => {
    expect(chartValue(Number.NaN)).toBeNull();
    expect(chartValue(Number.POSITIVE_INFINITY)).toBeNull();
    expect(chartValue(undefined)).toBeNull();
    expect(Object.is(chartValue(-0.0001, 2), 0)).toBe(true);
    expect(chartValue(1.23456, 2)).toBe(1.23);
    expect(figureText(Number.NaN, 1)).toBe("—");
    expect(figureText(-0.04, 1)).toBe("0.0");
    expect(figureText(12.345, 1, "°")).toBe("12.3°");
  });

  it("the travel rows follow the analysis, in mm and in inches (25.4 mm to the inch, exact by definition)", () => {
    const mm = travelPlotRows(ANALYSIS, "mm");
    const inch = travelPlotRows(ANALYSIS, "in");
    expect(mm).toHaveLength(ANALYSIS.travel.length);
    ANALYSIS.travel.forEach((t, k) => {
      expect(mm[k]!.camber).toBeCloseTo(t.camberDeg, 3);
      expect(mm[k]!.travel).toBeCloseTo(t.travelMm, 2);
      expect(inch[k]!.travel).toBeCloseTo(t.travelMm / 25.4, 4);
    });
  });

  it("the Ackermann rows hold the ideal relation cot δo − cot δi = w/L (Gillespie, Fundamentals of Vehicle Dynamics, 1992, ch. 6)", () => {
    const rows = ackermannPlotRows(ANALYSIS);
    const { kingpinTrackMm: w, wheelbaseMm: L } = ANALYSIS.ackermann;
    const cot = (deg: number) => 1 / Math.tan((deg * Math.PI) / 180);
    const turning = rows.filter((r) => (r.inner ?? 0) > 2);
    expect(turning.length).toBeGreaterThan(3);
    for (const r of turning) {
      expect(cot(r.ideal!) - cot(r.inner!)).toBeCloseTo(w / L, 2);
      expect(r.parallel).toBe(r.inner);
    }
    // Sorted by inner angle, so the line is drawn left to right.
    const inner = rows.map((r) => r.inner!);
    expect([...inner].sort((a, b) => a - b)).toEqual(inner);
  });
});

describe("the envelope map's geometry", () => {
  it("the limit contour of a linear field lies exactly where the field equals the limit", () => {
    const env = linearEnvelope();
    const limit = 13; // 2·steer + travel/10 = 13
    const segments = limitContour(env, limit);
    expect(segments.length).toBeGreaterThan(0);
    for (const seg of segments) for (const [steer, travel] of seg) expect(2 * steer + travel / 10).toBeCloseTo(limit, 9);
    // A limit above every value has no contour.
    expect(limitContour(env, 1000)).toHaveLength(0);
  });

  it("each solved point is one cell, edges halfway to its neighbours; an unsolved point has none", () => {
    const env = linearEnvelope();
    (env.jointAngleDeg as (number | null)[][])[1]![2] = null;
    const cells = envelopeCells(env);
    expect(cells).toHaveLength(3 * 5 - 1);
    const middle = cells.find((c) => c.i === 1 && c.j === 1)!;
    expect([middle.x0, middle.x1, middle.y0, middle.y1]).toEqual([-15, -5, -5, 5]);
    const corner = cells.find((c) => c.i === 0 && c.j === 0)!;
    expect([corner.x0, corner.x1, corner.y0, corner.y1]).toEqual([-25, -15, -15, -5]);
  });

  it("the lock lines: the left wheel is inner in a left turn (+) and outer in a right turn (−), by travel", () => {
    const lines = lockLines(ANALYSIS.steerLock.perTravel);
    const rows = [...ANALYSIS.steerLock.perTravel].sort((a, b) => a.travelMm - b.travelMm);
    expect(lines.leftTurn).toEqual(rows.map((l) => [l.innerDeg, l.travelMm]));
    expect(lines.rightTurn).toEqual(rows.map((l) => [-l.outerDeg, l.travelMm]));
  });
});

function renderPlots(readOnly = false) {
  let store: EditorStore | null = null;
  function Probe() {
    store = useEditorStore();
    return null;
  }
  const view = render(
    <EditorProvider init={{ kit: KIT, layout: TARNWICK_10_BASE, readOnly, lengthUnit: "mm", analysis: ANALYSIS, tradeoff: TRADEOFF }}>
      <Probe />
      <EditorPlots />
    </EditorProvider>,
  );
  act(() => store!.getState().setLive({ quality: "full", stale: false }));
  return { ...view, store: store! };
}

describe("the editor's plots", () => {
  it("the envelope tab draws one cell per solved grid point, the limit contour and no NaN", () => {
    const { container } = renderPlots();
    fireEvent.click(screen.getByTestId("tab-plot-tab-envelope"));
    const map = screen.getByTestId("plot-envelope");
    const solved = ANALYSIS.envelope.jointAngleDeg.flat().filter((v) => v !== null && Number.isFinite(v)).length;
    expect(map.querySelectorAll("[data-cell]")).toHaveLength(solved);
    expect(within(map).getByText(`joint limit ${figureText(ANALYSIS.drive.jointLimitDeg, 1)}°`)).toBeTruthy();
    expect(container.innerHTML).not.toMatch(/NaN/);
  });

  it("picking a neck on the trade-off sets that neck as one undo step", () => {
    const { store } = renderPlots();
    fireEvent.click(screen.getByTestId("tab-plot-tab-neck"));
    const thinner = TRADEOFF.samples.find((s) => s.ok && s.neckDiameterMm < TARNWICK_10_BASE.drive.neckDiameterMm)!;
    expect(thinner).toBeTruthy();
    fireEvent.click(screen.getByTestId(neckPickTestId(thinner.neckDiameterMm)));
    expect(store.getState().layout.drive.neckDiameterMm).toBe(thinner.neckDiameterMm);
    expect(store.temporal.getState().pastStates).toHaveLength(1);
    // Until a full analysis of the new layout arrives, the trade-off says it is out of date.
    expect(screen.getByTestId("plot-neck-tradeoff").dataset.stale).toBe("true");
    act(() => undo(store));
    expect(store.getState().layout.drive.neckDiameterMm).toBe(TARNWICK_10_BASE.drive.neckDiameterMm);
  });

  it("the arrow keys move along the neck buttons and Enter picks", () => {
    const { store } = renderPlots();
    fireEvent.click(screen.getByTestId("tab-plot-tab-neck"));
    const current = screen.getByTestId(neckPickTestId(TRADEOFF.samples[TRADEOFF.currentIndex]!.neckDiameterMm));
    expect(current.getAttribute("aria-current")).toBe("true");
    current.focus();
    fireEvent.keyDown(current, { key: "ArrowLeft" });
    const prev = TRADEOFF.samples[TRADEOFF.currentIndex - 1]!;
    const prevButton = screen.getByTestId(neckPickTestId(prev.neckDiameterMm));
    expect(document.activeElement).toBe(prevButton);
    fireEvent.click(prevButton); // a button's Enter is a click
    expect(store.getState().layout.drive.neckDiameterMm).toBe(prev.neckDiameterMm);
  });

  it("a reader sees the trade-off but cannot pick a neck", () => {
    const { store } = renderPlots(true);
    fireEvent.click(screen.getByTestId("tab-plot-tab-neck"));
    const buttons = within(screen.getByTestId("plot-neck-tradeoff")).getAllByRole("button");
    expect(buttons.length).toBe(TRADEOFF.samples.length);
    for (const b of buttons) expect((b as HTMLButtonElement).disabled).toBe(true);
    fireEvent.click(buttons[0]!);
    expect(store.getState().layout).toBe(TARNWICK_10_BASE);
    expect(screen.getByText(/picking a neck is off/)).toBeTruthy();
  });

  it("with no analysis yet each plot says so instead of drawing an empty chart", () => {
    render(
      <EditorProvider init={{ kit: KIT, layout: TARNWICK_10_BASE, readOnly: false, lengthUnit: "mm", analysis: null }}>
        <EditorPlots />
      </EditorProvider>,
    );
    expect(screen.getByTestId("plot-empty").textContent).toMatch(/not been analysed/);
    fireEvent.click(screen.getByTestId("tab-plot-tab-neck"));
    expect(screen.getByTestId("plot-empty").textContent).toMatch(/Working out the trade-off/);
  });
});

describe("the plots during a drag", () => {
  it("hold the figures they had when the drag began, and follow again on release", () => {
    const before = analyzeLayout(TARNWICK_10_BASE, { travelSteps: 5, steerSteps: 5 });
    const thinner = setNeckDiameter(TARNWICK_10_BASE, 4);
    const during = analyzeLayout(thinner, { travelSteps: 5, steerSteps: 5 });
    const init = { kit: KIT, layout: TARNWICK_10_BASE, readOnly: false, lengthUnit: "mm" as const, analysis: before };
    const { result } = renderHook(() => ({ held: useEditorHeldWhileDragging(selectLiveAnalysis), store: useEditorStore() }), {
      wrapper: ({ children }) => <EditorProvider init={init}>{children}</EditorProvider>,
    });
    expect(result.current.held).toBe(before);
    act(() => result.current.store.getState().setDraft(thinner));
    act(() => result.current.store.getState().setLive({ analysis: during, quality: "coarse" }));
    expect(result.current.store.getState().live.analysis).toBe(during);
    expect(result.current.held).toBe(before);
    act(() => result.current.store.getState().commit(thinner));
    expect(result.current.held).toBe(during);
  });
});
