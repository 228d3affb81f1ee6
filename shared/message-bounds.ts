/** Bounds on what an error message repeats of the user's input: quoted values, names and the number of problems. */

/** Most characters of a user's value quoted in a message; a CSV header cell of 1 MB must not come back whole. */
export const QUOTE_MAX_CHARS = 100;

/**
 * A value from the user, in double quotes, for an error message: at most `max` characters, and when it is longer
 * the quote ends with "…" and says how long the value was. A cut never splits a surrogate pair.
 */
export function quoteValue(value: string, max = QUOTE_MAX_CHARS): string {
  if (value.length <= max) return `"${value}"`;
  let end = max;
  const last = value.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end -= 1;
  return `"${value.slice(0, end)}…" (${value.length} characters)`;
}

/** A value shortened to at most `max` characters (with "…"), for names and paths shown beside a message. */
export function clipValue(value: string, max = QUOTE_MAX_CHARS): string {
  if (value.length <= max) return value;
  let end = max - 1;
  const last = value.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end -= 1;
  return `${value.slice(0, end)}…`;
}

/** Most problems listed for one input; the rest are summarised in one last entry. */
export const MAX_REPORTED_ISSUES = 50;

/** `issues` cut to `MAX_REPORTED_ISSUES`, the rest summarised by `more(count)` as one last entry. */
export function capList<T>(issues: T[], more: (count: number) => T): T[] {
  if (issues.length <= MAX_REPORTED_ISSUES) return issues;
  return [...issues.slice(0, MAX_REPORTED_ISSUES), more(issues.length - MAX_REPORTED_ISSUES)];
}
