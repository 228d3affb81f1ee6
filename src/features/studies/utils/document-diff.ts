/** A change of one leaf value between two JSON documents, at its JSON path ("$.structure.modes[1].frequency"). */
export interface FieldChange {
  path: string;
  /** Path segments, for applying the change to another document. */
  segments: Array<string | number>;
  before: unknown;
  after: unknown;
}

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

export function pathText(segments: ReadonlyArray<string | number>): string {
  return segments.reduce<string>(
    (out, s) => (typeof s === "number" ? `${out}[${s}]` : IDENTIFIER.test(s) ? `${out}.${s}` : `${out}[${JSON.stringify(s)}]`),
    "$",
  );
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/**
 * Field-by-field differences between two JSON values. Arrays of numbers (derivative columns) are compared
 * element by element when they have the same length and as a whole otherwise; a key present on one side only
 * is a change from or to `undefined`.
 */
export function diffDocuments(before: unknown, after: unknown, segments: Array<string | number> = []): FieldChange[] {
  if (Object.is(before, after)) return [];
  if (isObject(before) && isObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
    return keys.flatMap((key) => diffDocuments(before[key], after[key], [...segments, key]));
  }
  if (Array.isArray(before) && Array.isArray(after) && before.length === after.length) {
    return before.flatMap((value, i) => diffDocuments(value, after[i], [...segments, i]));
  }
  if (JSON.stringify(before) === JSON.stringify(after)) return [];
  return [{ path: pathText(segments), segments, before, after }];
}

/**
 * Applies changes (made against one base) to another document: the re-base of a conflicting save. A change
 * whose target no longer holds the value it started from is still applied (the user's edit wins) but reported,
 * so the user can look at it.
 */
export function applyChanges<T>(document: T, changes: readonly FieldChange[]): { document: T; overridden: FieldChange[] } {
  const copy = structuredClone(document) as unknown;
  const overridden: FieldChange[] = [];
  for (const change of changes) {
    if (change.segments.length === 0) continue;
    let parent = copy as Record<string | number, unknown>;
    let reachable = true;
    for (const segment of change.segments.slice(0, -1)) {
      const next = parent[segment];
      if (typeof next !== "object" || next === null) {
        reachable = false;
        break;
      }
      parent = next as Record<string | number, unknown>;
    }
    if (!reachable) {
      overridden.push(change);
      continue;
    }
    const last = change.segments[change.segments.length - 1];
    if (JSON.stringify(parent[last]) !== JSON.stringify(change.before)) overridden.push(change);
    if (change.after === undefined) delete parent[last];
    else parent[last] = structuredClone(change.after);
  }
  return { document: copy as T, overridden };
}
