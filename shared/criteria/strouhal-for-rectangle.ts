import { SOURCES } from "./sources";

/**
 * Strouhal number of a rectangular section with sharp corners against d/b (d along-wind, b cross-wind; for a
 * deck d/b = B/D), piecewise linear between the points below.
 *
 * FROM MEMORY (EN 1991-1-4:2005 Table E.1 / Figure E.2), not checked against the standard's text: verify
 * before relying on it, and prefer the deck's measured St. The jump between d/b = 3 and 3.5 marks the
 * reattachment of the separated shear layers; near it St is uncertain.
 */
export const STROUHAL_RECTANGLE_POINTS: readonly (readonly [ratio: number, strouhal: number])[] = [
  [1, 0.12],
  [2, 0.06],
  [3, 0.06],
  [3.5, 0.15],
  [5, 0.11],
  [10, 0.09],
];

export interface StrouhalLookup {
  /** St on the cross-wind dimension b, or null when d/b lies outside the table. */
  value: number | null;
  source: string;
  note: string | null;
}

/**
 * Strouhal number of a sharp-cornered rectangle from its side ratio.
 *
 * **Method**: linear interpolation in {@link STROUHAL_RECTANGLE_POINTS}; no extrapolation.
 *
 * **Notes**: values from memory of EN 1991-1-4 Table E.1 / Figure E.2 (see the table's comment). Bridge decks
 * with fairings, parapets or edge details shed at other Strouhal numbers: a measured value governs.
 *
 * @param alongToCrossRatio - d/b (deck width over depth, B/D), dimensionless
 * @returns St (or null outside 1 ≤ d/b ≤ 10) with its source
 */
export function strouhalForRectangle(alongToCrossRatio: number): StrouhalLookup {
  const points = STROUHAL_RECTANGLE_POINTS;
  const first = points[0][0];
  const last = points[points.length - 1][0];
  if (!(Number.isFinite(alongToCrossRatio) && alongToCrossRatio >= first && alongToCrossRatio <= last)) {
    return {
      value: null,
      source: SOURCES.strouhalTable,
      // Three significant figures are plenty for a ratio read against a table (10.685714… reads 10.7).
      note: `d/b = ${Number(alongToCrossRatio.toPrecision(3))} lies outside the table (${first} to ${last}): enter a measured Strouhal number.`,
    };
  }
  for (let i = 1; i < points.length; i++) {
    const [x1, y1] = points[i];
    if (alongToCrossRatio <= x1) {
      const [x0, y0] = points[i - 1];
      const value = y0 + ((y1 - y0) * (alongToCrossRatio - x0)) / (x1 - x0);
      const nearJump = alongToCrossRatio > 2.75 && alongToCrossRatio < 3.75;
      return {
        value,
        source: SOURCES.strouhalTable,
        note: nearJump ? "d/b is near the jump of St between 3 and 3.5: the value is uncertain." : null,
      };
    }
  }
  return { value: points[points.length - 1][1], source: SOURCES.strouhalTable, note: null };
}
