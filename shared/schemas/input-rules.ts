/**
 * Rules every input schema shares, so a value the database or the engine cannot take is refused at the schema
 * with its path, never deeper down with a 500 or a NaN.
 *
 * - Text: PostgreSQL cannot store the NUL character (U+0000) in `text` or `jsonb`, and a lone UTF-16 surrogate
 *   (an escaped `\uD800` without its pair, which JSON allows) is not Unicode text at all. `userText()` is the
 *   one string schema for text a person or a program sends; it refuses both and says at which character.
 * - Numbers: a denormal (subnormal) double has lost its precision and overflows to Infinity when inverted (a
 *   sweep from 1e-320 m/s gave K = Bω/U = ∞ and then NaN). `normalNumber()` refuses them for every field;
 *   `zeroOrAtLeast()` refuses the tiny positive values a quantity cannot meaningfully take.
 */
import { z } from "zod";

/** Smallest positive normal double (2⁻¹⁰²²); a non-zero number below it in magnitude is denormal. */
export const MIN_NORMAL_NUMBER = 2.2250738585072014e-308;

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** What is wrong with a text for storage (NUL or an unpaired surrogate, with its position), or null. */
export function textProblem(value: string): string | null {
  const nul = value.indexOf("\u0000");
  if (nul >= 0) return `must not contain the NUL character (U+0000, at character ${nul + 1})`;
  const lone = LONE_SURROGATE.exec(value);
  if (lone) {
    const code = lone[0].charCodeAt(0).toString(16).toUpperCase();
    return `must not contain an unpaired surrogate (U+${code} at character ${lone.index + 1}): it is not valid Unicode text`;
  }
  return null;
}

/** A string that can be stored and shown: refuses NUL characters and unpaired surrogates, naming the position. */
export function userText(params?: Parameters<typeof z.string>[0]) {
  return z.string(params).superRefine((value, ctx) => {
    const problem = textProblem(value);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });
}

/** What is wrong with a number's magnitude (denormal), or null. */
export function denormalProblem(value: number): string | null {
  return value !== 0 && Math.abs(value) < MIN_NORMAL_NUMBER
    ? "is a denormal number (non-zero but below 2.2e-308 in magnitude): write 0 or a value of meaningful size"
    : null;
}

/** A finite number (zod 4 refuses NaN and ±Infinity) that is not denormal; later rules are skipped for one. */
export function normalNumber(params?: Parameters<typeof z.number>[0]) {
  return z.number(params).refine((v) => denormalProblem(v) === null, {
    error: (issue) => denormalProblem(issue.input as number) ?? "is a denormal number",
    abort: true,
  });
}

/**
 * Refuses positive values below `min` for a quantity that is either zero (a meaningful setting) or at least of
 * some size — e.g. a sweep starting at 1e-300 m/s.
 */
export function zeroOrAtLeast<T extends z.ZodNumber>(schema: T, min: number, unit: string): T {
  return schema.refine((v) => !(v > 0 && v < min), { error: `must be 0 or at least ${min}${unit}` });
}
