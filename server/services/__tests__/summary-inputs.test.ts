import { describe, expect, it } from "vitest";
import type { StudyAerodynamics } from "../../../shared/schemas/study.js";
import { matchingDataset } from "../summary-inputs.js";

type Dataset = Parameters<typeof matchingDataset>[0][number];

const table = {
  reducedVelocity: [2, 4, 6],
  H1: [-0.6, -1.9, -3.3],
  H2: [-0.1, -0.5, -0.8],
  H3: [-0.3, -1.4, -3.35],
  H4: [0.35, 0.62, 0.48],
  A1: [0.15, 0.49, 0.84],
  A2: [-0.03, -0.15, -0.33],
  A3: [0.06, 0.38, 0.88],
  A4: [0, 0, 0],
};

/** An invented data set row as the datasets query returns it; only the fields matching reads are meaningful. */
function dataset(id: number, converted: Record<string, number[]>, kind: Dataset["kind"] = "flutter-derivatives"): Dataset {
  return { id, kind, converted, name: `set ${id}` } as unknown as Dataset;
}

const study = (overrides: Partial<Record<string, number[] | undefined>> = {}): StudyAerodynamics =>
  ({ model: "tabulated", interpolation: "linear", ...table, ...overrides }) as StudyAerodynamics;

describe("matchingDataset: the data set a study's derivative table was copied from", () => {
  it("finds the set whose converted table equals the study's, column by column", () => {
    const other = dataset(1, { ...table, H1: [-0.6, -1.9, -3.31] });
    const same = dataset(2, { ...table });
    expect(matchingDataset([other, same], study())?.id).toBe(2);
  });

  it("treats a derivative column left out of the study as zeros, as the engine does", () => {
    expect(matchingDataset([dataset(3, { ...table })], study({ A4: undefined }))?.id).toBe(3);
  });

  it("accepts differences at round-off level only (relative 1e-9)", () => {
    const nudged = dataset(4, { ...table, A3: table.A3.map((v) => v * (1 + 1e-12)) });
    expect(matchingDataset([nudged], study())?.id).toBe(4);
    const changed = dataset(5, { ...table, A3: table.A3.map((v) => v * (1 + 1e-6)) });
    expect(matchingDataset([changed], study())).toBeUndefined();
  });

  it("finds nothing for theory models, static-coefficient sets or a table of another length", () => {
    expect(matchingDataset([dataset(6, { ...table })], { model: "flat-plate" })).toBeUndefined();
    expect(matchingDataset([dataset(7, { rows: [] } as never, "static-coefficients")], study())).toBeUndefined();
    const longer = dataset(8, Object.fromEntries(Object.entries(table).map(([k, v]) => [k, [...v, 0]])));
    expect(matchingDataset([longer], study())).toBeUndefined();
  });
});
