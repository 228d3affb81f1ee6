import { describe, expect, it } from "vitest";
import { applyChanges, diffDocuments } from "@/features/studies/utils/document-diff";

const base = {
  air: { density: 1.225 },
  structure: { modes: [{ id: "V1", frequency: 0.124 }, { id: "T1", frequency: 0.342 }] },
  aerodynamics: { model: "tabulated", reducedVelocity: [2, 4], H1: [-0.6, -1.9] },
};

describe("diffDocuments", () => {
  it("lists each changed leaf with its JSON path, element by element in same-length arrays", () => {
    const edited = structuredClone(base);
    edited.structure.modes[1].frequency = 0.383;
    edited.aerodynamics.H1[1] = -2;
    expect(diffDocuments(base, edited).map((c) => [c.path, c.before, c.after])).toEqual([
      ["$.structure.modes[1].frequency", 0.342, 0.383],
      ["$.aerodynamics.H1[1]", -1.9, -2],
    ]);
  });

  it("treats an array of another length, and added or removed keys, as whole changes", () => {
    const edited = { ...structuredClone(base), aerodynamics: { model: "flat-plate" } };
    const paths = diffDocuments(base, edited).map((c) => c.path);
    expect(paths).toEqual(["$.aerodynamics.model", "$.aerodynamics.reducedVelocity", "$.aerodynamics.H1"]);
  });

  it("finds nothing between documents that differ only in key order", () => {
    expect(diffDocuments({ a: 1, b: { c: 2, d: 3 } }, { b: { d: 3, c: 2 }, a: 1 })).toEqual([]);
  });
});

describe("applyChanges (re-base)", () => {
  it("re-applies this session's edits on a newer revision and keeps the newer revision's other changes", () => {
    const mine = structuredClone(base);
    mine.structure.modes[1].frequency = 0.383;
    const theirs = structuredClone(base);
    theirs.air.density = 1.25;

    const { document, overridden } = applyChanges(theirs, diffDocuments(base, mine));

    expect(document.air.density).toBe(1.25);
    expect(document.structure.modes[1].frequency).toBe(0.383);
    expect(overridden).toEqual([]);
    expect(theirs.structure.modes[1].frequency).toBe(0.342);
  });

  it("reports a field both sides changed, keeping the user's value there", () => {
    const mine = structuredClone(base);
    mine.air.density = 1.2;
    const theirs = structuredClone(base);
    theirs.air.density = 1.25;

    const { document, overridden } = applyChanges(theirs, diffDocuments(base, mine));

    expect(document.air.density).toBe(1.2);
    expect(overridden.map((c) => c.path)).toEqual(["$.air.density"]);
  });
});
