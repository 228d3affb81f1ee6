/**
 * Bessel functions of the first and second kind of orders 0 and 1, J0, J1, Y0, Y1, at one real x > 0,
 * computed together (the Theodorsen function needs all four).
 *
 * Method: for x ≤ 12 the ascending power series [Abramowitz & Stegun, Handbook of Mathematical Functions,
 * 1964, 9.1.10 (J_n), 9.1.13 (Y0) and 9.1.11 with n = 1 (Y1)], summed until the terms fall below 1e-17 of the
 * sum; for x > 12 Hankel's asymptotic expansion [A&S 9.2.5–9.2.10] truncated at its smallest term. The phases
 * x − π/4 and x − 3π/4 are formed from cos x and sin x, so large x loses no accuracy to the subtraction.
 *
 * Notes: the series loses accuracy to cancellation as x grows (terms up to ≈ e^x/√(2πx)) and the asymptotic
 * expansion gains it; the switch at x = 12 balances the two. Error (absolute where |f| < 1, else relative)
 * below 2e-12 on (0, ∞), largest just below the switch; checked against mpmath at 40 digits
 * (__tests__/fixtures/make-aero-fixtures.py).
 * For x → 0, Y0 → −∞ (like (2/π) ln x) and Y1 → −∞ (like −2/(πx)).
 *
 * @param x - argument, x > 0 (dimensionless)
 * @param out - receives [J0(x), J1(x), Y0(x), Y1(x)]
 * @returns out
 */
export function besselJY01(x: number, out: Float64Array = new Float64Array(4)): Float64Array {
  if (!(x > 0) || x === Infinity) throw new RangeError(`Bessel functions need a finite x > 0 (got ${x})`);
  if (x <= SERIES_LIMIT) ascendingSeries(x, out);
  else hankelAsymptotic(x, out);
  return out;
}

const SERIES_LIMIT = 12;
const EULER_GAMMA = 0.5772156649015329;
const TWO_OVER_PI = 2 / Math.PI;

function ascendingSeries(x: number, out: Float64Array): void {
  const q = -0.25 * x * x; // −x²/4
  const half = 0.5 * x;
  // J0 = Σ t_k, t_k = (−x²/4)^k/(k!)²; Y0 = (2/π)(ln(x/2) + γ) J0 − (2/π) Σ H_k t_k.
  // J1 = Σ s_k, s_k = (x/2)(−x²/4)^k/(k!(k+1)!);
  // Y1 = (2/π) ln(x/2) J1 − 2/(πx) − (1/π) Σ (ψ(k+1) + ψ(k+2)) s_k, ψ(m+1) = −γ + H_m.
  let t = 1;
  let s = half;
  let j0 = 1;
  let j1 = half;
  let harmonic = 0; // H_k
  let y0Sum = 0;
  let y1Sum = -2 * EULER_GAMMA + 1; // (ψ(1) + ψ(2)) s_0 / s_0 = −2γ + 1, times s_0 below
  y1Sum *= half;
  for (let k = 1; k < 200; k++) {
    t *= q / (k * k);
    s *= q / (k * (k + 1));
    harmonic += 1 / k;
    j0 += t;
    j1 += s;
    y0Sum += harmonic * t;
    y1Sum += (2 * harmonic + 1 / (k + 1) - 2 * EULER_GAMMA) * s;
    if (Math.abs(t) < 1e-17 * Math.abs(j0) && Math.abs(s) < 1e-17 * Math.abs(j1) && k > 2) break;
  }
  const logHalf = Math.log(half);
  out[0] = j0;
  out[1] = j1;
  out[2] = TWO_OVER_PI * ((logHalf + EULER_GAMMA) * j0 - y0Sum);
  out[3] = TWO_OVER_PI * logHalf * j1 - TWO_OVER_PI / x - y1Sum / Math.PI;
}

/** P and Q of A&S 9.2.9–9.2.10 for order ν (μ = 4ν²), summed to the smallest term; writes [P, Q] into pq. */
function hankelPQ(mu: number, x: number, pq: Float64Array, offset: number): void {
  const eightX = 8 * x;
  let term = 1;
  let p = 1;
  let qSum = 0;
  let previous = Infinity;
  for (let k = 1; k < 100; k++) {
    const odd = 2 * k - 1;
    term *= (mu - odd * odd) / (k * eightX);
    const size = Math.abs(term);
    if (size >= previous || size < 1e-17) break;
    previous = size;
    // Signs: P = a0 − a2 + a4 − …, Q = a1 − a3 + a5 − …
    const sign = (k >> 1) % 2 === 0 ? 1 : -1;
    if (k % 2 === 0) p += sign * term;
    else qSum += sign * term;
  }
  pq[offset] = p;
  pq[offset + 1] = qSum;
}

function hankelAsymptotic(x: number, out: Float64Array): void {
  hankelPQ(0, x, out, 0); // P0, Q0 in out[0], out[1]
  const p0 = out[0];
  const q0 = out[1];
  hankelPQ(4, x, out, 0); // P1, Q1
  const p1 = out[0];
  const q1 = out[1];
  const amplitude = Math.sqrt(TWO_OVER_PI / x);
  const c = Math.cos(x) * Math.SQRT1_2;
  const s = Math.sin(x) * Math.SQRT1_2;
  const cos0 = c + s; // cos(x − π/4)
  const sin0 = s - c; // sin(x − π/4)
  const cos1 = s - c; // cos(x − 3π/4)
  const sin1 = -s - c; // sin(x − 3π/4)
  out[0] = amplitude * (p0 * cos0 - q0 * sin0);
  out[1] = amplitude * (p1 * cos1 - q1 * sin1);
  out[2] = amplitude * (p0 * sin0 + q0 * cos0);
  out[3] = amplitude * (p1 * sin1 + q1 * cos1);
}
