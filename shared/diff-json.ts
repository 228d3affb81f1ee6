/** One difference between two JSON values, at a JSON path such as `$.structure.modes[1].frequency`. */
export interface JsonChange {
  path: string;
  kind: "changed" | "added" | "removed";
  old?: unknown;
  new?: unknown;
}

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;
const child = (path: string, key: string | number) =>
  typeof key === "number" ? `${path}[${key}]` : IDENTIFIER.test(key) ? `${path}.${key}` : `${path}[${JSON.stringify(key)}]`;

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** Appends `more` to `out` one by one: `out.push(...more)` overflows the stack for a long list of changes. */
function appendAll<T>(out: T[], more: readonly T[]): void {
  for (const item of more) out.push(item);
}

/**
 * Field-by-field differences from `a` to `b`: every leaf that changed, every member or array element that was
 * added or removed, each with its JSON path and the old and new values. Objects are compared by key (in sorted
 * order, so the result does not depend on member order), arrays element by element; a value whose type changes
 * (e.g. an object replaced by a number) is one "changed" entry.
 */
export function diffJson(a: unknown, b: unknown, path = "$"): JsonChange[] {
  if (Array.isArray(a) && Array.isArray(b)) {
    const out: JsonChange[] = [];
    for (let i = 0; i < Math.max(a.length, b.length); i++) {
      if (i >= b.length) out.push({ path: child(path, i), kind: "removed", old: a[i] });
      else if (i >= a.length) out.push({ path: child(path, i), kind: "added", new: b[i] });
      else appendAll(out, diffJson(a[i], b[i], child(path, i)));
    }
    return out;
  }
  if (isObject(a) && isObject(b)) {
    const out: JsonChange[] = [];
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
    for (const key of keys) {
      if (!(key in b)) out.push({ path: child(path, key), kind: "removed", old: a[key] });
      else if (!(key in a)) out.push({ path: child(path, key), kind: "added", new: b[key] });
      else appendAll(out, diffJson(a[key], b[key], child(path, key)));
    }
    return out;
  }
  if (Object.is(a, b) || (a === 0 && b === 0)) return [];
  return [{ path, kind: "changed", old: a, new: b }];
}
