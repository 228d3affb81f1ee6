/** How a delivered set of flutter derivatives is written. */
export interface DerivativeConvention {
  /**
   * Abscissa column: "Ur" = U/(fB); "Ur-half" = U/(fb) with b = B/2; "K" = Bω/U; "k-half" = bω/U.
   */
  abscissa: "Ur" | "Ur-half" | "K" | "k-half";
  /**
   * Force normalisation: "B" = ½ρU²B and ½ρU²B² in front of Scanlan's brackets (ours); "2B" = ½ρU²(2B) and
   * ½ρU²(2B²) (Scanlan & Tomko 1971; Simiu & Scanlan): their values are half of ours.
   */
  normalisation: "B" | "2B";
  /** "h-down": h and L positive downward (ours); "h-up": h and L positive upward. α and M nose-up in both. */
  sign: "h-down" | "h-up";
}

export interface DeliveredDerivatives extends DerivativeConvention {
  /** The abscissa column, in the unit `abscissa` names (all > 0, distinct). */
  abscissaValues: readonly number[];
  H1?: readonly number[];
  H2?: readonly number[];
  H3?: readonly number[];
  H4?: readonly number[];
  A1?: readonly number[];
  A2?: readonly number[];
  A3?: readonly number[];
  A4?: readonly number[];
}

/** Derivatives in the study convention, rows in increasing Ur (the shape of a tabulated study block). */
export interface StudyConventionDerivatives {
  reducedVelocity: number[];
  H1?: number[];
  H2?: number[];
  H3?: number[];
  H4?: number[];
  A1?: number[];
  A2?: number[];
  A3?: number[];
  A4?: number[];
}

const NAMES = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;
/** Derivatives that multiply h or produce L once (not both): they change sign with the heave direction. */
const FLIPPED_BY_H_UP = new Set(["H2", "H3", "A1", "A4"]);

/**
 * Converts a delivered set of flutter derivatives to the study convention (docs/conventions.md §Self-excited forces): Ur = U/(fB),
 * Scanlan's forces on the full width B, h and L downward, α and M nose-up.
 *
 * Method: Ur = value (Ur), value/2 (Ur-half, since U/(fb) = 2U/(fB)), 2π/value (K), π/value (k-half,
 * K = 2k); derivatives ×2 from the 2B normalisation; with h and L upward, L = −L_up and h = −h_up flip the
 * terms that hold exactly one of them: H2*, H3* (α-terms of L) and A1*, A4* (h-terms of M); H1*, H4* (both)
 * and A2*, A3* (neither) keep their sign. Rows are then sorted by increasing Ur.
 * Source: Scanlan & Tomko, Airfoil and bridge deck flutter derivatives, J. Eng. Mech. Div. ASCE 97(EM6), 1971
 * (details from memory);
 * Simiu & Scanlan, Wind Effects on Structures; Jain, Jones & Scanlan, J. Struct. Eng. 122(7), 1996 (form on B).
 *
 * Notes: only the abscissa is read in half-chord terms; the derivatives are assumed to be defined with
 * K = Bω/U and B inside the brackets, as in Scanlan's form. Sets written with k and b inside the brackets
 * (aeronautical form) or in other authors' forms (e.g. Zasso 1996; Strømmen) need a different mapping that
 * these options do not cover — check the source's force expression before importing.
 *
 * @param set - the delivered columns and their convention
 * @returns the same data in the study convention, rows ordered by increasing Ur (dimensionless)
 * @throws RangeError when columns differ in length, values are not finite, or abscissae are ≤ 0 or repeated
 */
export function convertConvention(set: DeliveredDerivatives): StudyConventionDerivatives {
  const n = set.abscissaValues.length;
  const reducedVelocity = set.abscissaValues.map((value, i) => {
    if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`abscissa row ${i + 1} must be finite and > 0`);
    return toReducedVelocity(value, set.abscissa);
  });
  const order = reducedVelocity.map((_, i) => i).sort((a, b) => reducedVelocity[a] - reducedVelocity[b]);
  for (let r = 1; r < n; r++) {
    if (reducedVelocity[order[r]] === reducedVelocity[order[r - 1]]) {
      throw new RangeError(`abscissa rows ${order[r - 1] + 1} and ${order[r] + 1} give the same reduced velocity`);
    }
  }
  const result: StudyConventionDerivatives = { reducedVelocity: order.map((i) => reducedVelocity[i]) };
  const scale = set.normalisation === "2B" ? 2 : 1;
  for (const name of NAMES) {
    const column = set[name];
    if (column === undefined) continue;
    if (column.length !== n) throw new RangeError(`${name} has ${column.length} values for ${n} abscissa rows`);
    const factor = set.sign === "h-up" && FLIPPED_BY_H_UP.has(name) ? -scale : scale;
    result[name] = order.map((i) => {
      if (!Number.isFinite(column[i])) throw new RangeError(`${name} row ${i + 1} must be a finite number`);
      return factor * column[i];
    });
  }
  return result;
}

function toReducedVelocity(value: number, abscissa: DerivativeConvention["abscissa"]): number {
  switch (abscissa) {
    case "Ur":
      return value;
    case "Ur-half":
      return value / 2;
    case "K":
      return (2 * Math.PI) / value;
    case "k-half":
      return Math.PI / value;
  }
}
