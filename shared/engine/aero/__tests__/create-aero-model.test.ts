import { describe, expect, it } from "vitest";
import { parseStudy } from "../../../schemas/study";
import invented from "../../../schemas/__tests__/fixtures/invented-deck-study.json";
import { createAeroModel } from "../create-aero-model";

describe("createAeroModel", () => {
  it("builds the model each aerodynamics block names", () => {
    expect(createAeroModel({ model: "flat-plate" }).kind).toBe("flat-plate");
    const quasi = createAeroModel({ model: "quasi-steady", liftSlope: 5, dragCoefficient: 0.1, momentSlope: 1.2 });
    expect(quasi.kind).toBe("quasi-steady");
    expect(quasi.staticMomentSlope).toBe(1.2);
  });

  it("builds the tabulated model of a parsed study document", () => {
    const parsed = parseStudy(invented);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
    const model = createAeroModel(parsed.study.aerodynamics);
    expect(model.kind).toBe("tabulated");
    expect(model.reducedVelocityRange).toEqual([2, 12]);
    expect(model.derivatives((2 * Math.PI) / 8).A2).toBeCloseTo(-0.55, 12);
  });
});
