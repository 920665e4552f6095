import { DEMO_LAYOUTS } from "@/contracts/demo-layouts";

const NOTES: Record<string, string> = {
  "tarnwick-10-base": "Baseline: 5.0 mm 4140 dogbone in a closed 8 mm cup. Held 12 packs on the club track.",
  "tarnwick-10-thin-neck": "Neck turned down to 4.0 mm for more steer lock; watch the safety factor.",
  "tarnwick-10-cvd": "CVD variant with a 4.5 mm neck.",
  "tarnwick-10-printed": "Printed PA12-CF shaft in a slotted cup: a test part, not for racing.",
  "tarnwick-10-cardan": "Single cardan on a hollow 7075 shaft; check the speed fluctuation at lock.",
  "tarnwick-10-bellcrank": "Bellcrank pair and drag link in place of the rack; same 5.0 mm dogbone as the baseline.",
};

/** The demo kits: the invented Tarnwick 10's front corner and the variants its designers tried. */
export function demoKits(): { name: string; scale: string; notes: string; layout: unknown }[] {
  return DEMO_LAYOUTS.map((d) => ({ name: d.name, scale: "1:10", notes: NOTES[d.key] ?? "", layout: d.layout }));
}
