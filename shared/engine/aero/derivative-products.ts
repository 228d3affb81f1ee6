import type { DerivativeProducts, FlutterDerivatives } from "./types";

/** A fresh products record, all zero (allocate once, then let `AeroModel.products` write into it). */
export function emptyProducts(): DerivativeProducts {
  return { kH1: 0, kH2: 0, k2H3: 0, k2H4: 0, kA1: 0, kA2: 0, k2A3: 0, k2A4: 0 };
}

/**
 * Divides the products by K or K² to recover H1*..A4*.
 *
 * @param K - reduced frequency Bω/U, > 0 (dimensionless)
 * @param p - products K·H1*, K·H2*, K²·H3*, … at K
 * @returns the flutter derivatives (dimensionless, full-width normalisation)
 */
export function derivativesFromProducts(K: number, p: DerivativeProducts): FlutterDerivatives {
  if (!(K > 0)) throw new RangeError(`flutter derivatives need K > 0 (got ${K})`);
  const k2 = K * K;
  return {
    H1: p.kH1 / K,
    H2: p.kH2 / K,
    H3: p.k2H3 / k2,
    H4: p.k2H4 / k2,
    A1: p.kA1 / K,
    A2: p.kA2 / K,
    A3: p.k2A3 / k2,
    A4: p.k2A4 / k2,
  };
}
