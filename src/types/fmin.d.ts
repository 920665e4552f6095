// fmin ships JavaScript only (its main file is a UMD bundle that ESM cannot name-import; index.js is its ES module): the one function the design search uses.
declare module "fmin/index.js" {
  export interface NelderMeadParameters {
    maxIterations?: number;
    nonZeroDelta?: number;
    zeroDelta?: number;
    minErrorDelta?: number;
    minTolerance?: number;
    sigma?: number;
  }
  export function nelderMead(f: (x: number[]) => number, x0: number[], parameters?: NelderMeadParameters): { fx: number; x: number[] };
}
