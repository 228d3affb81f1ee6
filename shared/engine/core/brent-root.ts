/**
 * Root of a continuous scalar function on a bracket [a, b] with f(a)·f(b) ≤ 0.
 *
 * Method: Brent's method — inverse quadratic interpolation and secant steps safeguarded by bisection
 * (Brent 1973, *Algorithms for Minimization without Derivatives*, ch. 4, procedure zero), so it never does
 * worse than bisection and converges superlinearly on smooth functions.
 * Notes: stops when the bracket is narrower than 2·`tolerance` (+ rounding) or f = 0; at most 100 evaluations.
 * @param f the function (e.g. damping ratio against wind speed)
 * @param a left end of the bracket
 * @param b right end
 * @param fa f(a)
 * @param fb f(b)
 * @param tolerance absolute tolerance on the root, in the unit of a and b
 * @returns the root estimate
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  fa: number,
  fb: number,
  tolerance: number,
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new Error("brentRoot: the bracket does not change sign");
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let it = 0; it < 100; it++) {
    if (fb * fc > 0) {
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
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
