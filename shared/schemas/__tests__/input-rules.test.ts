import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { DEFAULT_REQUIREMENTS } from "@shared/criteria/default-requirements";
import { clipValue, quoteValue } from "@shared/message-bounds";
import { createAlternativeSchema, patchAlternativeSchema } from "@shared/schemas/alternatives";
import { signInInputSchema } from "@shared/schemas/auth";
import { projectCriteriaSchema, putCriteriaBodySchema, screeningRequestSchema } from "@shared/schemas/criteria";
import { datasetMetaSchema, patchDatasetSchema } from "@shared/schemas/datasets";
import { textProblem } from "@shared/schemas/input-rules";
import {
  acceptInvitationSchema,
  createInvitationSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
} from "@shared/schemas/invitations";
import { projectCreateSchema, projectPatchSchema } from "@shared/schemas/projects";
import { createCommentSchema, returnReviewSchema, signReviewSchema, submitReviewSchema } from "@shared/schemas/review";
import { createRevisionSchema, importRevisionFieldsSchema } from "@shared/schemas/revisions";
import { createStudySchema, patchStudySchema } from "@shared/schemas/studies";
import { parseStudy, studyDocumentSchema } from "@shared/schemas/study";
import { userPatchSchema } from "@shared/schemas/users";
import invented from "./fixtures/invented-deck-study.json";

const study = () => structuredClone(invented) as Record<string, any>;
const criteria = () => ({
  wind: { basicSpeed: 26, probability: { kind: "factor", value: 1, basis: "National Annex" }, terrain: { kind: "category", category: "II" }, deckHeight: 60 },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
  notes: "Governing specification: invented",
});
const provenance = { facility: "Rig (invented)", modelScale: 60, reynoldsNumber: 1e5, turbulenceIntensityPct: 4, flow: "smooth", testDate: "2026-01-02", notes: "n" };
const token = "a".repeat(43);

/** Every input schema with a valid value that holds each of its text fields (enums and ids included). */
const INPUTS: [string, z.ZodType, unknown][] = [
  ["create alternative", createAlternativeSchema, { name: "Deck A", description: "d", deckWidthM: 30, deckDepthM: 3 }],
  ["patch alternative", patchAlternativeSchema, { name: "Deck A", description: "d" }],
  ["sign in", signInInputSchema, { email: "a@b.test", password: "secret" }],
  ["criteria", putCriteriaBodySchema, { criteria: criteria(), baseVersion: 1 }],
  // The screening reads the study's air, deck, structure and aerodynamics and drops its other fields.
  ["screening", screeningRequestSchema, { study: { ...study(), format: undefined, name: undefined }, criteria: criteria(), options: { strouhalNumber: 0.1, strouhalBasis: "test" } }],
  ["flutter data set", datasetMetaSchema, { kind: "flutter-derivatives", name: "Set", meanAngleDeg: 0, convention: { abscissa: "Ur", normalisation: "B", sign: "h-down" }, provenance }],
  ["static data set", datasetMetaSchema, { kind: "static-coefficients", name: "Set", dragReference: "D", provenance }],
  ["patch data set", patchDatasetSchema, { name: "Set", provenance }],
  ["invitation", createInvitationSchema, { email: "a@b.test", role: "analyst", name: "A B" }],
  ["accept invitation", acceptInvitationSchema, { token, password: "long enough pass", name: "A B" }],
  ["password reset", passwordResetRequestSchema, { email: "a@b.test" }],
  ["password reset confirm", passwordResetConfirmSchema, { token, password: "long enough pass" }],
  ["create project", projectCreateSchema, { name: "P", description: "d", siteNotes: "s" }],
  ["patch project", projectPatchSchema, { name: "P", description: "d", siteNotes: "s" }],
  ["submit review", submitReviewSchema, { reviewerId: "3", note: "please" }],
  ["return review", returnReviewSchema, { comments: "fix" }],
  ["sign review", signReviewSchema, { statement: "signed", previewSha256: "ab".repeat(32) }],
  ["comment", createCommentSchema, { body: "note" }],
  ["save revision", createRevisionSchema, { parentRevision: 1, changeNote: "c", study: study() }],
  ["import fields", importRevisionFieldsSchema, { parentRevision: "1", changeNote: "c" }],
  ["create study", createStudySchema, { name: "S", purpose: "p", study: study() }],
  ["patch study", patchStudySchema, { name: "S", purpose: "p" }],
  ["patch user", userPatchSchema, { name: "U" }],
];

/** Paths of every string (or number) leaf of a JSON value. */
function leaves(value: unknown, kind: "string" | "number", path: (string | number)[] = []): (string | number)[][] {
  if (typeof value === kind) return [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => leaves(v, kind, [...path, i]));
  if (typeof value === "object" && value !== null) return Object.entries(value).flatMap(([k, v]) => leaves(v, kind, [...path, k]));
  return [];
}

function withLeaf(value: unknown, path: (string | number)[], replace: (old: any) => unknown): any {
  const copy = structuredClone(value) as any;
  let node = copy;
  for (const key of path.slice(0, -1)) node = node[key];
  node[path.at(-1)!] = replace(node[path.at(-1)!]);
  return copy;
}

describe("one text rule for every text field", () => {
  it("names the NUL character and the unpaired surrogate with their position", () => {
    expect(textProblem("ab\u0000c")).toBe("must not contain the NUL character (U+0000, at character 3)");
    expect(textProblem("a\uD800b")).toMatch(/unpaired surrogate \(U\+D800 at character 2\)/);
    expect(textProblem("a\uDC00")).toMatch(/unpaired surrogate \(U\+DC00 at character 2\)/);
    expect(textProblem("bridge 🌉 deck, Ærø")).toBeNull();
  });

  it.each(INPUTS)("%s: the valid sample passes", (_name, schema, sample) => {
    const result = schema.safeParse(sample);
    expect(result.success, JSON.stringify(result.error?.issues)).toBe(true);
  });

  it.each(INPUTS)("%s: a NUL or a lone surrogate in any string field is refused at its path", (_name, schema, sample) => {
    const paths = leaves(sample, "string");
    expect(paths.length).toBeGreaterThan(0);
    for (const path of paths) {
      for (const bad of ["\u0000", "\uD83D"]) {
        const result = schema.safeParse(withLeaf(sample, path, (old: string) => `${old}${bad}`));
        expect(result.success, `${path.join(".")} with ${JSON.stringify(bad)}`).toBe(false);
        expect(result.error!.issues.map((i) => i.path.join("."))).toContain(path.join("."));
      }
    }
  });

  it("the study format refuses them in its free texts with the JSON path and the rule", () => {
    const doc = study();
    doc.name = "Deck\u0000A";
    doc.structure.modes[1].id = "T\uDFFF";
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues).toContainEqual({ path: "$.name", message: "must not contain the NUL character (U+0000, at character 5)" });
      expect(result.issues.map((i) => i.path)).toContain("$.structure.modes[1].id");
    }
  });
});

describe("denormal and absurdly small numbers", () => {
  const models = [
    study(),
    { ...study(), aerodynamics: { model: "quasi-steady", liftSlope: 5.2, dragCoefficient: 0.08, momentSlope: 1.1 } },
  ];

  it("every numeric field of the study format refuses a denormal number at its path", () => {
    for (const doc of models) {
      const paths = leaves(doc, "number");
      expect(paths.length).toBeGreaterThan(10);
      for (const path of paths) {
        const result = parseStudy(withLeaf(doc, path, () => 1e-320));
        expect(result.ok, path.join(".")).toBe(false);
        if (!result.ok) {
          const jsonPath = `$${path.map((k) => (typeof k === "number" ? `[${k}]` : `.${k}`)).join("")}`;
          expect(result.issues.map((i) => i.path), jsonPath).toContain(jsonPath);
        }
      }
    }
  });

  it("every numeric field of the data-set description refuses a denormal number at its path", () => {
    const meta = INPUTS.find(([name]) => name === "static data set")![2] as Record<string, unknown>;
    const sample = { ...meta, meanAngleDeg: 1, slopeWindow: { fromDeg: -2, toDeg: 2 } };
    for (const path of leaves(sample, "number")) {
      const result = datasetMetaSchema.safeParse(withLeaf(sample, path, () => 1e-320));
      expect(result.success, path.join(".")).toBe(false);
      expect(result.error!.issues.map((i) => i.path.join("."))).toContain(path.join("."));
    }
  });

  it("a sweep from 1e-320 m/s (once a 422 'got NaN' from the engine) is refused with $.sweep.from", () => {
    const doc = study();
    doc.sweep.from = 1e-320;
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues).toEqual([{ path: "$.sweep.from", message: expect.stringMatching(/denormal/) }]);
  });

  it.each<[string, (d: Record<string, any>) => void, string, string]>([
    ["a sweep from 1e-300 m/s", (d) => (d.sweep.from = 1e-300), "$.sweep.from", "must be 0 or at least 0.01 m/s"],
    ["a step of 1e-9 m/s", (d) => (d.sweep.step = 1e-9), "$.sweep.step", "must be at least 0.001 m/s"],
    ["an air density of 1e-12", (d) => (d.air.density = 1e-12), "$.air.density", "must be 0 or at least 0.01 kg/m³"],
    ["a damping ratio of 1e-9", (d) => (d.structure.modes[0].damping = 1e-9), "$.structure.modes[0].damping", "must be 0 or at least 0.0001"],
    ["a reduced velocity of 1e-6", (d) => (d.aerodynamics.reducedVelocity[0] = 1e-6), "$.aerodynamics.reducedVelocity[0]", "must be at least 0.01"],
  ])("%s is refused at its path", (_name, mutate, path, message) => {
    const doc = study();
    mutate(doc);
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues).toContainEqual({ path, message });
  });

  it("zero stays valid where it means something: from 0, still air, zero damping", () => {
    const doc = study();
    doc.sweep.from = 0;
    doc.air.density = 0;
    doc.structure.modes[0].damping = 0;
    expect(parseStudy(doc).ok).toBe(true);
  });

  it("a model scale given as a ratio (1/60) is refused with what to write", () => {
    const result = datasetMetaSchema.safeParse({ ...(INPUTS[5][2] as object), provenance: { ...provenance, modelScale: 1 / 60 } });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]).toMatchObject({ path: ["provenance", "modelScale"], message: expect.stringMatching(/denominator \(60 for 1:60\)/) });
  });
});

describe("structural damping is a ratio", () => {
  it("refuses 0.5 (meant as 0.5 %) with a message that says so", () => {
    const doc = study();
    doc.structure.modes[1].damping = 0.5;
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues).toEqual([
        { path: "$.structure.modes[1].damping", message: "must be at most 0.2: damping is a ratio: 0.005 is 0.5 % (0.5 would be 50 %)" },
      ]);
    }
  });

  it("accepts 0.2 and the values between 0.05 and 0.2 the form only warns about", () => {
    for (const damping of [0.06, 0.2]) {
      const doc = study();
      doc.structure.modes[0].damping = damping;
      expect(parseStudy(doc).ok, String(damping)).toBe(true);
    }
  });
});

describe("bounded messages", () => {
  it("quotes at most 100 characters of a value and says how long it was", () => {
    expect(quoteValue("abc")).toBe('"abc"');
    const quoted = quoteValue("x".repeat(1_000_000));
    expect(quoted).toBe(`"${"x".repeat(100)}…" (1000000 characters)`);
    expect(quoteValue(`${"x".repeat(99)}🌉tail`)).toBe(`"${"x".repeat(99)}…" (105 characters)`); // no half surrogate pair
    expect(clipValue("y".repeat(500)).length).toBe(100);
  });

  it.each([`k${"x".repeat(1_000_000)}`, `k y${"x".repeat(1_000_000)}`])("an unknown key of 1 MB in a study is named in 100 characters", (key) => {
    const doc = study();
    doc.sweep[key] = 1;
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues).toHaveLength(1);
      expect(result.issues[0].path.length).toBeLessThan(120);
      expect(result.issues[0].path).toMatch(/^\$\.sweep(\.k|\["k y)x+…/);
    }
  });

  it("at most 50 problems are listed, the last one counting the rest", () => {
    const doc = study();
    doc.aerodynamics.H1 = doc.aerodynamics.H1.map(() => "bad");
    doc.aerodynamics.reducedVelocity = Array.from({ length: 200 }, (_, i) => -i);
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(JSON.stringify(result.issues).length).toBeLessThan(10_000);
      expect(result.issues).toHaveLength(51);
      expect(result.issues.at(-1)!.message).toMatch(/^… and \d+ more problems$/);
    }
  });
});

describe("table sizes", () => {
  it("a table of more than 10,000 rows is refused with the limit", () => {
    const doc = study();
    doc.aerodynamics = { model: "tabulated", interpolation: "linear", reducedVelocity: Array.from({ length: 10_001 }, (_, i) => 1 + i * 0.01) };
    const result = parseStudy(doc);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues).toContainEqual({ path: "$.aerodynamics.reducedVelocity", message: "must have at most 10000 points" });
  });
});

// The schema a study form validates is the same object the server parses with.
it("the study schema is the one the API parses with", () => {
  expect(studyDocumentSchema.safeParse(study()).success).toBe(true);
  expect(projectCriteriaSchema.safeParse(criteria()).success).toBe(true);
});
