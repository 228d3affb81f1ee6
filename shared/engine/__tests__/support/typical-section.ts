import type { ModalSystem } from "../../core/modal-system";

/**
 * Test-only adapter: the classical typical section (pitch–plunge airfoil with offset elastic axis and static
 * unbalance) written as an n-mode system for the p-k core, in non-dimensional units b = 1, ω_α = 1, ρ = 1.
 *
 * Theodorsen's forces for harmonic motion (h down, α nose-up, L up, M nose-up about the elastic axis at a_h b)
 * [Theodorsen 1935, NACA Report 496; as written in Bisplinghoff, Ashley & Halfman 1955, Fung 1955]:
 *   L = πρb²(ḧ + Uα̇ − b a ḧ_α) + 2πρUb C(k) [ḣ + Uα + b(½ − a)α̇],   (ḧ_α ≡ α̈)
 *   M = πρb²(b a ḧ − Ub(½ − a)α̇ − b²(⅛ + a²)α̈) + 2πρUb²(a + ½) C(k) [ḣ + Uα + b(½ − a)α̇].
 * Equations: m ḧ + S_α α̈ + K_h h = −L, S_α ḧ + I_α α̈ + K_α α = M, with m = μπρb², S_α = m x_α b,
 * I_α = m r_α² b². For harmonic motion at ω = kU/b the forces are F = A(k)x; the p-k core gets
 * K_ae = Re A and C_ae = Im A / ω (accelerations through −ω², the usual p-k reading).
 */
export function typicalSection(params: {
  mu: number;
  a: number;
  xAlpha: number;
  rAlpha: number;
  frequencyRatio: number;
  /** C(k) = F + iG at reduced frequency k = bω/U, written into out[0], out[1]. */
  lift: (k: number, out: Float64Array) => void;
}): ModalSystem {
  const { mu, a, xAlpha, rAlpha, frequencyRatio } = params;
  const rho = 1;
  const b = 1;
  const m = mu * Math.PI * rho * b * b;
  const sAlpha = m * xAlpha * b;
  const iAlpha = m * rAlpha * rAlpha * b * b;
  const c = new Float64Array(2);
  return {
    size: 2,
    mass: Float64Array.from([m, sAlpha, sAlpha, iAlpha]),
    damping: new Float64Array(4),
    stiffness: Float64Array.from([m * frequencyRatio * frequencyRatio, 0, 0, iAlpha]),
    referenceLengthM: b,
    minReducedFrequency: 1e-3,
    hasAero: true,
    aero(u, k, kae, cae) {
      params.lift(k, c);
      const w = (k * u) / b;
      const cr = c[0];
      const ci = c[1];
      // circulatory bracket Q = iω h + U α + iω b(½ − a) α, times 2πρUb C(k)
      const circ = 2 * Math.PI * rho * u * b;
      // coefficients of h and α in Q
      const qhRe = 0, qhIm = w;
      const qaRe = u, qaIm = w * b * (0.5 - a);
      // C·Q coefficients
      const chRe = cr * qhRe - ci * qhIm, chIm = cr * qhIm + ci * qhRe;
      const caRe = cr * qaRe - ci * qaIm, caIm = cr * qaIm + ci * qaRe;
      const nc = Math.PI * rho * b * b;
      // lift L = nc(−ω² h + iωU α + ω² b a α) + circ·C·Q  → force on h is −L
      const lhRe = nc * -w * w + circ * chRe;
      const lhIm = circ * chIm;
      const laRe = nc * w * w * b * a + circ * caRe;
      const laIm = nc * w * u + circ * caIm;
      // moment M = nc(−b a ω² h − iωUb(½−a) α + ω² b²(⅛ + a²) α) + circ·b(a + ½)·C·Q
      const arm = b * (a + 0.5);
      const mhRe = nc * -b * a * w * w + circ * arm * chRe;
      const mhIm = circ * arm * chIm;
      const maRe = nc * w * w * b * b * (0.125 + a * a) + circ * arm * caRe;
      const maIm = nc * -w * u * b * (0.5 - a) + circ * arm * caIm;
      kae[0] = -lhRe; kae[1] = -laRe; kae[2] = mhRe; kae[3] = maRe;
      cae[0] = -lhIm / w; cae[1] = -laIm / w; cae[2] = mhIm / w; cae[3] = maIm / w;
    },
  };
}

/**
 * Jones' two-term approximation of the Theodorsen function, the frequency-domain form of R. T. Jones' fit of
 * Wagner's function φ(s) = 1 − 0.165 e^(−0.0455 s) − 0.335 e^(−0.3 s) (Jones 1940, NACA Report 681):
 * C(k) = 1 − 0.165 k/(k − 0.0455i) − 0.335 k/(k − 0.3i).
 */
export function jonesLift(k: number, out: Float64Array): void {
  let re = 1;
  let im = 0;
  for (const [amp, pole] of [
    [0.165, 0.0455],
    [0.335, 0.3],
  ]) {
    // amp·k/(k − i·pole) = amp·k(k + i·pole)/(k² + pole²)
    const d = k * k + pole * pole;
    re -= (amp * k * k) / d;
    im -= (amp * k * pole) / d;
  }
  out[0] = re;
  out[1] = im;
}
