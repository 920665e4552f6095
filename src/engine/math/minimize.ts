/**
 * Golden-section search for the minimum of f on [a, b] (Kiefer's method; common practice): narrows the
 * bracket by 1/φ each step until it is shorter than tol, evaluating f once per step. Returns the best
 * point seen, the ends included, so a minimum at an end of the interval is found too. For a function with
 * one minimum on [a, b] this is that minimum; otherwise a local one near the best sample.
 */
export function minimizeGolden(f: (x: number) => number, a: number, b: number, tol = 1e-6, maxIter = 80): { readonly x: number; readonly fx: number } {
  const invPhi = (Math.sqrt(5) - 1) / 2;
  let best = { x: a, fx: f(a) };
  const fb = f(b);
  if (fb < best.fx) best = { x: b, fx: fb };
  let lo = Math.min(a, b);
  let hi = Math.max(a, b);
  let x1 = hi - invPhi * (hi - lo);
  let x2 = lo + invPhi * (hi - lo);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < maxIter && hi - lo > tol; i++) {
    if (f1 <= f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - invPhi * (hi - lo);
      f1 = f(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + invPhi * (hi - lo);
      f2 = f(x2);
    }
  }
  for (const [x, fx] of [[x1, f1], [x2, f2]] as const) if (fx < best.fx) best = { x, fx };
  return best;
}
