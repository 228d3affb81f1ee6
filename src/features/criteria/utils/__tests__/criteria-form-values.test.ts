import { describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "@shared/criteria/default-requirements";
import type { ProjectCriteria } from "@shared/schemas/criteria";
import { criteriaResolver, toCriteriaInput, toFormValues } from "@/features/criteria/utils/criteria-form-values";

const saved: ProjectCriteria = {
  wind: {
    basicSpeed: 28,
    probability: { kind: "annual-probability", value: 0.01 },
    terrain: { kind: "roughness", roughnessLength: 0.2, minimumHeight: 4 },
    deckHeight: 62,
    orographyFactor: 1.05,
  },
  requirements: {
    ...structuredClone(DEFAULT_REQUIREMENTS),
    flutter: {
      factor: 1.4,
      basis: "Owner's specification §3.2",
      gustFactor: { value: 1.1, basis: "Gust factor of the specification" },
    },
  },
  notes: "Agreed with the owner.",
};

const resolve = (values: ReturnType<typeof toFormValues>) =>
  criteriaResolver(values, undefined, { fields: {}, shouldUseNativeValidation: false });

describe("the criteria editor's values", () => {
  it("saved criteria survive the trip through the editor unchanged", () => {
    expect(toCriteriaInput(toFormValues(saved))).toEqual(saved);
  });

  it("switching the terrain and probability kinds keeps what was typed for the other kind", () => {
    const values = toFormValues(saved);
    values.wind.terrain.kind = "category";
    values.wind.probability.kind = "return-period";
    const asCategory = toCriteriaInput(values);
    expect(asCategory.wind.terrain).toEqual({ kind: "category", category: "II" });
    expect(asCategory.wind.probability).toEqual({ kind: "return-period", years: 50 });

    values.wind.terrain.kind = "roughness";
    values.wind.probability.kind = "annual-probability";
    expect(toCriteriaInput(values).wind).toEqual(saved.wind);
  });

  it("an unticked multiplier is left out of the criteria, a ticked one goes in with its basis", () => {
    const values = toFormValues(saved);
    values.requirements.flutter.gustFactor.enabled = false;
    values.requirements.divergence.angleFactor = { enabled: true, value: 1.05, basis: "Angle range ±3°" };
    const criteria = toCriteriaInput(values);
    expect(criteria.requirements.flutter).not.toHaveProperty("gustFactor");
    expect(criteria.requirements.divergence.angleFactor).toEqual({ value: 1.05, basis: "Angle range ±3°" });
  });

  it("a blank start takes the default factors with their bases and no wind values", () => {
    const values = toFormValues(null);
    expect(values.requirements.divergence).toMatchObject({ factor: 2, basis: DEFAULT_REQUIREMENTS.divergence.basis });
    expect(Number.isNaN(values.wind.basicSpeed)).toBe(true);
  });
});

describe("criteriaResolver (the shared schema)", () => {
  it("accepts valid values and returns the contract's shape", async () => {
    const result = await resolve(toFormValues(saved));
    expect(result.errors).toEqual({});
    expect(result.values).toEqual(saved);
  });

  it("names a deck above 200 m and an empty basic speed at their fields", async () => {
    const values = toFormValues(saved);
    values.wind.deckHeight = 250;
    values.wind.basicSpeed = Number.NaN;
    const { errors } = await resolve(values);
    expect(errors.wind?.deckHeight?.message).toBe("must be at most 200 (z_max of EN 1991-1-4 §4.3.2)");
    expect(errors.wind?.basicSpeed?.message).toBe("must be a number");
  });

  it("puts a bad annual probability on the annual-probability input, a bad factor on the factor input", async () => {
    const values = toFormValues(saved);
    values.wind.probability.annualProbability = 1.5;
    const asProbability = await resolve(values);
    expect(asProbability.errors.wind?.probability?.annualProbability?.message).toBe("must be less than 1");

    values.wind.probability.kind = "factor";
    values.wind.probability.factor = -1;
    values.wind.probability.basis = "National Annex";
    const asFactor = await resolve(values);
    expect(asFactor.errors.wind?.probability?.factor?.message).toBe("must be greater than 0");
  });

  it("refuses a blank basis and a custom z_min not above z0", async () => {
    const values = toFormValues(saved);
    values.requirements.vortexOnset.basis = "   ";
    values.wind.terrain.minimumHeight = 0.1;
    const { errors } = await resolve(values);
    expect(errors.requirements?.vortexOnset?.basis?.message).toBe("must not be blank");
    expect(errors.wind?.terrain?.minimumHeight?.message).toBe("must be greater than roughnessLength (0.2 m)");
  });
});
