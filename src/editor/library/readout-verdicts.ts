// The live readouts judged against the kit's targets: the tone (colour) and, so colour is not the only
// sign, the verdict and the target in words at the start of the hint. Pure.
import { summarizeAnalysis } from "@/contracts/revisions";
import { judgeReadout, targetText, type ReadoutKey, type Targets } from "@/contracts/targets";
import type { AnalysisResult } from "@/engine";
import type { ReadoutGroup } from "@/figures/readout-figures";

/** Which live readout shows which judged figure. */
export const JUDGED_READOUTS: Readonly<Record<string, ReadoutKey>> = {
  "steer-lock-worst": "lockDeg",
  "joint-max": "maxJointAngleDeg",
  "neck-clearance": "neckClearanceMm",
  ackermann: "ackermannPct",
  "safety-factor": "safetyFactor",
};

export function judgeReadoutGroups(groups: readonly ReadoutGroup[], a: AnalysisResult, targets: Targets): ReadoutGroup[] {
  const s = summarizeAnalysis(a);
  return groups.map((g) => ({
    ...g,
    readouts: g.readouts.map((r) => {
      const key = JUDGED_READOUTS[r.id];
      if (!key) return r;
      const verdict = judgeReadout(key, s[key], targets);
      if (verdict === "none") return r;
      const words = `${verdict === "meets" ? "✓ meets" : "✗ misses"} target ${targetText(key, targets)}`;
      // The strength readout's own "target" is the layout's design factor: the kit's target replaces it.
      const rest = key === "safetyFactor" ? r.hint?.replace(/^target [^·]*· /, "") : r.hint;
      return { ...r, tone: verdict === "meets" ? "good" : "bad", hint: rest ? `${words} · ${rest}` : words };
    }),
  }));
}
