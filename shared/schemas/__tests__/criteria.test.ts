import { describe, expect, it } from "vitest";
import { DEFAULT_REQUIREMENTS } from "@shared/criteria/default-requirements";
import { designWindSchema, projectCriteriaSchema } from "@shared/schemas/criteria";
import { formatStudyIssues } from "@shared/schemas/study";

const valid = () => ({
  wind: {
    basicSpeed: 26,
    probability: { kind: "return-period", years: 100 },
    terrain: { kind: "category", category: "II" },
    deckHeight: 60,
  },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
});

describe("project criteria schema", () => {
  it("accepts valid criteria and fills the orography factor with 1", () => {
    const result = projectCriteriaSchema.safeParse(valid());
    expect(result.success).toBe(true);
    if (result.success) expect(result.data.wind.orographyFactor).toBe(1);
  });

  it("describes the numeric fields with their units", () => {
    const shape = designWindSchema.shape;
    expect(shape.basicSpeed.description).toMatch(/m\/s/);
    expect(shape.deckHeight.description).toMatch(/, m\b/);
    expect(shape.orographyFactor.description).toMatch(/dimensionless/);
    expect(projectCriteriaSchema.shape.requirements.shape.flutter.shape.factor.description).toMatch(/dimensionless/);
  });

  it.each<[string, (doc: any) => void, { path: string; message: string }]>([
    ["zero basic speed", (d) => (d.wind.basicSpeed = 0), { path: "$.wind.basicSpeed", message: "must be greater than 0" }],
    ["deck above 200 m", (d) => (d.wind.deckHeight = 201), { path: "$.wind.deckHeight", message: "must be at most 200 (z_max of EN 1991-1-4 §4.3.2)" }],
    ["unknown category", (d) => (d.wind.terrain.category = "V"), { path: "$.wind.terrain.category", message: 'must be one of "0", "I", "II", "III", "IV"' }],
    ["z_min below z0", (d) => (d.wind.terrain = { kind: "roughness", roughnessLength: 0.3, minimumHeight: 0.2 }),
      { path: "$.wind.terrain.minimumHeight", message: "must be greater than roughnessLength (0.3 m)" }],
    ["return period 1", (d) => (d.wind.probability.years = 1), { path: "$.wind.probability.years", message: "must be greater than 1" }],
    ["unknown probability kind", (d) => (d.wind.probability = { kind: "gust" }),
      { path: "$.wind.probability.kind", message: 'must have "kind" set to "return-period", "annual-probability" or "factor"' }],
    ["blank basis", (d) => (d.requirements.flutter.basis = " "), { path: "$.requirements.flutter.basis", message: "must not be blank" }],
    ["negative factor", (d) => (d.requirements.divergence.factor = -2), { path: "$.requirements.divergence.factor", message: "must be greater than 0" }],
    ["missing requirement", (d) => delete d.requirements.vortexOnset, { path: "$.requirements.vortexOnset", message: "is required" }],
    ["unknown field", (d) => (d.wind.height = 3), { path: "$.wind.height", message: "is not a field of this format" }],
  ])("rejects %s with the path and the rule", (_name, mutate, issue) => {
    const doc = valid();
    mutate(doc);
    // as the criteria form reports them: JSON path and rule (formatStudyIssues)
    const result = projectCriteriaSchema.safeParse(doc);
    expect(result.success).toBe(false);
    if (!result.success) expect(formatStudyIssues(result.error)).toContainEqual(issue);
  });
});
