/** Number formats of the criteria screens: fixed decimals, tabular figures set by the `num` class. */

export function fixed(value: number | null | undefined, digits: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? "—" : value.toFixed(digits);
}

/** Up to `digits` significant figures, without trailing zeros: 0.003 → "0.003", 1.5504 → "1.55". */
export function sig(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return Number(value.toPrecision(digits)).toString();
}
