import { SOURCES } from "./sources";

/**
 * Factor of galloping instability a_G of rectangular sections against d/b (d along-wind, b cross-wind).
 * FROM MEMORY (EN 1991-1-4:2005 Table E.7), not checked against the standard's text: verify before use.
 * Only the entries recalled with some confidence are listed; bridge decks (d/b = B/D well above 1) fall
 * outside them, and then the standard's fallback a_G = 10 (also from memory) or a value from static
 * coefficients applies.
 */
export const GALLOPING_RECTANGLE_POINTS: readonly (readonly [ratio: number, factor: number])[] = [
  [1 / 3, 0.4],
  [1 / 2, 0.7],
  [2 / 3, 1.0],
  [1, 1.2],
];

/** The standard's a_G where no factor is known (EN 1991-1-4 E.2.2, from memory). */
export const GALLOPING_FACTOR_FALLBACK = 10;

export interface GallopingFactorLookup {
  value: number;
  /** "table" inside the listed range, "fallback" outside it. */
  origin: "table" | "fallback";
  source: string;
  note: string | null;
}

/**
 * Factor of galloping instability of a rectangular section.
 *
 * **Method**: linear interpolation in {@link GALLOPING_RECTANGLE_POINTS} for 1/3 ≤ d/b ≤ 1; outside,
 * the fallback a_G = 10.
 *
 * **Notes**: values from memory of EN 1991-1-4 Table E.7 (see the table's comment). a_G can also be taken
 * as −(dC_L/dα + C_D) from measured static coefficients on the same reference length.
 *
 * @param alongToCrossRatio - d/b, dimensionless
 * @returns a_G with its origin and source
 */
export function gallopingFactorForRectangle(alongToCrossRatio: number): GallopingFactorLookup {
  const points = GALLOPING_RECTANGLE_POINTS;
  if (Number.isFinite(alongToCrossRatio) && alongToCrossRatio >= points[0][0] && alongToCrossRatio <= points[points.length - 1][0]) {
    for (let i = 1; i < points.length; i++) {
      const [x1, y1] = points[i];
      if (alongToCrossRatio <= x1) {
        const [x0, y0] = points[i - 1];
        return { value: y0 + ((y1 - y0) * (alongToCrossRatio - x0)) / (x1 - x0), origin: "table", source: SOURCES.gallopingTable, note: null };
      }
    }
  }
  return {
    value: GALLOPING_FACTOR_FALLBACK,
    origin: "fallback",
    source: SOURCES.gallopingTable,
    note:
      `d/b = ${Number.isFinite(alongToCrossRatio) ? alongToCrossRatio.toFixed(2) : alongToCrossRatio} is outside the ` +
      `rectangle entries: a_G = ${GALLOPING_FACTOR_FALLBACK} (the standard's value where no factor is known, from memory). ` +
      "Enter a_G from tests or static coefficients for a better estimate.",
  };
}
