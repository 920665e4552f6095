import { act, fireEvent, render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { TARNWICK_10_BASE, TARNWICK_10_BELLCRANK, TARNWICK_10_PRINTED } from "@/contracts/demo-layouts";
import type { Layout } from "@/contracts/layout";
import { analyzeLayout, type AnalysisResult } from "@/engine";
import { methodByKey } from "@/engine/methods/method-entries";
import { readoutGroups, zeroLockNote } from "@/figures/readout-figures";
import { ReadoutsPanel } from "@/editor/readouts/readouts-panel";
import { EditorProvider } from "@/editor/store/editor-context";
import { KIT } from "./editor-fixtures";

const GRID = { travelSteps: 9, steerSteps: 17 };
const BASE = analyzeLayout(TARNWICK_10_BASE, GRID);

function renderReadouts(layout: Layout, analysis: AnalysisResult, lengthUnit: "mm" | "in" = "mm") {
  return render(
    <EditorProvider init={{ kit: KIT, layout, readOnly: false, lengthUnit, analysis }}>
      <ReadoutsPanel />
    </EditorProvider>,
  );
}

// The whole panel rendered in jsdom, with analyses: room to finish on a loaded machine (not a speed check).
describe("every readout explains itself and links its methods entry", { timeout: 30_000 }, () => {
  it("each label is a link to /methods#key with the entry's one-line explanation, shown on focus and on hover, hidden by Escape", () => {
    renderReadouts(TARNWICK_10_BASE, BASE);
    const groups = readoutGroups(BASE, "mm");
    const all = groups.flatMap((g) => g.readouts);
    expect(all.length).toBeGreaterThan(12);
    for (const r of all) {
      const link = screen.getByTestId(`explain-${r.id}`);
      expect(link.getAttribute("href")).toBe(`/methods#${r.method}`);
      expect(() => methodByKey(r.method)).not.toThrow();
      const tip = document.getElementById(link.getAttribute("aria-describedby")!)!;
      expect(tip.getAttribute("role")).toBe("tooltip");
      expect(tip.textContent).toBe(r.explain);
      expect(tip.dataset.open).toBe("false");
    }
    const lock = screen.getByTestId("explain-steer-lock-worst");
    const tip = document.getElementById(lock.getAttribute("aria-describedby")!)!;
    act(() => lock.focus());
    expect(tip.dataset.open).toBe("true");
    expect(tip.textContent).toMatch(/outer wheel can set it/);
    fireEvent.keyDown(lock, { key: "Escape" });
    expect(tip.dataset.open).toBe("false");
    fireEvent.blur(lock);
    fireEvent.mouseEnter(lock.parentElement!);
    expect(tip.dataset.open).toBe("true");
    fireEvent.mouseLeave(lock.parentElement!);
    expect(tip.dataset.open).toBe("false");
  });

  it("the strength figure carries its caution beside it", () => {
    renderReadouts(TARNWICK_10_BASE, BASE);
    expect(screen.getByTestId("note-strength").textContent).toMatch(/estimate.*layer direction.*moisture/);
  });
});

describe("the steering stop readouts", { timeout: 30_000 }, () => {
  it("the baseline needs a stop: where, each side, how far the rack runs past the limit, and the margins at the stop", () => {
    renderReadouts(TARNWICK_10_BASE, BASE);
    const s = BASE.steeringStop;
    expect(screen.getByTestId("steering-stop").textContent).toBe(`${Math.abs(s.leftTurnStopInput).toFixed(2)} mm`);
    expect(screen.getByTestId("stop-overrun").textContent).toBe(`${s.overrun.toFixed(2)} mm`);
    expect(screen.getByTestId("stop-angle-margin").textContent).toBe(`${s.angleMarginDeg.toFixed(1)}°`);
    expect(screen.getByTestId("stop-clearance").textContent).toBe(`${s.clearanceAtStopMm!.toFixed(2)} mm`);
    // The old "least neck clearance" (always 0.00 when the neck binds) is gone.
    expect(screen.queryByText(/Least neck clearance/)).toBeNull();
    expect(Number(screen.getByTestId("stop-clearance").textContent!.replace(/[^\d.]/g, ""))).toBeGreaterThan(0);
  });

  it("in inches the stop and the clearance follow the unit (25.4 mm to the inch)", () => {
    renderReadouts(TARNWICK_10_BASE, BASE, "in");
    expect(screen.getByTestId("steering-stop").textContent).toBe(`${(Math.abs(BASE.steeringStop.leftTurnStopInput) / 25.4).toFixed(4)} in`);
  });

  it("a bellcrank's stop is an angle of the bellcrank", () => {
    const a = analyzeLayout(TARNWICK_10_BELLCRANK, GRID);
    renderReadouts(TARNWICK_10_BELLCRANK, a);
    expect(screen.getByTestId("steering-stop").textContent).toBe(`${Math.abs(a.steeringStop.leftTurnStopInput).toFixed(1)}°`);
    expect(within(screen.getByRole("region", { name: "Steering stop" })).getByText(/Bellcrank travel past the limit/)).toBeTruthy();
  });

  it("a rack that cannot reach the limit needs no stop, and says so", () => {
    const short: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "rack", travelMm: 3 } } };
    renderReadouts(short, analyzeLayout(short, GRID));
    expect(screen.getByTestId("steering-stop").textContent).toBe("none needed");
    expect(screen.getByText(/the rack's ±3\.00 mm ends before anything binds/)).toBeTruthy();
    expect(screen.queryByTestId("stop-overrun")).toBeNull();
  });

  it("a rack thrown past its tie-rod toggle is caught: the toggle is named", () => {
    const overThrown: Layout = { ...TARNWICK_10_BASE, topView: { ...TARNWICK_10_BASE.topView, steeringInput: { kind: "rack", travelMm: 10 } } };
    const a = analyzeLayout(overThrown, GRID);
    renderReadouts(overThrown, a);
    expect(screen.getByTestId("stop-toggle").textContent).toBe(`${Math.abs(a.steeringStop.toggle!.steerInput).toFixed(2)} mm`);
  });

  it("a slotted cup has no neck clearance to give: it says so", () => {
    renderReadouts(TARNWICK_10_PRINTED, analyzeLayout(TARNWICK_10_PRINTED, GRID));
    expect(screen.getByTestId("stop-clearance").textContent).toBe("slotted cup");
  });
});

describe("figures that are blank or zero say why", { timeout: 30_000 }, () => {
  it("an Ackermann figure under the reporting angle is blank with the reason", () => {
    // A joint past its limit with the wheels straight at ride height: lock 0°, so no Ackermann at lock.
    const stuck: Layout = { ...TARNWICK_10_BASE, drive: { ...TARNWICK_10_BASE.drive, jointType: "cvd", ratedAngleDeg: 2, cupMouthDiameterMm: 20 } };
    const a = analyzeLayout(stuck, GRID);
    expect(a.ackermann.atLockPct).toBeNull();
    renderReadouts(stuck, a);
    expect(screen.getByTestId("ackermann").textContent).toBe("—");
    expect(screen.getByText(/blank: the lock is under 0\.5° of steer, where the percentage is 0\/0/)).toBeTruthy();
    // And the zero lock is said in words, not only as 0°.
    expect(zeroLockNote(a, "mm")).toMatch(/already at .* with the wheels straight .* there is no steer lock there/);
    expect(screen.getByText(/there is no steer lock there/)).toBeTruthy();
  });
});
