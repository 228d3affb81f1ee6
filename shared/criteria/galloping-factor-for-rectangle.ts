import { SOURCES } from "./sources";

/**
 * Factor of galloping instability a_G of rectangular sections against d/b (d along-wind, b cross-wind).
 * FROM MEMORY (EN 1991-1-4:2005 Table E.7), not checked against the standard's text: verify before use.
 * Only the entries recalled with some confidence are listed. Bridge decks (d/b = B/D well above 1) fall outside
 * them, and no factor is assumed for them: a_G must then come with its source, or from static coefficients.
 */
export const GALLOPING_RECTANGLE_POINTS: readonly (readonly [ratio: number, factor: number])[] = [
  [1 / 3, 0.4],
  [1 / 2, 0.7],
  [2 / 3, 1.0],
  [1, 1.2],
];

export interface GallopingFactorLookup {
  value: number;
  origin: "table";
  source: string;
}

/**
 * Factor of galloping instability of a rectangular section, inside the table's range only.
 *
 * **Method**: linear interpolation in {@link GALLOPING_RECTANGLE_POINTS} for 1/3 ≤ d/b ≤ 1; null outside.
 *
 * **Notes**: values from memory of EN 1991-1-4 Table E.7 (see the table's comment). Outside the range no value is
 * guessed: a streamlined or bluff deck's a_G must come from tests, or as −(dC_L/dα + C_D) from measured static
 * coefficients on the same reference length.
 *
 * @param alongToCrossRatio - d/b, dimensionless
 * @returns a_G with its origin and source, or null outside the table's range
 */
export function gallopingFactorForRectangle(alongToCrossRatio: number): GallopingFactorLookup | null {
  const points = GALLOPING_RECTANGLE_POINTS;
  if (!(Number.isFinite(alongToCrossRatio) && alongToCrossRatio >= points[0][0] && alongToCrossRatio <= points[points.length - 1][0])) {
    return null;
  }
  for (let i = 1; i < points.length; i++) {
    const [x1, y1] = points[i];
    if (alongToCrossRatio <= x1) {
      const [x0, y0] = points[i - 1];
      return { value: y0 + ((y1 - y0) * (alongToCrossRatio - x0)) / (x1 - x0), origin: "table", source: SOURCES.gallopingTable };
    }
  }
  return null;
}
