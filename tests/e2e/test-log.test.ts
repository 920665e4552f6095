// The test log, calibration and underlays in the browser: log a run with a photo and see the photo, the outcome
// and the prediction on the kit; a picture that is not an image is refused with its reason; the calibration page
// plots the demo's runs; a drawing put under the front view and scaled by two points. Screenshots of each land in
// .data/e2e-shots/test-log-*.png, and every page, state and dialog passes the accessibility check.
import { execFile } from "node:child_process";
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { promisify } from "node:util";
import type { Page } from "playwright-core";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import type { MaterialCalibration } from "@/contracts/calibration";
import { TARNWICK_10_BASE } from "@/contracts/demo-layouts";
import { formatSafetyFactor, type TestRun } from "@/contracts/test-log";
import type { Underlay } from "@/contracts/underlays";
import { expectAccessible } from "./helpers/a11y";
import { apiAs, pageAs, signInByApi, signUpByApi, type Account } from "./helpers/accounts";
import { baseUrl, setUpBrowser } from "./helpers/browser";

const browser = setUpBrowser();
const root = fileURLToPath(new URL("../..", import.meta.url));
const shots = join(root, ".data/e2e-shots");
const POLL = { timeout: 20_000 };

let owner: Account;
let ws: string;

async function shot(page: Page, name: string) {
  mkdirSync(shots, { recursive: true });
  await page.screenshot({ path: join(shots, `test-log-${name}.png`), fullPage: true });
}

async function newKit(name: string): Promise<string> {
  return (await apiAs<{ kit: { id: string } }>(owner, `/api/workspaces/${ws}/kits`, { method: "POST", body: { name, scale: "1:10", layout: TARNWICK_10_BASE } })).kit.id;
}

async function openTestLog(page: Page, kitId: string) {
  await page.goto(`/workspaces/${ws}/kits/${kitId}`);
  await page.getByTestId("tab-test-log").click();
  await page.getByTestId("test-log").waitFor();
}

const picture = (width: number, height: number, colour: { r: number; g: number; b: number }) => sharp({ create: { width, height, channels: 3, background: colour } }).png().toBuffer();

beforeAll(async () => {
  owner = await signUpByApi("Orla Pennick");
  ws = (await apiAs<{ workspaces: { id: string }[] }>(owner, "/api/workspaces")).workspaces[0]!.id;
});

describe("the test log on a kit", () => {
  it("logs a run with a photo, and shows the photo, the outcome and the prediction beside it", async () => {
    const kitId = await newKit("Pennick 10 test kit");
    const page = await pageAs(browser, owner, { width: 1500, height: 950 });
    await openTestLog(page, kitId);
    await page.getByText("No test runs logged for this kit yet.").waitFor();
    await expectAccessible(page, { name: "test-log-empty" });

    await page.getByRole("button", { name: "Log a test run" }).click();
    const form = page.getByTestId("run-form");
    await form.getByLabel("Part").fill("left front dogbone");
    await form.getByLabel("broke").check();
    await expectAccessible(page, { name: "run-form" });
    // A part that broke says where: the form refuses it without, naming the field.
    await form.getByRole("button", { name: "Log the run" }).click();
    await form.getByText("failureLocation is required for a part that broke: say where it broke", { exact: true }).waitFor();
    await expectAccessible(page, { name: "run-form-errors" });

    await form.getByLabel("Where it broke").fill("neck, 2 mm from the ball");
    await form.getByLabel("Load").fill("1.9 kg, bench rig launches");
    await form.getByLabel("Photos").setInputFiles([{ name: "neck after run 1.png", mimeType: "image/png", buffer: await picture(320, 240, { r: 90, g: 110, b: 130 }) }]);
    await form.getByRole("button", { name: "Log the run" }).click();
    await form.waitFor({ state: "hidden" });

    const card = page.locator("[data-run='1']");
    await card.waitFor();
    const runs = (await apiAs<{ runs: TestRun[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/test-runs`)).runs;
    expect(runs).toHaveLength(1);
    const run = runs[0]!;
    expect(run.photos.map((p) => p.fileName)).toEqual(["neck after run 1.png"]);
    // The layout's own motor, gearing and material (the shelf's copy of its catalogue steel): its own safety factor.
    expect(run.prediction?.ok).toBe(true);
    const sf = formatSafetyFactor(run.prediction!.ok ? run.prediction!.safetyFactor : NaN);
    await expect.poll(() => page.getByTestId("prediction-lines").innerText(), POLL).toBe(`Predicted safety factor ${sf} — broke in run 1`);
    expect(await card.locator("[data-outcome]").innerText()).toBe("broke");
    expect(await card.getByTestId("run-prediction").innerText()).toContain(`Predicted safety factor ${sf}`);
    const img = card.getByRole("img", { name: "Run 1: neck after run 1.png" });
    await expect.poll(() => img.evaluate((el: HTMLImageElement) => el.complete && el.naturalWidth), POLL).toBe(320);
    await shot(page, "run-logged");
    await expectAccessible(page, { name: "test-log-filled" });
    // Deleting asks first (and says the photo goes too); cancelled, nothing changes.
    await card.getByRole("button", { name: "Delete" }).click();
    await page.getByTestId("delete-run-dialog").getByText("The run and its photo are removed for everyone.").waitFor();
    await expectAccessible(page, { name: "delete-run-dialog" });
    await page.getByTestId("delete-run-dialog").getByRole("button", { name: "Cancel" }).click();
    expect((await apiAs<{ runs: TestRun[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/test-runs`)).runs).toHaveLength(1);
  });

  it("logs the run but refuses a photo that is not an image, saying why", async () => {
    const kitId = await newKit("Pennick 10 wrong file");
    const page = await pageAs(browser, owner, { width: 1500, height: 950 });
    await openTestLog(page, kitId);
    await page.getByRole("button", { name: "Log a test run" }).click();
    const form = page.getByTestId("run-form");
    await form.getByLabel("Part").fill("right front dogbone");
    await form.getByLabel("Photos").setInputFiles([{ name: "looks-like-a.png", mimeType: "image/png", buffer: Buffer.from("%PDF-1.4\n%%EOF\n") }]);
    await form.getByRole("button", { name: "Log the run" }).click();
    await form.getByText(/The file must be a JPEG, PNG or WebP image; its bytes are application\/pdf/).waitFor();
    await expectAccessible(page, { name: "run-form-photo-refused" });
    await form.getByRole("button", { name: "Close" }).click();
    await page.locator("[data-run='1']").waitFor();
    const runs = (await apiAs<{ runs: TestRun[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/test-runs`)).runs;
    expect(runs.map((r) => r.photos.length)).toEqual([0]);
  });
});

describe("uploads through the running app", () => {
  it("an oversized photo is refused with 413 and a clear message, and nothing is stored", async () => {
    const kitId = await newKit("Pennick 10 big file");
    const materialId = (await apiAs<{ items: { id: string; kind: string }[] }>(owner, `/api/workspaces/${ws}/shelf`)).items.find((i) => i.kind === "material")!.id;
    const body = { revision: 1, testedOn: "2026-02-02", part: "dogbone", materialId, setup: { motor: { kind: "torque", torqueNm: 0.5 }, gearRatios: [6], lockDeg: null, load: "" }, outcome: "held" };
    const { run } = await apiAs<{ run: TestRun }>(owner, `/api/workspaces/${ws}/kits/${kitId}/test-runs`, { method: "POST", body });
    // 12 MB: past the 10 MB limit (and past the 10 MB Next buffers for its proxy, which API routes never pass through).
    const big = Buffer.concat([await picture(64, 48, { r: 1, g: 2, b: 3 }), Buffer.alloc(12_000_000)]);
    const res = await fetch(`${baseUrl}/api/workspaces/${ws}/kits/${kitId}/test-runs/${run.id}/photos`, {
      method: "POST",
      headers: { cookie: owner.cookies.map((c) => `${c.name}=${c.value}`).join("; "), origin: baseUrl, "content-type": "application/octet-stream", "x-file-name": "huge.png" },
      body: big,
    });
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string; message: string } }).error).toMatchObject({ code: "file_too_large", message: expect.stringContaining("10 MB") });
    const after = (await apiAs<{ runs: TestRun[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/test-runs`)).runs;
    expect(after[0]!.photos).toEqual([]);
  });
});

describe("calibration", () => {
  it("an empty workspace says how runs get there", async () => {
    const page = await pageAs(browser, owner);
    const fresh = await signUpByApi("Edda Quarrie");
    const freshWs = (await apiAs<{ workspaces: { id: string }[] }>(fresh, "/api/workspaces")).workspaces[0]!.id;
    const p = await pageAs(browser, fresh);
    await p.goto(`/workspaces/${freshWs}/calibration`);
    await p.getByText("No test runs logged yet").waitFor();
    await expectAccessible(p, { name: "calibration-empty" });
    await page.close();
  });

  it("plots the demo's runs per material, with the bounds and the derate between them", async () => {
    // The demo data (idempotent), as `npm run demo` seeds it, in the database and object store the app uses.
    await promisify(execFile)("npx", ["--no-install", "tsx", "--conditions=react-server", "scripts/seed.ts"], { cwd: root, env: process.env, timeout: 120_000 });
    const ines = await signInByApi("ines@harrowflats.example", "bench-demo-2026");
    const demo = (await apiAs<{ workspaces: { id: string; name: string }[] }>(ines, "/api/workspaces")).workspaces.find((w) => w.name === "Harrow Flats RC Works")!.id;
    const materials = (await apiAs<{ materials: MaterialCalibration[] }>(ines, `/api/workspaces/${demo}/calibration`)).materials;
    const printed = materials.find((m) => m.material.name === "Club PA12-CF, printed flat")!;
    expect(printed.calibration.status).toBe("separated");

    const page = await pageAs(browser, ines, { width: 1400, height: 1000 });
    await page.goto(`/workspaces/${demo}/calibration`);
    for (const m of materials) {
      const section = page.locator(`section[data-material="${m.material.name}"]`);
      await section.getByTestId("calibration-plot").waitFor();
      // One mark per run that has a prediction, at its outcome.
      await expect.poll(() => section.locator(".recharts-scatter-symbol").count(), POLL).toBe(m.points.length);
      if (m.calibration.lowestHeld !== null) expect(await section.getByTestId("lowest-held").innerText()).toBe(formatSafetyFactor(m.calibration.lowestHeld));
      if (m.calibration.highestBroke !== null) expect(await section.getByTestId("highest-broke").innerText()).toBe(formatSafetyFactor(m.calibration.highestBroke));
    }
    const section = page.locator(`section[data-material="Club PA12-CF, printed flat"]`);
    expect(await section.getByTestId("proposal").innerText()).toContain(`Derate 0.8 → ${printed.proposal!.derateAfter}`);
    expect(printed.points.length).toBeGreaterThanOrEqual(5);
    await shot(page, "calibration");
    await expectAccessible(page, { name: "calibration" });
    await section.getByText(/The \d+ runs/).click();
    await expectAccessible(page, { name: "calibration-runs-table" });

    // Applying to the club's steel first lists the kits it rewrites; cancelled, the shelf is unchanged.
    const steel = page.locator(`section[data-material="Club 4140 bar, batch HF-0412"]`);
    await steel.getByRole("button", { name: "Apply to the shelf material" }).click();
    const confirm = page.getByTestId("calibration-confirm");
    await confirm.getByText(/each gets a new revision with the derate/).waitFor();
    expect(await confirm.getByRole("listitem").count()).toBeGreaterThanOrEqual(2);
    await expectAccessible(page, { name: "calibration-confirm" });
    await confirm.getByRole("button", { name: "Cancel" }).click();
    const again = (await apiAs<{ materials: MaterialCalibration[] }>(ines, `/api/workspaces/${demo}/calibration`)).materials;
    expect(again.find((m) => m.material.name === "Club 4140 bar, batch HF-0412")!.material.derate).toBe(1);

    // A viewer sees the same page with nothing to apply.
    const priya = await signInByApi("priya@harrowflats.example", "bench-demo-2026");
    const viewerPage = await pageAs(browser, priya, { width: 1400, height: 1000 });
    await viewerPage.goto(`/workspaces/${demo}/calibration`);
    await viewerPage.getByTestId("calibration-plot").first().waitFor();
    expect(await viewerPage.getByRole("button", { name: "Apply to the shelf material" }).count()).toBe(0);
  }, 150_000); // the calibration page draws every demo run: over a minute on a loaded 2-core machine
});

describe("an underlay under the front view", () => {
  it("puts a drawing under the view and scales it by two points a known distance apart", async () => {
    const kitId = await newKit("Pennick 10 underlay");
    const page = await pageAs(browser, owner, { width: 1500, height: 950 });
    await page.goto(`/workspaces/${ws}/kits/${kitId}`);
    await page.getByTestId("view-front").waitFor();
    await page.getByTestId("underlay-button-front").click();
    await page.getByTestId("underlay-panel-front").waitFor();
    await expectAccessible(page, { name: "underlay-panel-empty" });
    await page.getByTestId("underlay-file-front").setInputFiles([{ name: "front sketch.png", mimeType: "image/png", buffer: await picture(600, 400, { r: 240, g: 236, b: 220 }) }]);
    await page.getByTestId("underlay-panel-front").getByText("front sketch.png").waitFor();
    await page.getByText("Not to scale yet").waitFor();

    await page.getByRole("button", { name: "Scale by two points" }).click();
    await page.getByTestId("underlay-hint-front").waitFor();
    const box = (await page.getByTestId("view-front").boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.35, box.y + box.height * 0.5);
    await page.mouse.click(box.x + box.width * 0.65, box.y + box.height * 0.5);
    const dialog = page.getByTestId("underlay-scale-front");
    await dialog.getByLabel("Distance between them (mm)").fill("80");
    await expectAccessible(page, { name: "underlay-scale-dialog" });
    await dialog.getByRole("button", { name: "Scale the picture" }).click();
    await dialog.waitFor({ state: "hidden" });

    await expect.poll(async () => (await apiAs<{ underlays: Underlay[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/underlays`)).underlays[0]?.placement.picks?.distanceMm, POLL).toBe(80);
    const [u] = (await apiAs<{ underlays: Underlay[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/underlays`)).underlays;
    const p = u!.placement.picks!;
    // The two clicks, in picture pixels, now lie 80 mm apart on the plane.
    expect(Math.hypot(p.bPx.x - p.aPx.x, p.bPx.y - p.aPx.y) * u!.placement.mmPerPx).toBeCloseTo(80, 6);
    await page.getByTestId("underlay-button-front").click();
    await page.getByText(/Scaled by two points 80 mm apart/).waitFor();
    await page.getByTestId("underlay-visible-front").uncheck();
    await expect.poll(async () => (await apiAs<{ underlays: Underlay[] }>(owner, `/api/workspaces/${ws}/kits/${kitId}/underlays`)).underlays[0]?.visible, POLL).toBe(false);
    await page.getByTestId("underlay-visible-front").check();
    await expectAccessible(page, { name: "underlay-panel" });
    await page.getByTestId("underlay-button-front").click();
    await page.getByTestId("underlay-panel-front").waitFor({ state: "hidden" });
    await shot(page, "underlay");
  });
});
