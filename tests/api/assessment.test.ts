/**
 * One assessment per revision, read by every screen: for the invented demo's alternative B (its latest document,
 * criteria and data set, copied into a project of this test so that signing it leaves the demo as seeded), the
 * workspace's revision, the comparison, the review queue, the signed summary and its PDF state the same flutter
 * speed, the same divergence figures with the same basis, the same margins and the same warning count. The signed
 * payload carries every input, read back here from the payload and from the PDF's text. The CLI's JSON says whether
 * the flutter point lies inside the tested range.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Assessment, StoredAssessmentDto } from "../../shared/schemas/assessment.js";
import { PHENOMENA } from "../../shared/schemas/criteria.js";
import type { SummaryPayload } from "../../shared/schemas/summary.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { sweepResultSchema } from "../../shared/schemas/result.js";
import { pdfText } from "../../server/pdf/__tests__/pdf-text.js";
import { createProjectWithMembers, openTestDb, projectIdByName, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { signFromPreview } from "../support/review.js";
import { upload } from "../support/workspace.js";

const DEMO = "Harrowmere Estuary Crossing (invented demo)";
const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
const squash = (s: string) => s.replace(/\s+/g, "");

let cookies: Record<"analyst" | "reviewer" | "viewer", string>;
let demoB: { revisionId: string; document: StudyDocument; assessment: Assessment };
let copy: { projectId: number; studyId: string; revisionId: string };
let workspace: { assessment: StoredAssessmentDto; result: { flutter: { speed: number; insideTestedRange?: boolean | null } } };
let fromComparison: StoredAssessmentDto;
let fromQueue: StoredAssessmentDto;
let summary: { id: string; payload: SummaryPayload; verificationCode: string; verificationUrl: string };
let pdf: string;

/** The demo's alternative B: its study's latest revision, the alternative's flutter-derivative data set, the criteria. */
async function readDemoB() {
  const demoId = await projectIdByName(db, DEMO);
  const comparison = await api(base(), `/api/projects/${demoId}/comparison`, { cookie: cookies.reviewer });
  const row = comparison.body.rows.find((r: { alternativeName: string; studyName: string }) => r.alternativeName.startsWith("B —") && r.studyName.endsWith("alternative B"));
  const revision = await api(base(), `/api/revisions/${row.latest.revisionId}`, { cookie: cookies.reviewer });
  const datasets = await api(base(), `/api/alternatives/${row.alternativeId}/datasets`, { cookie: cookies.analyst });
  const alternatives = await api(base(), `/api/projects/${demoId}/alternatives`, { cookie: cookies.analyst });
  const criteria = await api(base(), `/api/projects/${demoId}/criteria`, { cookie: cookies.analyst });
  return {
    revision: revision.body,
    dataset: datasets.body.find((d: { kind: string }) => d.kind === "flutter-derivatives"),
    alternative: alternatives.body.find((a: { id: string }) => a.id === row.alternativeId),
    criteria: criteria.body.criteria,
  };
}

beforeAll(async () => {
  const [analyst, reviewer, viewer] = await Promise.all(["analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
  cookies = { analyst, reviewer, viewer };
  const demo = await readDemoB();
  demoB = { revisionId: demo.revision.id, document: demo.revision.study, assessment: demo.revision.assessment.assessment };

  // The same inputs in a project of this test: criteria, the alternative, the data set as delivered, the document.
  const projectId = await createProjectWithMembers(db, `Assessment test crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  expect((await api(base(), `/api/projects/${projectId}/criteria`, { method: "PUT", cookie: reviewer, body: { criteria: demo.criteria, confirmBases: [...PHENOMENA] } })).status).toBe(200);
  const alt = await api(base(), `/api/projects/${projectId}/alternatives`, {
    cookie: analyst,
    body: { name: demo.alternative.name, deckWidthM: demo.alternative.deckWidthM, deckDepthM: demo.alternative.deckDepthM },
  });
  const d = demo.dataset;
  const columns = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;
  const csv = [`Ur,${columns.join(",")}`, ...d.delivered.abscissa.map((ur: number, i: number) => [ur, ...columns.map((c) => d.delivered[c][i])].join(","))].join("\n");
  const uploaded = await upload(base(), `/api/alternatives/${alt.body.id}/datasets`, {
    cookie: analyst,
    field: "file",
    file: { name: "demo-b-derivatives.csv", bytes: Buffer.from(`${csv}\n`), type: "text/csv" },
    fields: { meta: JSON.stringify({ kind: d.kind, name: d.name, meanAngleDeg: d.meanAngleDeg, convention: d.convention, provenance: d.provenance }) },
  });
  expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);
  const study = await api(base(), `/api/alternatives/${alt.body.id}/studies`, {
    cookie: analyst,
    body: { name: `Flutter and divergence — copy of alternative B ${suffix}`, study: demoB.document },
  });
  expect(study.status, JSON.stringify(study.body)).toBe(201);
  copy = { projectId, studyId: study.body.id, revisionId: study.body.latestRevision.id };

  // The workspace, the comparison, the queue, the signed summary and its PDF.
  workspace = (await api(base(), `/api/revisions/${copy.revisionId}`, { cookie: analyst })).body;
  const comparison = await api(base(), `/api/projects/${projectId}/comparison`, { cookie: reviewer });
  fromComparison = comparison.body.rows.find((r: { studyId: string }) => r.studyId === copy.studyId).latest.assessment;
  const reviewerId = await userId(db, "reviewer@stillspan.test");
  expect((await api(base(), `/api/revisions/${copy.revisionId}/submit`, { cookie: analyst, body: { reviewerId } })).status).toBe(200);
  const queue = await api(base(), "/api/review-queue", { cookie: reviewer });
  fromQueue = queue.body.find((q: { revisionId: string }) => q.revisionId === copy.revisionId).assessment;
  const signed = await signFromPreview(base(), reviewer, copy.revisionId, "Checked against the demo's alternative B (test).");
  expect(signed.status, JSON.stringify(signed.body)).toBe(201);
  summary = (await api(base(), `/api/summaries/${signed.body.summaryId}`, { cookie: viewer })).body;
  const file = await fetch(`${base()}/api/summaries/${signed.body.summaryId}/pdf`, { headers: { Cookie: viewer } });
  pdf = (await pdfText(Buffer.from(await file.arrayBuffer()))).text.replace(/\s+/g, " ");
});
afterAll(() => db.$client.end());

describe("the demo's alternative B, on every screen", () => {
  it("is the demo's own assessment: the copy states the same figures as the demo's latest revision of B", () => {
    const a = workspace.assessment.assessment;
    expect(a.flutter).toEqual(demoB.assessment.flutter);
    expect(a.divergence).toEqual(demoB.assessment.divergence);
    expect(a.margins).toEqual(demoB.assessment.margins);
    expect(a.warnings).toEqual(demoB.assessment.warnings);
  });

  it("reads one stored assessment in the workspace, the comparison, the review queue and the signed summary", () => {
    expect(fromComparison).toEqual(workspace.assessment);
    expect(fromQueue).toEqual(workspace.assessment);
    expect(summary.payload.assessmentId).toBe(workspace.assessment.id);
    expect(summary.payload.assessment).toEqual(workspace.assessment.assessment);
  });

  it("states the same flutter speed, within the tested range, everywhere and in the PDF", () => {
    const a = workspace.assessment.assessment;
    if (!a.flutter.found) throw new Error("demo B flutters in its sweep");
    expect(a.flutter.speedMps).toBe(workspace.result.flutter.speed);
    expect(workspace.result.flutter.insideTestedRange).toBe(true);
    expect(a.flutter.testedRange.status).toBe("within");
    expect(pdf).toContain(`${a.flutter.speedMps.toFixed(2)} m/s`);
    expect(pdf).toContain(`Flutter point: ${a.flutter.testedRange.statement}.`);
  });

  it("names the same two divergence figures by their basis, and says the same about which one the margin uses", () => {
    const d = workspace.assessment.assessment.divergence;
    expect(d.closedForm.speedMps).toBeGreaterThan(0);
    expect(d.staticInstability).toMatchObject({ branch: "VS1" });
    expect(d.staticInstability.speedMps!).toBeGreaterThan(d.closedForm.speedMps!);
    expect(d.governing).toBe("closed-form");
    expect(pdf).toContain(`Divergence — closed form (EN 1991-1-4 E.4.3, Expr. (E.24)) ${d.closedForm.speedMps!.toFixed(2)} m/s`);
    expect(pdf).toContain(`Divergence — static instability of the sweep ${d.staticInstability.speedMps!.toFixed(2)} m/s`);
    expect(squash(pdf)).toContain(squash(d.marginBasis));
  });

  it("gives the same margins and the same warning count, one per warning", () => {
    const a = workspace.assessment.assessment;
    const statics = a.warnings.filter((w) => w.code === "static-instability");
    expect(statics).toHaveLength(1);
    expect(a.warningCount).toBe(a.warnings.length);
    expect(a.warnings.filter((w) => w.code === "extrapolated-derivatives").map((w) => w.branch).sort()).toEqual(["TS1", "TS1", "VS1", "VS1"]);
    expect(pdf).toContain(`Warnings (${a.warningCount})`);
    for (const m of Object.values(a.margins!)) {
      if (m.margin !== null) expect(pdf).toContain(m.margin.toFixed(2));
      expect(squash(pdf)).toContain(squash(m.statement));
    }
  });

  it("points the PDF to the public page that checks it, which finds it by its code", async () => {
    expect(pdf).toContain(summary.verificationUrl);
    const code = summary.verificationCode;
    const check = await api(base(), `/api/signatures/by-code/${code}`);
    expect(check.status).toBe(200);
    expect(check.body).toMatchObject({ valid: true, reason: null, verificationCode: code, current: true, payload: summary.payload });
    // As typed from paper: upper case, without dashes.
    expect((await api(base(), `/api/signatures/by-code/${code.replace(/-/g, "").toUpperCase()}`)).body.payload).toEqual(summary.payload);
    expect((await api(base(), "/api/signatures/by-code/0000-0000-0000")).status).toBe(404);
    expect((await api(base(), "/api/signatures/by-code/not-a-code")).status).toBe(400);
    const page = await fetch(summary.verificationUrl.replace(new URL(summary.verificationUrl).origin, base()));
    expect(page.status).toBe(200);
    expect(page.headers.get("content-type")).toMatch(/text\/html/);
  });
});

describe("the signed summary carries its inputs", () => {
  it("states every input of the document and of the data set, in the payload and in the PDF", () => {
    const doc = demoB.document;
    const i = summary.payload.inputs;
    expect(i.airDensityKgM3).toBe(doc.air.density);
    expect(i.deck).toEqual({ widthM: doc.deck.width, depthM: doc.deck.depth });
    expect(i.structure.massKgPerM).toBe(doc.structure.mass);
    expect(i.structure.inertiaKgM2PerM).toBe(doc.structure.inertia);
    expect(i.structure.modes).toEqual(doc.structure.modes.map((m) => ({ id: m.id, dof: m.dof, frequencyHz: m.frequency, dampingRatio: m.damping })));
    expect(i.structure.massRatio).toBeCloseTo(doc.structure.mass / (doc.air.density * doc.deck.width ** 2), 10);
    const heave = doc.structure.modes.find((m) => m.dof === "heave")!;
    const torsion = doc.structure.modes.find((m) => m.dof === "torsion")!;
    expect(i.structure.frequencyRatio).toBeCloseTo(torsion.frequency / heave.frequency, 12);
    expect(i.sweep).toEqual({ fromMps: doc.sweep.from, toMps: doc.sweep.to, stepMps: doc.sweep.step });
    const aero = doc.aerodynamics as Extract<StudyDocument["aerodynamics"], { model: "tabulated" }>;
    expect(i.aerodynamics).toMatchObject({ model: "tabulated", interpolation: aero.interpolation, tableRows: aero.reducedVelocity.length });
    expect(i.aerodynamics.testedReducedVelocity).toEqual([aero.reducedVelocity[0], aero.reducedVelocity.at(-1)]);
    const ds = i.aerodynamics.dataset!;
    expect(ds).toMatchObject({ modelScale: 60, flow: "smooth", meanAngleDeg: 0, testDate: "2026-09-17", reynoldsNumber: 1.1e5 });
    expect(ds.deliveredConvention.normalisation).toBe("½ρU²(2B), ½ρU²(2B²)");
    expect(i.aerodynamics.conventions).toContain("K = Bω/U");

    for (const text of [
      `${doc.air.density} kg/m³`,
      `${doc.deck.width} m, ${doc.deck.depth} m`,
      `${doc.structure.mass} kg/m`,
      `${doc.structure.inertia} kg·m²/m`,
      ...doc.structure.modes.flatMap((m) => [`Mode ${m.id}`, `f = ${m.frequency} Hz`, `ζ = ${m.damping}`]),
      i.structure.massRatio!.toFixed(2),
      i.structure.frequencyRatio.toFixed(3),
      ds.facility!,
      "1:60",
      "smooth",
      "0°",
      ds.reynoldsNumber!.toExponential(2),
      ds.testDate!,
      ds.deliveredConvention.normalisation,
      `${doc.sweep.from} – ${doc.sweep.to} m/s, step ${doc.sweep.step} m/s`,
    ]) {
      expect(squash(pdf), text).toContain(squash(text));
    }
  });

  it("names who prepared, checked and approved it", () => {
    expect(summary.payload.signoff).toMatchObject({
      prepared: { name: "Tomas Reedwell", role: "analyst" },
      checked: { name: "Mira Holloway", role: "reviewer" },
      approved: { name: "Mira Holloway" },
    });
    expect(pdf).toContain("Prepared, checked, approved");
    expect(squash(pdf)).toContain(squash("Prepared Tomas Reedwell analyst"));
  });
});

describe("npm run sweep on the demo's alternative B", () => {
  it("prints flutter.insideTestedRange: true in its JSON, with the same flutter speed", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "stillspan-demo-b-"));
    const file = path.join(dir, "demo-b.study.json");
    writeFileSync(file, JSON.stringify(demoB.document));
    const root = path.resolve(__dirname, "../..");
    const run = spawnSync(process.execPath, ["--import", "tsx", path.join(root, "server/cli/sweep.ts"), file], { cwd: root, encoding: "utf8" });
    expect(run.status, run.stderr).toBe(0);
    const result = sweepResultSchema.parse(JSON.parse(run.stdout));
    expect(result.flutter!.insideTestedRange).toBe(true);
    expect(result.flutter!.speed).toBe(workspace.result.flutter.speed);
  });
});
