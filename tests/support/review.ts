/** Arranging studies with revisions through the API, and reading what the app's fake SMTP server received. */
import { expect } from "vitest";
import invented from "../../shared/schemas/__tests__/fixtures/invented-deck-study.json";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import { PHENOMENA } from "../../shared/schemas/criteria.js";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { api } from "./http.js";

export const inventedStudy = (): StudyDocument => structuredClone(invented) as StudyDocument;

/**
 * Invented design wind for test projects: v_b 28 m/s, category 0, deck at 62 m (v_m ≈ 43.4 m/s), with the default
 * factors and their default basis texts.
 */
export const testCriteria = () => ({
  wind: { basicSpeed: 28, probability: { kind: "return-period", years: 50 }, terrain: { kind: "category", category: "0" }, deckHeight: 62 },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
});

/** Saves `testCriteria()` as a criteria owner (reviewer or administrator), confirming every basis unless told not to. */
export async function saveTestCriteria(base: string, owner: string, projectId: number, { confirm = true } = {}) {
  const res = await api(base, `/api/projects/${projectId}/criteria`, {
    method: "PUT",
    cookie: owner,
    body: { criteria: testCriteria(), ...(confirm ? { confirmBases: [...PHENOMENA] } : {}) },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

/** A well-formed preview hash that matches no summary: for requests refused before the hash is compared. */
export const ANY_PREVIEW_SHA256 = "0".repeat(64);

/** Signs as a reviewer does: reads the summary preview, then signs it with its hash. Returns the sign response. */
export async function signFromPreview(base: string, cookie: string, revisionId: string, statement: string) {
  const preview = await api(base, `/api/revisions/${revisionId}/summary-preview`, { cookie });
  expect(preview.status, JSON.stringify(preview.body)).toBe(200);
  return api(base, `/api/revisions/${revisionId}/sign`, { cookie, body: { statement, previewSha256: preview.body.previewSha256 } });
}

/** The fixture's derivative table as a CSV in the study convention (Ur, forces on B, h down). */
export function fixtureCsv(): string {
  const a = inventedStudy().aerodynamics as Extract<StudyDocument["aerodynamics"], { model: "tabulated" }>;
  const cols = ["H1", "H2", "H3", "H4", "A1", "A2", "A3", "A4"] as const;
  const rows = a.reducedVelocity.map((ur, i) => [ur, ...cols.map((c) => a[c]![i])].join(","));
  return `Ur,${cols.join(",")}\n${rows.join("\n")}\n`;
}

export interface ArrangedStudy {
  alternativeId: string;
  studyId: string;
  revisionId: string;
  datasetId: string;
}

/**
 * Criteria (saved and confirmed by `criteriaOwner`, a reviewer or administrator), an alternative, a
 * flutter-derivative data set (the fixture's table) and a study whose revision 1 is the fixture computed by the
 * engine — everything through the API, the rest as the analyst.
 */
export async function arrangeStudy(
  base: string,
  analyst: string,
  projectId: number,
  name: string,
  criteriaOwner: string,
  { confirmCriteria = true } = {},
): Promise<ArrangedStudy> {
  await saveTestCriteria(base, criteriaOwner, projectId, { confirm: confirmCriteria });
  const alt = await api(base, `/api/projects/${projectId}/alternatives`, {
    cookie: analyst,
    body: { name: `${name} — twin box (invented)`, deckWidthM: 27.5, deckDepthM: 3.6 },
  });
  expect(alt.status, JSON.stringify(alt.body)).toBe(201);
  const form = new FormData();
  form.append("file", new Blob([fixtureCsv()], { type: "text/csv" }), "twin-box-smooth.csv");
  form.append(
    "meta",
    JSON.stringify({
      kind: "flutter-derivatives",
      name: "Twin box, smooth flow, 0° (invented)",
      convention: { abscissa: "Ur", normalisation: "B", sign: "h-down" },
      provenance: { facility: "Invented boundary-layer tunnel", modelScale: 60, flow: "smooth" },
    }),
  );
  const dsRes = await fetch(`${base}/api/alternatives/${alt.body.id}/datasets`, { method: "POST", headers: { Cookie: analyst }, body: form });
  const dataset = (await dsRes.json()) as { id: string };
  expect(dsRes.status, JSON.stringify(dataset)).toBe(201);
  const study = await api(base, `/api/alternatives/${alt.body.id}/studies`, {
    cookie: analyst,
    body: { name, purpose: "Review workflow test", study: inventedStudy() },
  });
  expect(study.status, JSON.stringify(study.body)).toBe(201);
  return { alternativeId: alt.body.id, studyId: study.body.id, revisionId: study.body.latestRevision.id, datasetId: dataset.id };
}

/** Saves the next revision of a study (structural damping changed so the document differs); returns its id. */
export async function addRevision(base: string, cookie: string, studyId: string, parentRevision: number, damping: number): Promise<string> {
  const study = inventedStudy();
  study.structure.modes[1].damping = damping;
  const res = await api(base, `/api/studies/${studyId}/revisions`, {
    cookie,
    body: { parentRevision, changeNote: `Torsional damping ${damping}`, study },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id;
}

export interface Mail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

/**
 * The messages to `to` whose subject contains `subjectPart`, as the app's fake SMTP server parsed and stored
 * them (read through the admin's dev mailbox). Waits up to `timeoutMs` for at least `count` of them.
 */
export async function waitForMail(
  base: string,
  adminCookie: string,
  to: string,
  subjectPart: string,
  { count = 1, timeoutMs = 10_000 } = {},
): Promise<Mail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await api<{ messages: Mail[] }>(base, `/api/dev/mailbox?to=${encodeURIComponent(to)}&limit=100`, { cookie: adminCookie });
    expect(res.status).toBe(200);
    const found = res.body.messages.filter((m) => m.subject.includes(subjectPart));
    if (found.length >= count || Date.now() > deadline) return found;
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** The one-time link (its token) in a message's text part. */
export function tokenFrom(mail: Mail, pathName: string): string {
  const match = new RegExp(`${pathName}\\?token=([A-Za-z0-9_-]+)`).exec(mail.text);
  expect(match, `a ${pathName}?token=… link in:\n${mail.text}`).not.toBeNull();
  return match![1];
}
