// Interim: replaced by the demo layouts of the layout contract.
export function demoKits(): { name: string; scale: string; notes: string; layout: unknown }[] {
  return [
    { name: "Marlow Ridge 10 — baseline", scale: "1:10", notes: "5 mm steel dogbone, stock arms.", layout: {} },
    { name: "Marlow Ridge 10 — thin neck", scale: "1:10", notes: "4 mm neck to gain steer lock.", layout: {} },
    { name: "Marlow Ridge 10 — printed CVD", scale: "1:10", notes: "PA12-CF printed shaft, to be tested.", layout: {} },
  ];
}
