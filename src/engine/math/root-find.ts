/**
 * Brent's method (inverse quadratic interpolation guarded by bisection) for a root of f in [a, b].
 * Requires f(a) and f(b) of opposite sign (or one of them zero); returns the root to within tolMm of
 * the abscissa, or NaN when the interval does not bracket a sign change. Callers check for NaN and
 * raise a named GeometryError: NaN never leaves the engine.
 */
export function rootBracketedBrent(f: (x: number) => number, a: number, b: number, tol = 1e-10, maxIter = 100): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(fa * fb < 0)) return NaN;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * The first sign change of f along the samples x0 < x1 < … (or x0 > x1 > …) refined with Brent:
 * returns the abscissa where f first reaches zero, or null when f keeps the sign of f(xs[0]) at every
 * sample. `values` may hold f at the samples already (same length as xs) to save evaluations.
 */
export function rootFirstCrossing(f: (x: number) => number, xs: ArrayLike<number>, values?: ArrayLike<number>, tol = 1e-10): number | null {
  const n = xs.length;
  if (n === 0) return null;
  let prevX = xs[0];
  let prevF = values ? values[0] : f(prevX);
  if (prevF === 0) return prevX;
  for (let i = 1; i < n; i++) {
    const x = xs[i];
    const fx = values ? values[i] : f(x);
    if (fx === 0) return x;
    if ((fx > 0) !== (prevF > 0)) {
      const lo = Math.min(prevX, x);
      const hi = Math.max(prevX, x);
      const r = rootBracketedBrent(f, lo, hi, tol);
      return Number.isNaN(r) ? x : r;
    }
    prevX = x;
    prevF = fx;
  }
  return null;
}

/**
 * Illinois (modified regula falsi) refinement of a bracket [lo, hi] with f(lo) < 0 ≤ f(hi) (either order
 * of abscissae). Returns the final bracket, narrowed below tol, so a caller can take the side it needs —
 * e.g. the last point still inside a limit. Returns null when the ends do not bracket a sign change.
 */
export function rootBracketIllinois(f: (x: number) => number, lo: number, hi: number, tol = 1e-10, maxIter = 200): { readonly lo: number; readonly hi: number } | null {
  let fl = f(lo);
  let fh = f(hi);
  if (!(fl < 0 && fh >= 0)) return null;
  let side = 0;
  for (let i = 0; i < maxIter && Math.abs(hi - lo) > tol; i++) {
    let x = (lo * fh - hi * fl) / (fh - fl);
    // Keep the trial strictly inside; fall back to bisection if rounding put it on an end.
    if (!(x > Math.min(lo, hi) && x < Math.max(lo, hi))) x = 0.5 * (lo + hi);
    const fx = f(x);
    if (fx < 0) {
      lo = x;
      fl = fx;
      if (side === -1) fh /= 2;
      side = -1;
    } else {
      hi = x;
      fh = fx;
      if (side === 1) fl /= 2;
      side = 1;
    }
  }
  return { lo, hi };
}
