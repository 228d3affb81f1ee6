import { describe, expect, it } from "vitest";
import { extent } from "../extent";

describe("extent", () => {
  it("gives the smallest and largest value", () => {
    expect(extent([3, -1, 7, 2])).toEqual({ min: -1, max: 7 });
    expect(extent([])).toEqual({ min: Infinity, max: -Infinity });
  });

  it("handles a million values (Math.max(...values) overflows the call stack there)", () => {
    const values = Array.from({ length: 1_000_000 }, (_, i) => Math.sin(i));
    expect(() => Math.max(...values)).toThrow(RangeError);
    const { min, max } = extent(values);
    expect(min).toBeGreaterThanOrEqual(-1);
    expect(max).toBeLessThanOrEqual(1);
    expect(max - min).toBeGreaterThan(1.999);
  });
});
