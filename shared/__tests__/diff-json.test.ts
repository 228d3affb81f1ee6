import { describe, expect, it } from "vitest";
import { diffJson } from "../diff-json";

describe("diffJson", () => {
  it("finds nothing between equal values whatever their member order", () => {
    expect(diffJson({ a: 1, b: [1, { c: 2 }] }, { b: [1, { c: 2 }], a: 1 })).toEqual([]);
  });

  it("lists changed leaves, added and removed members and array elements at JSON paths", () => {
    const a = { name: "x", modes: [{ f: 0.1 }, { f: 0.3 }], "odd key": 1, gone: true };
    const b = { name: "y", modes: [{ f: 0.1 }, { f: 0.31 }, { f: 0.5 }], "odd key": 2, added: null };
    expect(diffJson(a, b)).toEqual([
      { path: "$.added", kind: "added", new: null },
      { path: "$.gone", kind: "removed", old: true },
      { path: "$.modes[1].f", kind: "changed", old: 0.3, new: 0.31 },
      { path: "$.modes[2]", kind: "added", new: { f: 0.5 } },
      { path: "$.name", kind: "changed", old: "x", new: "y" },
      { path: '$["odd key"]', kind: "changed", old: 1, new: 2 },
    ]);
  });

  it("reports a change of type as one change", () => {
    expect(diffJson({ a: { b: 1 } }, { a: 5 })).toEqual([{ path: "$.a", kind: "changed", old: { b: 1 }, new: 5 }]);
  });

  it("lists 300,000 changes of one long array without overflowing the stack", () => {
    const a = { table: { values: Array.from({ length: 300_000 }, (_, i) => i) } };
    const b = { table: { values: Array.from({ length: 300_000 }, (_, i) => i + 1) } };
    const changes = diffJson(a, b);
    expect(changes).toHaveLength(300_000);
    expect(changes[299_999]).toEqual({ path: "$.table.values[299999]", kind: "changed", old: 299_999, new: 300_000 });
  });
});
