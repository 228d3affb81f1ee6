import { describe, expect, it } from "vitest";
import { MAX_SWEEP_STEPS, parseStudy, studyDocumentSchema, type StudyIssue } from "@shared/schemas/study";
import invented from "./fixtures/invented-deck-study.json";

type Doc = Record<string, any>;
const fixture = (): Doc => structuredClone(invented) as Doc;

function issuesOf(mutate: (doc: Doc) => void): StudyIssue[] {
  const doc = fixture();
  mutate(doc);
  const result = parseStudy(doc);
  if (result.ok) throw new Error("expected the document to be rejected");
  return result.issues;
}

describe("stillspan.study/1 schema", () => {
  it("accepts the invented tabulated study and keeps its values", () => {
    const result = parseStudy(fixture());
    expect(result.ok).toBe(true);
    if (result.ok) {
      expect(result.study.structure.modes.map((mode) => mode.id)).toEqual(["V1", "T1"]);
      expect(result.study.aerodynamics.model).toBe("tabulated");
    }
  });

  it("accepts flat-plate and quasi-steady aerodynamics, and tabulated with missing derivative arrays", () => {
    for (const aerodynamics of [
      { model: "flat-plate" },
      { model: "quasi-steady", liftSlope: 5.2, dragCoefficient: 0.08, momentSlope: 1.1 },
      { model: "tabulated", interpolation: "linear", reducedVelocity: [1, 2], A2: [-0.1, -0.2] },
    ]) {
      expect(parseStudy({ ...fixture(), aerodynamics }).ok).toBe(true);
    }
  });

  it("accepts density 0 (still-air check) and from 0", () => {
    expect(parseStudy({ ...fixture(), air: { density: 0 }, sweep: { from: 0, to: 10, step: 10 } }).ok).toBe(true);
  });

  it("describes every numeric field with a unit", () => {
    const shape = studyDocumentSchema.shape;
    expect(shape.structure.shape.mass.description).toMatch(/kg\/m/);
    expect(shape.structure.shape.inertia.description).toMatch(/kg·m²\/m/);
    expect(shape.air.shape.density.description).toMatch(/kg\/m³/);
    expect(shape.deck.shape.width.description).toMatch(/, m\b/);
    expect(shape.sweep.shape.step.description).toMatch(/m\/s/);
  });

  it.each<[string, (doc: Doc) => void, StudyIssue]>([
    ["wrong format", (d) => (d.format = "stillspan.study/2"), { path: "$.format", message: 'must be "stillspan.study/1"' }],
    ["blank name", (d) => (d.name = "  "), { path: "$.name", message: "must not be blank" }],
    ["missing name", (d) => delete d.name, { path: "$.name", message: "is required" }],
    ["negative density", (d) => (d.air.density = -0.1), { path: "$.air.density", message: "must be at least 0" }],
    ["zero width", (d) => (d.deck.width = 0), { path: "$.deck.width", message: "must be greater than 0" }],
    ["negative depth", (d) => (d.deck.depth = -1), { path: "$.deck.depth", message: "must be greater than 0" }],
    ["zero mass", (d) => (d.structure.mass = 0), { path: "$.structure.mass", message: "must be greater than 0" }],
    ["string inertia", (d) => (d.structure.inertia = "1e6"), { path: "$.structure.inertia", message: "must be a number" }],
    ["zero frequency", (d) => (d.structure.modes[1].frequency = 0),
      { path: "$.structure.modes[1].frequency", message: "must be greater than 0" }],
    ["damping 1", (d) => (d.structure.modes[0].damping = 1),
      { path: "$.structure.modes[0].damping", message: "must be at most 0.2: damping is a ratio: 0.005 is 0.5 % (1 would be 100 %)" }],
    ["negative damping", (d) => (d.structure.modes[0].damping = -0.01),
      { path: "$.structure.modes[0].damping", message: "must be at least 0" }],
    ["bad dof", (d) => (d.structure.modes[1].dof = "sway"),
      { path: "$.structure.modes[1].dof", message: 'must be "heave" or "torsion"' }],
    ["empty id", (d) => (d.structure.modes[0].id = ""),
      { path: "$.structure.modes[0].id", message: "must have 1 to 16 characters" }],
    ["17-character id", (d) => (d.structure.modes[0].id = "V".repeat(17)),
      { path: "$.structure.modes[0].id", message: "must have 1 to 16 characters" }],
    ["repeated id", (d) => (d.structure.modes[1].id = "V1"),
      { path: "$.structure.modes[1].id", message: 'must be unique ("V1" is repeated)' }],
    ["two heave modes", (d) => (d.structure.modes[1].dof = "heave"),
      { path: "$.structure.modes", message: "must contain exactly one heave mode (found 2)" }],
    ["no heave mode", (d) => d.structure.modes.shift(),
      { path: "$.structure.modes", message: "must contain exactly one heave mode (found 0)" }],
    ["unknown model", (d) => (d.aerodynamics = { model: "vortex" }),
      { path: "$.aerodynamics.model", message: 'must have "model" set to "tabulated", "flat-plate" or "quasi-steady"' }],
    ["bad interpolation", (d) => (d.aerodynamics.interpolation = "spline"),
      { path: "$.aerodynamics.interpolation", message: 'must be "linear" or "monotone-cubic"' }],
    ["one table point", (d) => (d.aerodynamics = { model: "tabulated", interpolation: "linear", reducedVelocity: [4] }),
      { path: "$.aerodynamics.reducedVelocity", message: "must have at least 2 points" }],
    ["zero reduced velocity", (d) => (d.aerodynamics.reducedVelocity[0] = 0),
      { path: "$.aerodynamics.reducedVelocity[0]", message: "must be greater than 0" }],
    ["repeated reduced velocity", (d) => (d.aerodynamics.reducedVelocity[3] = 6),
      { path: "$.aerodynamics.reducedVelocity[3]",
        message: "must be greater than the previous value 6 (reduced velocities must increase strictly)" }],
    ["short derivative array", (d) => d.aerodynamics.A2.pop(),
      { path: "$.aerodynamics.A2", message: "must have as many values as reducedVelocity (6), has 5" }],
    ["non-numeric derivative", (d) => (d.aerodynamics.H3[2] = null),
      { path: "$.aerodynamics.H3[2]", message: "must be a number" }],
    ["infinite derivative (not JSON, but possible from code)", (d) => (d.aerodynamics.H1[0] = Infinity),
      { path: "$.aerodynamics.H1[0]", message: "must be a number" }],
    ["NaN static slope", (d) => (d.aerodynamics.staticMomentSlope = Number.NaN),
      { path: "$.aerodynamics.staticMomentSlope", message: "must be a number" }],
    ["misspelt optional field", (d) => (d.aerodynamics.staticMomentSlop = 1.2),
      { path: "$.aerodynamics.staticMomentSlop", message: "is not a field of this format" }],
    ["negative drag", (d) => (d.aerodynamics = { model: "quasi-steady", liftSlope: 1, dragCoefficient: -1, momentSlope: 1 }),
      { path: "$.aerodynamics.dragCoefficient", message: "must be at least 0" }],
    ["missing lift slope", (d) => (d.aerodynamics = { model: "quasi-steady", dragCoefficient: 0.1, momentSlope: 1 }),
      { path: "$.aerodynamics.liftSlope", message: "is required" }],
    ["negative from", (d) => (d.sweep.from = -1), { path: "$.sweep.from", message: "must be at least 0" }],
    ["to not above from", (d) => (d.sweep = { from: 50, to: 50, step: 1 }),
      { path: "$.sweep.to", message: "must be greater than from (50)" }],
    ["zero step", (d) => (d.sweep.step = 0), { path: "$.sweep.step", message: "must be greater than 0" }],
    ["step beyond the range", (d) => (d.sweep = { from: 10, to: 20, step: 11 }),
      { path: "$.sweep.step", message: "must be at most to − from (10)" }],
    ["too many steps", (d) => (d.sweep = { from: 0, to: 200, step: 0.005 }),
      { path: "$.sweep.step", message: `must give at most ${MAX_SWEEP_STEPS} steps between from and to (gives 40000)` }],
  ])("rejects %s with the path and rule", (_name, mutate, expected) => {
    expect(issuesOf(mutate)).toContainEqual(expected);
  });

  // Out-of-range magnitudes once left the solver iterating without end (mass 1e-300 kg/m, width 1e200 m,
  // quasi-steady slopes of 1e300) or failing inside (inertia 1e308): each is now refused at its path.
  it.each<[string, (doc: Doc) => void, StudyIssue]>([
    ["a vanishing mass", (d) => (d.structure.mass = 1e-300),
      { path: "$.structure.mass", message: "must be at least 0.001 kg/m" }],
    ["an astronomic width", (d) => (d.deck.width = 1e200), { path: "$.deck.width", message: "must be at most 1000 m" }],
    ["an astronomic inertia", (d) => (d.structure.inertia = 1e308),
      { path: "$.structure.inertia", message: "must be at most 100000000000000 kg·m²/m" }],
    ["an astronomic frequency", (d) => (d.structure.modes[1].frequency = 1e300),
      { path: "$.structure.modes[1].frequency", message: "must be at most 1000 Hz" }],
    ["the density of a solid", (d) => (d.air.density = 1e30), { path: "$.air.density", message: "must be at most 5 kg/m³" }],
    ["a sweep to 1e9 m/s", (d) => (d.sweep = { from: 0, to: 1e9, step: 1e6 }),
      { path: "$.sweep.to", message: "must be at most 500 m/s" }],
    ["a quasi-steady slope of 1e300",
      (d) => (d.aerodynamics = { model: "quasi-steady", liftSlope: 1e300, dragCoefficient: 1, momentSlope: 1 }),
      { path: "$.aerodynamics.liftSlope", message: "must be at most 100 per rad" }],
  ])("refuses %s with the path and the plausible range", (_name, mutate, expected) => {
    expect(issuesOf(mutate)).toContainEqual(expected);
  });

  it("accepts a 1:100 section model and a heavy full-scale deck at the ends of the ranges", () => {
    const model = fixture();
    Object.assign(model.deck, { width: 0.01, depth: 0.001 });
    Object.assign(model.structure, { mass: 0.001, inertia: 1e-9 });
    model.structure.modes[0].frequency = 1000;
    expect(parseStudy(model).ok).toBe(true);
    const heavy = fixture();
    Object.assign(heavy.deck, { width: 1000, depth: 100 });
    Object.assign(heavy.structure, { mass: 1e8, inertia: 1e14 });
    heavy.air.density = 5;
    heavy.structure.modes[0].frequency = 0.001;
    expect(parseStudy(heavy).ok).toBe(true);
  });

  it("refuses a zero step once, without an infinite step count", () => {
    expect(issuesOf((d) => (d.sweep.step = 0))).toEqual([{ path: "$.sweep.step", message: "must be greater than 0" }]);
  });

  it("accepts exactly 20,000 steps", () => {
    expect(parseStudy({ ...fixture(), sweep: { from: 0, to: 100, step: 0.005 } }).ok).toBe(true);
  });

  it("lists several problems at once, each with its own path", () => {
    const issues = issuesOf((d) => {
      d.structure.modes[1].frequency = -2;
      d.deck.width = 0;
      d.extra = true;
    });
    expect(issues.map((issue) => issue.path).sort()).toEqual(
      ["$.deck.width", "$.extra", "$.structure.modes[1].frequency"].sort(),
    );
  });

  it("rejects a non-object", () => {
    expect(parseStudy("study")).toEqual({ ok: false, issues: [{ path: "$", message: "must be an object" }] });
  });
});
