// The test log's shared rules: cleaning an uploaded file's name, the run body, how runs and set-ups read, and
// what applying a calibration would write.
import { describe, expect, it } from "vitest";
import { cleanFileName, formatBytes, nameForType } from "@/contracts/attachments";
import { calibratedDerate, proposalFor } from "@/contracts/calibration";
import { parseGearRatios, setupText, testRunCreateBody } from "@/contracts/test-log";
import { calibrateAllowable } from "@/engine";

describe("file names", () => {
  it.each([
    ["../../etc/passwd.png", "passwd.png"],
    ["C:\\Users\\tomas\\Desktop\\neck.jpg", "neck.jpg"],
    ["%2e%2e%2Fsecret%2Fshot.webp", "shot.webp"],
    ["  .hidden  name .png", "hidden name .png"],
    ["gpj.\u202eexe.png", "gpj.exe.png"],
    ["line\nbreak.jpg", "linebreak.jpg"],
    ["/", null],
    ["..", null],
    ["", null],
  ])("%j → %j", (raw, clean) => {
    expect(cleanFileName(raw)).toBe(clean);
  });

  it("keeps at most 120 characters, with the extension", () => {
    const long = `${"a".repeat(300)}.jpeg`;
    const clean = cleanFileName(long)!;
    expect(clean.length).toBe(120);
    expect(clean.endsWith(".jpeg")).toBe(true);
  });

  it("takes the extension of the type the bytes are", () => {
    expect(nameForType("scan.jpeg", "image/png", "photo")).toBe("scan.png");
    expect(nameForType(null, "image/webp", "test-photo")).toBe("test-photo.webp");
    expect(nameForType("no extension", "image/jpeg", "x")).toBe("no extension.jpg");
  });

  it("sizes read in kB and MB", () => {
    expect([formatBytes(512), formatBytes(83_000), formatBytes(10_485_760), formatBytes(2_400_000)]).toEqual(["512 bytes", "83 kB", "10 MB", "2.4 MB"]);
  });
});

describe("a run's body", () => {
  const body = { revision: 2, testedOn: "2026-01-31", part: "dogbone", materialId: "3f1c2a9e-5b7d-4c1e-9a2b-1c2d3e4f5a6b", setup: { motor: { kind: "kv", kvRpmPerV: 4000, currentA: 80 }, gearRatios: [3.45, 2.6], lockDeg: null, load: "" }, outcome: "held" };

  it("takes a well-formed run, defaulting the words left out", () => {
    const parsed = testRunCreateBody.parse(body);
    expect(parsed).toMatchObject({ failureLocation: "", notes: "" });
  });

  it("a run that broke must say where, naming failureLocation", () => {
    const r = testRunCreateBody.safeParse({ ...body, outcome: "broke" });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(["failureLocation"]);
  });

  it("refuses an unknown key (strict), a 31st of February and a motor of another kind", () => {
    expect(testRunCreateBody.safeParse({ ...body, extra: 1 }).success).toBe(false);
    expect(testRunCreateBody.safeParse({ ...body, testedOn: "2026-02-31" }).success).toBe(false);
    expect(testRunCreateBody.safeParse({ ...body, setup: { ...body.setup, motor: { kind: "brushed" } } }).success).toBe(false);
  });
});

describe("how set-ups read", () => {
  it("motor, gearing with its product, lock and load", () => {
    expect(setupText({ motor: { kind: "kv", kvRpmPerV: 4000, currentA: 80 }, gearRatios: [76 / 22, 2.6], lockDeg: 28, load: "1.9 kg" })).toBe("Kv 4000 rpm/V at 80 A · gearing 3.45 × 2.60 (8.98:1) · lock 28° · 1.9 kg");
    expect(setupText({ motor: { kind: "torque", torqueNm: 0.05 }, gearRatios: [6], lockDeg: null, load: "" })).toBe("0.05 N·m motor · gearing 6.00:1");
  });

  it("gear ratios typed with ×, x, commas or spaces", () => {
    expect(parseGearRatios("3.45 × 2.6")).toEqual([3.45, 2.6]);
    expect(parseGearRatios("3.45x2.6")).toEqual([3.45, 2.6]);
    expect(parseGearRatios("3.45, 2.6")).toEqual([3.45, 2.6]);
    expect(parseGearRatios("three")).toBeNull();
    expect(parseGearRatios("  ")).toBeNull();
  });
});

describe("applying a calibration", () => {
  const c = calibrateAllowable([{ safetyFactor: 1.55, outcome: "held" }, { safetyFactor: 2.6, outcome: "held" }, { safetyFactor: 1.09, outcome: "broke" }]);

  it("scales the derate by the factor, kept to 4 decimals, with the source naming the runs", () => {
    const p = proposalFor(c, 0.8, "2026-06-01")!;
    expect(p.derateAfter).toBe(calibratedDerate(0.8, c.factor!));
    expect(p.derateAfter).toBe(0.6155); // 0.8 / √(1.55 · 1.09) = 0.8 / 1.29981 = 0.61547
    expect(p.applicable).toBe(true);
    expect(p.source).toBe("calibrated from 3 test runs (2026-06-01): lowest safety factor that held 1.55, highest that broke 1.09; factor 0.769 on the derate 0.8");
  });

  it("cannot raise a figure through a derate above 1, and says why", () => {
    const strong = calibrateAllowable([{ safetyFactor: 0.5, outcome: "held" }, { safetyFactor: 0.4, outcome: "broke" }]);
    const p = proposalFor(strong, 0.8, "2026-06-01")!;
    expect(p.applicable).toBe(false);
    expect(p.reason).toMatch(/stronger than its figure/);
  });

  it("no factor, no proposal", () => {
    expect(proposalFor(calibrateAllowable([{ safetyFactor: 2, outcome: "held" }]), 1, "2026-06-01")).toBeNull();
  });
});
