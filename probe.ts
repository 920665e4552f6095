import { analyzeLayout } from "@/engine";
import { TARNWICK_10_PRINTED, TARNWICK_10_CARDAN } from "@/contracts/demo-layouts";
const paths = new Set<string>();
const walk = (v: unknown, p: string) => {
  if (Array.isArray(v)) { v.forEach((x) => walk(x, p + "[]")); if (!v.length) paths.add(p + "[]"); return; }
  if (v && typeof v === "object") { for (const [k, x] of Object.entries(v)) walk(x, p ? `${p}.${k}` : k); return; }
  paths.add(p);
};
walk(analyzeLayout(TARNWICK_10_PRINTED, { travelSteps: 5, steerSteps: 5 }), "");
walk(analyzeLayout(TARNWICK_10_CARDAN, { travelSteps: 5, steerSteps: 5 }), "");
console.log([...paths].join("\n"));
