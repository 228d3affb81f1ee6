import type { AeroModel } from "../../aero/types";
import type { StudyDocument } from "../../../schemas/study";

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/**
 * Second route to the flutter speed, independent of the p-k solver and of pole tracking: the frequency-domain
 * flutter determinant. For harmonic motion x e^{iωt} at a fixed reduced frequency K the section-model
 * equations (docs/conventions.md §Equations of motion) read Z(U) x = 0 with
 *   Z(U) = K_s + i(K/B)U C_s − U² [(K/B)² M + ½ρ P(K) + i ½ρ K Q(K)],
 * P = [[K²H4*, B K²H3*], [B K²A4*, B² K²A3*]], Q = [[K H1*, B K H2*], [B K A1*, B² K A2*]] / K·K (products),
 * so det Z(U) is a quartic in U. A real positive root U at some K is a speed with an undamped harmonic
 * solution; the flutter speed is the lowest such U over K, found by scanning K and bisecting where a root's
 * imaginary part changes sign (Theodorsen's classical approach of solving the determinant for real (U, ω)).
 */
export function determinantFlutterSpeed(study: StudyDocument, aero: AeroModel, kRange: [number, number]): number | null {
  return determinantFlutterPoint(study, aero, kRange)?.speed ?? null;
}

/** As `determinantFlutterSpeed`, with the frequency ω/2π = K U/(2πB) of the lowest neutral point (Hz). */
export function determinantFlutterPoint(
  study: StudyDocument,
  aero: AeroModel,
  kRange: [number, number],
): { speed: number; frequency: number } | null {
  const B = study.deck.width;
  const rho = study.air.density;
  const heave = study.structure.modes.find((m) => m.dof === "heave")!;
  const torsion = study.structure.modes.find((m) => m.dof === "torsion")!;
  const m = study.structure.mass;
  const I = study.structure.inertia;
  const wh = 2 * Math.PI * heave.frequency;
  const wa = 2 * Math.PI * torsion.frequency;
  const roots = (K: number): C[] => {
    const p = aero.products(K);
    const kb = K / B;
    // entries as quadratics in U: [c0, c1, c2]
    const e00: C[] = [[m * wh * wh, 0], [0, kb * 2 * m * heave.damping * wh], [-(kb * kb) * m - 0.5 * rho * p.k2H4, -0.5 * rho * p.kH1 * K]];
    const e01: C[] = [[0, 0], [0, 0], [-0.5 * rho * B * p.k2H3, -0.5 * rho * K * B * p.kH2]];
    const e10: C[] = [[0, 0], [0, 0], [-0.5 * rho * B * p.k2A4, -0.5 * rho * K * B * p.kA1]];
    const e11: C[] = [[I * wa * wa, 0], [0, kb * 2 * I * torsion.damping * wa], [-(kb * kb) * I - 0.5 * rho * B * B * p.k2A3, -0.5 * rho * K * B * B * p.kA2]];
    const poly: C[] = Array.from({ length: 5 }, () => [0, 0] as C);
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) poly[i + j] = add(poly[i + j], sub(mul(e00[i], e11[j]), mul(e01[i], e10[j])));
    }
    return polynomialRoots(poly);
  };
  const ks: number[] = [];
  for (let i = 0; i <= 400; i++) ks.push(kRange[0] * (kRange[1] / kRange[0]) ** (i / 400));
  let best: { speed: number; frequency: number } | null = null;
  let previous = roots(ks[0]);
  for (let i = 1; i < ks.length; i++) {
    const current = matchRoots(previous, roots(ks[i]));
    for (let r = 0; r < 4; r++) {
      const a = previous[r];
      const b = current[r];
      if (a[0] <= 0 || b[0] <= 0 || Math.sign(a[1]) === Math.sign(b[1])) continue;
      // bisection on K for the imaginary part of this root
      let lo = ks[i - 1];
      let hi = ks[i];
      let rootLo = a;
      for (let it = 0; it < 80; it++) {
        const mid = 0.5 * (lo + hi);
        const all = roots(mid);
        const near = all.reduce((x, y) => (dist(y, rootLo) < dist(x, rootLo) ? y : x));
        if (Math.sign(near[1]) === Math.sign(rootLo[1])) {
          lo = mid;
          rootLo = near;
        } else hi = mid;
      }
      const speed = rootLo[0];
      if (best === null || speed < best.speed) best = { speed, frequency: (lo * speed) / (2 * Math.PI * B) };
    }
    previous = current;
  }
  return best;
}

const dist = (a: C, b: C) => Math.hypot(a[0] - b[0], a[1] - b[1]);

/** Orders `next` so that next[i] continues prev[i] (best of all 24 permutations of four roots). */
function matchRoots(prev: C[], next: C[]): C[] {
  let best: C[] = next;
  let bestCost = Number.POSITIVE_INFINITY;
  const permute = (rest: C[], chosen: C[]) => {
    if (rest.length === 0) {
      const cost = chosen.reduce((s, c, i) => s + dist(c, prev[i]), 0);
      if (cost < bestCost) {
        bestCost = cost;
        best = chosen;
      }
      return;
    }
    rest.forEach((r, i) => permute([...rest.slice(0, i), ...rest.slice(i + 1)], [...chosen, r]));
  };
  permute(next, []);
  return best;
}

/** Roots of Σ c_i z^i (complex coefficients) by the Durand–Kerner (Weierstrass) iteration. */
function polynomialRoots(coefficients: C[]): C[] {
  const n = coefficients.length - 1;
  const lead = coefficients[n];
  const monic = coefficients.map((c) => div(c, lead));
  const evaluate = (z: C): C => {
    let acc: C = [0, 0];
    for (let i = n; i >= 0; i--) acc = add(mul(acc, z), monic[i]);
    return acc;
  };
  // start on a circle of the Cauchy bound's radius
  const radius = 1 + Math.max(...monic.slice(0, n).map((c) => Math.hypot(c[0], c[1])));
  let z: C[] = Array.from({ length: n }, (_, k) => [radius * Math.cos(0.4 + (2 * Math.PI * k) / n), radius * Math.sin(0.4 + (2 * Math.PI * k) / n)] as C);
  for (let it = 0; it < 500; it++) {
    let change = 0;
    z = z.map((zi, i) => {
      let denominator: C = [1, 0];
      z.forEach((zj, j) => {
        if (j !== i) denominator = mul(denominator, sub(zi, zj));
      });
      const step = div(evaluate(zi), denominator);
      change = Math.max(change, Math.hypot(step[0], step[1]) / Math.max(1, Math.hypot(zi[0], zi[1])));
      return sub(zi, step);
    });
    if (change < 1e-15) break;
  }
  // polish each root with Newton on the monic polynomial
  return z.map((root) => {
    let r = root;
    for (let it = 0; it < 5; it++) {
      let p: C = [0, 0];
      let d: C = [0, 0];
      for (let i = n; i >= 0; i--) {
        d = add(mul(d, r), p);
        p = add(mul(p, r), monic[i]);
      }
      if (d[0] === 0 && d[1] === 0) break;
      r = sub(r, div(p, d));
    }
    return r;
  });
}
