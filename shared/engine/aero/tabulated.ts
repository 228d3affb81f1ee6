import type { StudyAerodynamics } from "../../schemas/study";
import { derivativesFromProducts, emptyProducts } from "./derivative-products";
import { fritschCarlsonSlopes } from "./fritsch-carlson-slopes";
import type { AeroModel, DerivativeProducts } from "./types";

export type TabulatedAerodynamics = Extract<StudyAerodynamics, { model: "tabulated" }>;

const SERIES = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;
/** Power of K in each product: K·H1*, K·H2*, K²·H3*, K²·H4*, K·A1*, K·A2*, K²·A3*, K²·A4*. */
const POWER = [1, 1, 2, 2, 1, 1, 2, 2] as const;
const TWO_PI = 2 * Math.PI;

/**
 * Flutter derivatives measured on a section model, tabulated against reduced velocity Ur = U/(fB) = 2π/K.
 *
 * Method: each derivative is interpolated in Ur, piecewise linearly or with the Fritsch–Carlson monotone
 * cubic (F. N. Fritsch & R. E. Carlson, SIAM J. Numer. Anal. 17(2), 1980); the products K·H1*, K²·H3*, …
 * are formed with K = 2π/Ur. Outside [Ur_min, Ur_max] the products are held at their values at the nearest
 * end (docs/conventions.md §Self-excited forces): quasi-steady-like behaviour at high Ur, and forces that vanish as U → 0 at low Ur.
 *
 * Notes: derivative arrays left out are zeros. The static moment slope is `staticMomentSlope` when given,
 * else K²·A3* at the largest Ur. Extrapolated values are unreliable: callers should warn when
 * `isExtrapolated(K)`. `products` allocates nothing and remembers the last interval (sweeps move slowly).
 * Values are in the study convention (full width B; h, L down; α, M nose-up; Scanlan & Tomko 1971 form).
 *
 * @param table - the study's tabulated aerodynamics (Ur > 0 strictly increasing, ≥ 2 rows, finite values)
 */
export function createTabulatedModel(table: TabulatedAerodynamics): AeroModel {
  const ur = Float64Array.from(table.reducedVelocity);
  const n = ur.length;
  checkTable(table, ur);
  const values = new Float64Array(8 * n);
  SERIES.forEach((name, j) => {
    const column = table[name];
    if (column) values.set(column, j * n);
  });
  const cubic = table.interpolation === "monotone-cubic";
  const slopes = new Float64Array(8 * n);
  if (cubic) {
    for (let j = 0; j < 8; j++) {
      fritschCarlsonSlopes(ur, values.subarray(j * n, (j + 1) * n), slopes.subarray(j * n, (j + 1) * n));
    }
  }
  const low = endProducts(values, n, 0, TWO_PI / ur[0]);
  const high = endProducts(values, n, n - 1, TWO_PI / ur[n - 1]);
  let interval = 0;

  function products(K: number, out: DerivativeProducts = emptyProducts()): DerivativeProducts {
    if (!(K >= 0) || K === Infinity) throw new RangeError(`reduced frequency K must be finite and ≥ 0 (got ${K})`);
    const u = TWO_PI / K; // Infinity at K = 0
    if (u >= ur[n - 1]) return write(out, high);
    if (u <= ur[0]) return write(out, low);
    if (!(ur[interval] <= u && u < ur[interval + 1])) interval = findInterval(ur, u);
    const i = interval;
    const h = ur[i + 1] - ur[i];
    const t = (u - ur[i]) / h;
    const k2 = K * K;
    let a0: number, a1: number, b0 = 0, b1 = 0;
    if (cubic) {
      const s = 1 - t;
      a0 = (1 + 2 * t) * s * s;
      a1 = t * t * (3 - 2 * t);
      b0 = h * t * s * s;
      b1 = -h * t * t * s;
    } else {
      a0 = 1 - t;
      a1 = t;
    }
    out.kH1 = K * blend(values, slopes, i, a0, a1, b0, b1);
    out.kH2 = K * blend(values, slopes, n + i, a0, a1, b0, b1);
    out.k2H3 = k2 * blend(values, slopes, 2 * n + i, a0, a1, b0, b1);
    out.k2H4 = k2 * blend(values, slopes, 3 * n + i, a0, a1, b0, b1);
    out.kA1 = K * blend(values, slopes, 4 * n + i, a0, a1, b0, b1);
    out.kA2 = K * blend(values, slopes, 5 * n + i, a0, a1, b0, b1);
    out.k2A3 = k2 * blend(values, slopes, 6 * n + i, a0, a1, b0, b1);
    out.k2A4 = k2 * blend(values, slopes, 7 * n + i, a0, a1, b0, b1);
    return out;
  }

  // a branch sitting on an end row (to the 1e-9 the tracker locates rows with) is not extrapolating
  const tolerance = 1e-9;
  return {
    kind: "tabulated",
    products,
    derivatives: (K) => derivativesFromProducts(K, products(K)),
    isExtrapolated: (K) => {
      const u = TWO_PI / K;
      return u < ur[0] * (1 - tolerance) || u > ur[n - 1] * (1 + tolerance);
    },
    staticMomentSlope: table.staticMomentSlope ?? high.k2A3,
    reducedVelocityRange: [ur[0], ur[n - 1]],
    reducedVelocityKnots: Array.from(ur),
  };
}

/** Hermite (or linear, with b0 = b1 = 0) blend of nodes `at`, `at + 1` of one series. */
function blend(values: Float64Array, slopes: Float64Array, at: number, a0: number, a1: number, b0: number, b1: number) {
  return a0 * values[at] + a1 * values[at + 1] + b0 * slopes[at] + b1 * slopes[at + 1];
}

function checkTable(table: TabulatedAerodynamics, ur: Float64Array): void {
  if (ur.length < 2) throw new RangeError(`a derivative table needs at least 2 rows (got ${ur.length})`);
  for (let i = 0; i < ur.length; i++) {
    if (!(ur[i] > 0) || !Number.isFinite(ur[i])) throw new RangeError(`reducedVelocity[${i}] must be finite and > 0`);
    if (i > 0 && !(ur[i] > ur[i - 1])) {
      throw new RangeError(`reducedVelocity[${i}] must exceed reducedVelocity[${i - 1}]`);
    }
  }
  for (const name of SERIES) {
    const column = table[name];
    if (!column) continue;
    if (column.length !== ur.length) throw new RangeError(`${name} has ${column.length} values for ${ur.length} rows`);
    column.forEach((value, i) => {
      if (!Number.isFinite(value)) throw new RangeError(`${name}[${i}] must be a finite number`);
    });
  }
  if (table.staticMomentSlope !== undefined && !Number.isFinite(table.staticMomentSlope)) {
    throw new RangeError("staticMomentSlope must be a finite number");
  }
}

function endProducts(values: Float64Array, n: number, row: number, K: number): DerivativeProducts {
  const p = POWER.map((power, j) => values[j * n + row] * (power === 1 ? K : K * K));
  return { kH1: p[0], kH2: p[1], k2H3: p[2], k2H4: p[3], kA1: p[4], kA2: p[5], k2A3: p[6], k2A4: p[7] };
}

function write(out: DerivativeProducts, from: DerivativeProducts): DerivativeProducts {
  out.kH1 = from.kH1;
  out.kH2 = from.kH2;
  out.k2H3 = from.k2H3;
  out.k2H4 = from.k2H4;
  out.kA1 = from.kA1;
  out.kA2 = from.kA2;
  out.k2A3 = from.k2A3;
  out.k2A4 = from.k2A4;
  return out;
}

/** Index i with ur[i] ≤ u < ur[i + 1], for ur[0] < u < ur[n − 1]. */
function findInterval(ur: Float64Array, u: number): number {
  let lo = 0;
  let hi = ur.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ur[mid] <= u) lo = mid;
    else hi = mid;
  }
  return lo;
}
