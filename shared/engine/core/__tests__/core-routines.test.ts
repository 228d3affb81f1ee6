import fc from "fast-check";
import { EigenvalueDecomposition, inverse, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { brentRoot } from "../brent-root";
import { factorComplexLu, solveComplexLu } from "../complex-lu";
import { optimalAssignment } from "../hungarian";
import { modalAssurance } from "../mac";
import { createPoleWorkspace } from "../quadratic-operator";
import { refinePole, type Pole } from "../refine-pole";

describe("optimalAssignment (Hungarian method)", () => {
  it("matches the brute-force optimum over all permutations", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5 }).chain((n) => fc.tuple(fc.constant(n), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: n * n, maxLength: n * n }))), ([n, values]) => {
        const cost = Float64Array.from(values);
        const assign = optimalAssignment(cost, n, n);
        const total = Array.from(assign).reduce((s, c, r) => s + cost[r * n + c], 0);
        expect(new Set(assign).size).toBe(n);
        let best = Number.POSITIVE_INFINITY;
        const permute = (rest: number[], row: number, acc: number) => {
          if (rest.length === 0) best = Math.min(best, acc);
          rest.forEach((c, i) => permute([...rest.slice(0, i), ...rest.slice(i + 1)], row + 1, acc + cost[row * n + c]));
        };
        permute([...Array(n).keys()], 0, 0);
        expect(total).toBeCloseTo(best, 12);
      }),
      { numRuns: 60 },
    );
  });

  it("beats greedy pairing where greedy is wrong", () => {
    // greedy takes row 0 → column 0 (cost 0.1) and leaves row 1 with 1.0; optimal total is 0.2 + 0.2
    const assign = optimalAssignment(Float64Array.from([0.1, 0.2, 0.2, 1.0]), 2, 2);
    expect(Array.from(assign)).toEqual([1, 0]);
  });
});

describe("brentRoot", () => {
  it("finds cos x = x (0.7390851332151607, the Dottie number) to the tolerance", () => {
    const f = (x: number) => Math.cos(x) - x;
    expect(Math.abs(brentRoot(f, 0, 1, f(0), f(1), 1e-12) - 0.7390851332151607)).toBeLessThan(1e-11);
  });
});

describe("factorComplexLu + solveComplexLu", () => {
  it("solves random complex systems to a small residual", () => {
    const n = 7;
    const aRe = Float64Array.from({ length: n * n }, (_, i) => Math.sin(i * 1.7) + (i % (n + 1) === 0 ? 3 : 0));
    const aIm = Float64Array.from({ length: n * n }, (_, i) => Math.cos(i * 0.9));
    const bRe = Float64Array.from({ length: n }, (_, i) => i - 2);
    const bIm = Float64Array.from({ length: n }, (_, i) => 1 / (i + 1));
    const [ar, ai, xr, xi] = [aRe.slice(), aIm.slice(), bRe.slice(), bIm.slice()];
    const pivots = new Int32Array(n);
    expect(factorComplexLu(n, ar, ai, pivots)).toBe(true);
    solveComplexLu(n, ar, ai, pivots, xr, xi);
    for (let i = 0; i < n; i++) {
      let r = -bRe[i];
      let m = -bIm[i];
      for (let j = 0; j < n; j++) {
        r += aRe[i * n + j] * xr[j] - aIm[i * n + j] * xi[j];
        m += aRe[i * n + j] * xi[j] + aIm[i * n + j] * xr[j];
      }
      expect(Math.hypot(r, m)).toBeLessThan(1e-12);
    }
  });
});

describe("refinePole (bordered Newton, n = 3) against ml-matrix's eigen-decomposition of the state matrix", () => {
  it("converges from a 2 % perturbation to the eigenvalue of the companion form", () => {
    const n = 3;
    const mass = Float64Array.from([2, 0.3, 0, 0.3, 1.5, 0.1, 0, 0.1, 1]);
    const work = createPoleWorkspace(n);
    work.stiffTot.set([40, -5, 1, -3, 25, -2, 0.5, -2, 10]);
    work.dampTot.set([0.4, 0.1, 0, -0.2, 0.3, 0.05, 0, 0.1, 0.2]);
    const mInv = inverse(new Matrix([[2, 0.3, 0], [0.3, 1.5, 0.1], [0, 0.1, 1]]));
    const a = Matrix.zeros(6, 6);
    const k = new Matrix([[40, -5, 1], [-3, 25, -2], [0.5, -2, 10]]);
    const c = new Matrix([[0.4, 0.1, 0], [-0.2, 0.3, 0.05], [0, 0.1, 0.2]]);
    const mk = mInv.mmul(k);
    const mc = mInv.mmul(c);
    for (let i = 0; i < 3; i++) {
      a.set(i, i + 3, 1);
      for (let j = 0; j < 3; j++) {
        a.set(i + 3, j, -mk.get(i, j));
        a.set(i + 3, j + 3, -mc.get(i, j));
      }
    }
    const evd = new EigenvalueDecomposition(a);
    for (let e = 0; e < 6; e++) {
      const re = evd.realEigenvalues[e];
      const im = evd.imaginaryEigenvalues[e];
      if (im <= 0) continue;
      const out: Pole = { re: 0, im: 0, vecRe: new Float64Array(n), vecIm: new Float64Array(n) };
      // the state eigenvector's displacement part (JAMA layout: V[:,e] + i·V[:,e+1])
      const v = evd.eigenvectorMatrix;
      const vr = Float64Array.from([0, 1, 2].map((i) => v.get(i, e)));
      const vi = Float64Array.from([0, 1, 2].map((i) => v.get(i, e + 1)));
      // warm start as in a sweep: eigenvalue and eigenvector both a few per cent off
      const startRe = vr.map((x, i) => x * (1 + 0.03 * (i - 1)));
      const startIm = vi.map((x, i) => x * (1 - 0.02 * i));
      expect(refinePole(mass, work, re * 1.02, im * 0.98, startRe, startIm, out)).toBe(true);
      expect(Math.hypot(out.re - re, out.im - im)).toBeLessThan(1e-9 * Math.hypot(re, im));
      expect(modalAssurance(n, mass, out.vecRe, out.vecIm, vr, vi)).toBeGreaterThan(1 - 1e-10);
    }
  });
});
