/**
 * Normalises a complex displacement vector x in place to unit kinetic norm x^H M x = 1 and fixes its phase
 * so that the component with the largest kinetic share M_ii |x_i|² is real and positive.
 *
 * Method: direct evaluation with the full symmetric mass matrix M (n×n row-major).
 * Notes: a zero vector is left unchanged. Fixing the phase makes stored vectors comparable between steps
 * (MAC itself is phase-invariant).
 * @param n number of degrees of freedom
 * @param mass M, kg (or generalized mass)
 * @param re real part of x, overwritten
 * @param im imaginary part of x, overwritten
 */
export function normalizeModeVector(n: number, mass: Float64Array, re: Float64Array, im: Float64Array): void {
  let norm = 0;
  let best = -1;
  let bestShare = -1;
  for (let i = 0; i < n; i++) {
    let mr = 0;
    let mi = 0;
    const row = i * n;
    for (let j = 0; j < n; j++) {
      mr += mass[row + j] * re[j];
      mi += mass[row + j] * im[j];
    }
    norm += re[i] * mr + im[i] * mi;
    const share = mass[row + i] * (re[i] * re[i] + im[i] * im[i]);
    if (share > bestShare) {
      bestShare = share;
      best = i;
    }
  }
  if (!(norm > 0)) return;
  const mod = Math.sqrt(re[best] * re[best] + im[best] * im[best]);
  // multiply by conj(x_best)/|x_best| / sqrt(norm)
  const s = 1 / Math.sqrt(norm);
  const cr = (re[best] / mod) * s;
  const ci = (-im[best] / mod) * s;
  for (let i = 0; i < n; i++) {
    const r = re[i];
    const m = im[i];
    re[i] = r * cr - m * ci;
    im[i] = r * ci + m * cr;
  }
  im[best] = 0;
}
