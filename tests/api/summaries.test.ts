import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { base64url, compactVerify, createLocalJWKSet, type JSONWebKeySet } from "jose";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { canonicalJson } from "../../shared/canonical-json.js";
import { SUMMARY_CAUTIONS } from "../../shared/schemas/summary.js";
import { pdfText } from "../../server/pdf/__tests__/pdf-text.js";
import { insertUser } from "../../server/db/queries/users.js";
import { hashPassword } from "../../server/services/passwords.js";
import { keyStoreFor } from "../../server/services/signing.js";
import { startTestApp, type TestApp } from "../support/app.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { testEnv } from "../support/env.js";
import { api, signIn } from "../support/http.js";
import { addRevision, arrangeStudy, signFromPreview, type ArrangedStudy } from "../support/review.js";

const base = () => testEnv.baseUrl;
const db = openTestDb();
const suffix = Date.now().toString(36);
let projectId: number;
let arranged: ArrangedStudy;
let cookies: Record<"analyst" | "reviewer" | "viewer", string>;
let reviewerId: number;
let firstSummaryId: string;

/** An independent check: jose alone, with nothing but the published JWKS document. */
async function verifiesWithJwks(jws: string, jwks: JSONWebKeySet): Promise<boolean> {
  try {
    await compactVerify(jws, createLocalJWKSet(jwks), { algorithms: ["EdDSA"] });
    return true;
  } catch {
    return false;
  }
}

async function fetchJwks(origin: string): Promise<JSONWebKeySet> {
  const res = await fetch(`${origin}/.well-known/jwks.json`);
  expect(res.status).toBe(200);
  return (await res.json()) as JSONWebKeySet;
}

async function submitAndSign(origin: string, revisionId: string, statement: string): Promise<string> {
  const submitted = await api(origin, `/api/revisions/${revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
  const signed = await signFromPreview(origin, cookies.reviewer, revisionId, statement);
  expect(signed.status, JSON.stringify(signed.body)).toBe(201);
  return signed.body.summaryId;
}

beforeAll(async () => {
  projectId = await createProjectWithMembers(db, `Summary test crossing ${suffix}`, {
    "analyst@stillspan.test": "analyst",
    "reviewer@stillspan.test": "reviewer",
    "viewer@stillspan.test": "viewer",
  });
  const [analyst, reviewer, viewer] = await Promise.all(["analyst", "reviewer", "viewer"].map((r) => signIn(base(), `${r}@stillspan.test`)));
  cookies = { analyst, reviewer, viewer };
  reviewerId = await userId(db, "reviewer@stillspan.test");
  arranged = await arrangeStudy(base(), analyst, projectId, `Summary study ${suffix}`, reviewer);
  firstSummaryId = await submitAndSign(base(), arranged.revisionId, "Stable with margin (ζ > 0 up to the sweep end, λ tracked).");
});
afterAll(() => db.$client.end());

describe("GET /api/summaries/:id", () => {
  it("gives the viewer the signed payload built from the stored revision, the criteria and the data set", async () => {
    const res = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    expect(res.status).toBe(200);
    const { payload } = res.body;
    const revision = await api(base(), `/api/revisions/${arranged.revisionId}`, { cookie: cookies.analyst });
    expect(payload.revision).toMatchObject({ id: arranged.revisionId, number: 1, contentHash: revision.body.documentSha256 });
    // The summary states the revision's stored assessment as it was signed, and names it.
    expect(payload.format).toBe("stillspan.summary/2");
    expect(payload.assessment).toEqual(revision.body.assessment.assessment);
    expect(payload.assessmentId).toBe(revision.body.assessment.id);
    const a = payload.assessment;
    expect(a.flutter.speedMps).toBe(revision.body.result.flutter.speed);
    expect(a.flutter.frequencyHz).toBe(revision.body.result.flutter.frequency);
    expect(payload.engineVersion).toBe(revision.body.engineVersion);
    // The table was copied from the uploaded data set: its file hash, delivered convention and provenance are named.
    const dataset = await api(base(), `/api/datasets/${arranged.datasetId}`, { cookie: cookies.analyst });
    expect(payload.inputs.aerodynamics).toMatchObject({ model: "tabulated", testedReducedVelocity: [2, 12] });
    expect(payload.inputs.aerodynamics.dataset).toMatchObject({
      name: "Twin box, smooth flow, 0° (invented)",
      fileSha256: dataset.body.file.sha256,
      deliveredConvention: { abscissa: "U/(fB)", normalisation: "½ρU²B, ½ρU²B²", signConvention: "h and L downward" },
      facility: "Invented boundary-layer tunnel",
      modelScale: 60,
      flow: "smooth",
      meanAngleDeg: 0,
    });
    // Required speed = 1.2 × v_m (default flutter factor); v_m by EN 1991-1-4 Expr. (4.3)–(4.5), category 0, 62 m, 28 m/s.
    const vm = 0.19 * Math.pow(0.003 / 0.05, 0.07) * Math.log(62 / 0.003) * 28;
    expect(a.designWind.meanSpeedMps).toBeCloseTo(vm, 9);
    const flutterCriterion = a.required.find((c: { phenomenon: string }) => c.phenomenon === "flutter");
    expect(flutterCriterion.requiredSpeedMps).toBeCloseTo(1.2 * vm, 9);
    expect(a.margins.flutter.margin).toBeCloseTo(a.flutter.speedMps / (1.2 * vm), 12);
    // Vortex shedding: v_crit = D n / St (EN 1991-1-4 E.1.3.1) of a 0.124 Hz heave mode is a few m/s, far below
    // 1.25 v_m: lock-in must be investigated (E.1.2(2), E.1.5) — signed as a screening result, not as a margin.
    expect(a.vortexShedding.onsetSpeedMps).toBeLessThan(1.25 * vm);
    expect(a.vortexShedding.status).toBe("investigate");
    expect(Object.keys(a.margins)).toEqual(["flutter", "divergence", "gallopingOnset"]);
    // B/D = 7.6 is outside the a_G table and the study has no static coefficients: galloping is not evaluated, and the
    // measured H1* of the sweep is said to cover galloping-type loss of heave damping.
    expect(a.margins.gallopingOnset).toMatchObject({ status: "not-evaluated", criticalSpeedMps: null, margin: null });
    expect(a.margins.gallopingOnset.statement).toMatch(/give a_G with its source/);
    expect(a.margins.gallopingOnset.statement).toMatch(/covered by the flutter sweep/);
    // Who prepared, checked and approved; no earlier signed revision to compare with.
    expect(payload.signoff).toMatchObject({ prepared: { name: "Tomas Reedwell", role: "analyst" }, checked: { name: "Mira Holloway", role: "reviewer" } });
    expect(payload.changes).toMatchObject({ since: null, items: [] });
    expect(payload.signer).toEqual({ name: "Mira Holloway", email: "reviewer@stillspan.test" });
    expect(payload.statement).toBe("Stable with margin (ζ > 0 up to the sweep end, λ tracked).");
    expect(res.body.branches.length).toBe(2);
    expect(res.body).toMatchObject({ current: true, currentSummary: null, newerUnsigned: false });
    // Absolute addresses built from the configured public base URL (STILLSPAN_PUBLIC_URL, here the test app's own).
    expect(res.body.jwksUrl).toMatch(/^https?:\/\/[^/]+\/\.well-known\/jwks\.json$/);
    expect(res.body.verificationUrl).toBe(`${new URL(res.body.jwksUrl).origin}/verify/${res.body.verificationCode}`);
  });

  it("verifies with an independent jose check that uses only the JWKS document; the payload is its canonical JSON", async () => {
    const res = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    const jwks = await fetchJwks(base());
    const verified = await compactVerify(res.body.jws, createLocalJWKSet(jwks), { algorithms: ["EdDSA"] });
    expect(verified.protectedHeader).toMatchObject({ alg: "EdDSA", kid: res.body.kid, typ: "stillspan-summary+jws" });
    const text = new TextDecoder().decode(verified.payload);
    expect(text).toBe(canonicalJson(res.body.payload));
  });

  it("fails verification when any field of the payload is changed, or the signature is", async () => {
    const res = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    const jwks = await fetchJwks(base());
    const [header, , signature] = res.body.jws.split(".");
    const payload = res.body.payload as Record<string, unknown>;
    const tampered = (value: Record<string, unknown>) => `${header}.${base64url.encode(canonicalJson(value))}.${signature}`;
    expect(await verifiesWithJwks(tampered(payload), jwks), "the untouched payload re-encoded").toBe(true);

    for (const key of Object.keys(payload)) {
      const changed = structuredClone(payload);
      const value = changed[key];
      changed[key] =
        typeof value === "string" ? `${value}x` : value === null ? { speedMps: 1, frequencyHz: 0 } : Array.isArray(value) ? [...value, value[0] ?? "x"] : { ...(value as object), extra: 1 };
      expect(await verifiesWithJwks(tampered(changed), jwks), `payload.${key} changed`).toBe(false);
    }
    const flutterDown = structuredClone(payload) as { assessment: { flutter: { speedMps: number } } };
    flutterDown.assessment.flutter.speedMps -= 0.001;
    expect(await verifiesWithJwks(tampered(flutterDown), jwks), "flutter speed lowered by 1 mm/s").toBe(false);

    const bytes = base64url.decode(signature);
    bytes[10] ^= 0x01;
    expect(await verifiesWithJwks(`${header}.${res.body.jws.split(".")[1]}.${base64url.encode(bytes)}`, jwks), "one bit of the signature").toBe(false);
  });

  it("answers 403 to a signed-in user outside the project, 404 to an unknown id, 401 without a session", async () => {
    const email = `outsider-${suffix}@stillspan.test`;
    await insertUser(db, { email, name: "Outside Reader (invented)", passwordHash: await hashPassword("outsider-password") });
    const outsider = await signIn(base(), email, "outsider-password");
    expect((await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: outsider })).status).toBe(403);
    expect((await api(base(), `/api/summaries/${firstSummaryId}/pdf`, { cookie: outsider })).status).toBe(403);
    expect((await api(base(), "/api/summaries", { cookie: outsider })).body).toEqual([]);
    expect((await api(base(), "/api/summaries/999999999", { cookie: cookies.viewer })).status).toBe(404);
    expect((await api(base(), "/api/summaries/abc", { cookie: cookies.viewer })).status).toBe(404);
    expect((await api(base(), `/api/summaries/${firstSummaryId}`)).status).toBe(401);
  });
});

describe("current, superseded and newer unsigned revisions", () => {
  it("stays current but says so when a newer unsigned revision exists; is superseded once a later one is signed", async () => {
    const second = await addRevision(base(), cookies.analyst, arranged.studyId, 1, 0.0045);
    const pending = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    expect(pending.body).toMatchObject({ current: true, newerUnsigned: true, newestRevisionNumber: 2, currentSummary: null });

    const secondSummaryId = await submitAndSign(base(), second, "Revision 2 checked.");
    // Revision 2's summary lists what changed since revision 1 was signed: the torsional damping.
    const secondSummary = await api(base(), `/api/summaries/${secondSummaryId}`, { cookie: cookies.viewer });
    expect(secondSummary.body.payload.changes).toMatchObject({
      since: { summaryId: firstSummaryId, revisionNumber: 1 },
      items: [{ path: "$.structure.modes[1].damping", label: "Mode 2 damping ratio ζ", kind: "changed", new: 0.0045 }],
      omitted: 0,
    });
    const old = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    expect(old.body).toMatchObject({ current: false, newerUnsigned: false, currentSummary: { id: secondSummaryId, revisionNumber: 2 } });
    const latest = await api(base(), `/api/summaries/${secondSummaryId}`, { cookie: cookies.viewer });
    expect(latest.body).toMatchObject({ current: true, currentSummary: null });

    // POST /api/signatures/verify says the same to anyone holding the JWS.
    const checkOld = await api(base(), "/api/signatures/verify", { body: { jws: old.body.jws } });
    expect(checkOld.body).toMatchObject({ valid: true, current: false, summaryId: firstSummaryId });
    const checkLatest = await api(base(), "/api/signatures/verify", { body: { jws: latest.body.jws } });
    expect(checkLatest.body).toMatchObject({ valid: true, current: true, newerUnsigned: false, summaryId: secondSummaryId });

    const list = await api(base(), "/api/summaries", { cookie: cookies.viewer });
    const mine = list.body.filter((s: { projectId: string }) => s.projectId === String(projectId));
    expect(mine.map((s: { id: string; current: boolean }) => [s.id, s.current])).toEqual([
      [secondSummaryId, true],
      [firstSummaryId, false],
    ]);
    // No failed stability check; vortex shedding to investigate and galloping not evaluated are named.
    const first = mine.find((s: { id: string }) => s.id === firstSummaryId);
    expect(first.outcome).toBe(old.body.payload.assessment.verdict === "fail" ? "fail" : "investigate");
    expect(first.attention).toEqual(
      expect.arrayContaining([
        { phenomenon: "vortexOnset", status: "investigate" },
        { phenomenon: "gallopingOnset", status: "not-evaluated" },
      ]),
    );
  });

  it("lists for the viewer only summaries of projects they belong to", async () => {
    const list = await api(base(), "/api/summaries", { cookie: cookies.viewer });
    expect(list.status).toBe(200);
    const viewerProjects = (await api(base(), "/api/projects", { cookie: cookies.viewer })).body.map((p: { id: string }) => p.id);
    for (const s of list.body) expect(viewerProjects).toContain(s.projectId);
  });
});

describe("GET /api/summaries/:id/pdf", () => {
  it("downloads a PDF attachment whose text carries the flutter speed, the cautions and the verification code", async () => {
    const summary = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    const res = await fetch(`${base()}/api/summaries/${firstSummaryId}/pdf`, { headers: { Cookie: cookies.viewer } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="stability-summary-.+\.pdf"$/);
    const { text } = await pdfText(Buffer.from(await res.arrayBuffer()));
    const flat = text.replace(/\s+/g, " ");
    expect(flat).toContain(`${summary.body.payload.assessment.flutter.speedMps.toFixed(2)} m/s`);
    expect(flat).toContain(summary.body.verificationUrl);
    expect(flat).toContain(SUMMARY_CAUTIONS[0]);
    expect(flat).toContain("wind-tunnel verification");
    expect(flat).toContain(summary.body.verificationCode);
  });
});

describe("key rotation", () => {
  let app: TestApp;
  let keysDir: string;

  beforeAll(async () => {
    keysDir = mkdtempSync(path.join(tmpdir(), "stillspan-rotation-keys-"));
    app = await startTestApp({ env: { STILLSPAN_KEYS_DIR: keysDir } });
  });
  afterAll(async () => {
    await app.close();
    rmSync(keysDir, { recursive: true, force: true });
  });

  it("keeps a summary signed before a rotation verifiable with the JWKS published after it", async () => {
    const third = await addRevision(app.baseUrl, cookies.analyst, arranged.studyId, 2, 0.0043);
    const before = await submitAndSign(app.baseUrl, third, "Signed before the rotation.");
    const summary = await api(app.baseUrl, `/api/summaries/${before}`, { cookie: cookies.viewer });
    const oldKid = summary.body.kid;

    const rotated = await (await keyStoreFor(app.config)).rotate();
    expect(rotated.kid).not.toBe(oldKid);

    const jwks = await fetchJwks(app.baseUrl);
    expect(jwks.keys.map((k) => k.kid)).toEqual([rotated.kid, oldKid]);
    expect(await verifiesWithJwks(summary.body.jws, jwks)).toBe(true);

    const fourth = await addRevision(app.baseUrl, cookies.analyst, arranged.studyId, 3, 0.0044);
    const after = await submitAndSign(app.baseUrl, fourth, "Signed after the rotation.");
    const afterSummary = await api(app.baseUrl, `/api/summaries/${after}`, { cookie: cookies.viewer });
    expect(afterSummary.body.kid).toBe(rotated.kid);
    expect(await verifiesWithJwks(afterSummary.body.jws, jwks)).toBe(true);
  });
});

describe("newer work after a superseded summary", () => {
  it("is not claimed when the unsigned revision lies below the study's newest signed one", async () => {
    // Revisions 1–4 exist (1, 2, 3 and 4 signed above); 5 stays unsigned, 6 is signed.
    const fifth = await addRevision(base(), cookies.analyst, arranged.studyId, 4, 0.0046);
    const sixth = await addRevision(base(), cookies.analyst, arranged.studyId, 5, 0.0047);
    const unsignedBelow = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    expect(unsignedBelow.body).toMatchObject({ current: false, newerUnsigned: true, newestRevisionNumber: 6 });
    expect(fifth).not.toBe(sixth);
    const sixthSummaryId = await submitAndSign(base(), sixth, "Revision 6 checked.");
    const old = await api(base(), `/api/summaries/${firstSummaryId}`, { cookie: cookies.viewer });
    // Superseded by revision 6; revision 5 (unsigned, below it) is not "newer work".
    expect(old.body).toMatchObject({ current: false, newerUnsigned: false, currentSummary: { id: sixthSummaryId, revisionNumber: 6 } });
  });
});
