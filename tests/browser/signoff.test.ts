/**
 * Sign-off in a real browser, on a project of its own: the reviewer reads the summary preview, meets the criteria
 * whose default basis nobody confirmed, confirms them on the project page and signs from the preview; the analyst
 * sees each revision's review state on the studies table, the study header and the revision timeline, and imports a
 * study file after seeing what it changes and writing its change note.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { StudyDocument } from "../../shared/schemas/study.js";
import { baseUrl, collectPageProblems, fillSignInForm, launchBrowser, signOutInPage, type BrowserSession } from "../support/browser.js";
import { createProjectWithMembers, openTestDb, userId } from "../support/db.js";
import { api, signIn as apiSignIn } from "../support/http.js";
import { addRevision, arrangeStudy, type ArrangedStudy } from "../support/review.js";

const db = openTestDb();
const suffix = Date.now().toString(36);
const PROJECT = `Sign-off browser crossing ${suffix} (invented)`;
const STUDY = `Sign-off browser study ${suffix}`;

describe("sign-off in the browser", () => {
  let browser: BrowserSession;
  let problems: string[] = [];
  let projectId: number;
  let arranged: ArrangedStudy;
  let cookies: { analyst: string; reviewer: string };
  let reviewerId: number;

  beforeAll(async () => {
    projectId = await createProjectWithMembers(db, PROJECT, { "analyst@stillspan.test": "analyst", "reviewer@stillspan.test": "reviewer" });
    cookies = { analyst: await apiSignIn(baseUrl(), "analyst@stillspan.test"), reviewer: await apiSignIn(baseUrl(), "reviewer@stillspan.test") };
    reviewerId = await userId(db, "reviewer@stillspan.test");
    // The shipped default bases, unconfirmed; revision 1 submitted to the demo reviewer.
    arranged = await arrangeStudy(baseUrl(), cookies.analyst, projectId, STUDY, cookies.reviewer, { confirmCriteria: false });
    const submitted = await api(baseUrl(), `/api/revisions/${arranged.revisionId}/submit`, { cookie: cookies.analyst, body: { reviewerId } });
    expect(submitted.status).toBe(200);
    browser = await launchBrowser();
    problems = collectPageProblems(browser.page);
  });
  afterAll(async () => {
    await browser?.close();
    await db.$client.end();
  });

  async function signIn(email: string, landing: string) {
    await browser.page.goto(browser.url(landing));
    await browser.page.waitForURL((url) => url.pathname === "/sign-in");
    await fillSignInForm(browser.page, email, landing);
  }

  it("the reviewer cannot sign while default bases stand, confirms them on the project page, then signs from the preview", async () => {
    const { page } = browser;
    await signIn("reviewer@stillspan.test", "/reviews");
    const card = page.getByRole("region", { name: `Review of ${STUDY}, revision 1` });
    await card.getByRole("link", { name: "Read the summary to sign or return" }).click();
    await page.getByRole("heading", { level: 1, name: `Summary to sign — ${STUDY}, revision 1` }).waitFor();
    const blocked = page.getByRole("alert").filter({ hasText: "Criteria not confirmed: this summary cannot be signed yet." });
    await blocked.waitFor();
    expect(await blocked.textContent()).toContain("flutter, torsional divergence, vortex-shedding onset, galloping onset still have the default basis text");
    // Each criterion of the summary is marked where its basis is shown.
    for (const phenomenon of ["flutter", "divergence", "vortexOnset", "gallopingOnset"]) {
      expect(await page.getByTestId(`unconfirmed-${phenomenon}`).textContent(), phenomenon).toBe("Default text — not confirmed");
    }
    const decision = page.getByRole("region", { name: "Your decision" });
    expect(await decision.getByRole("button", { name: "Sign the summary" }).isDisabled()).toBe(true);
    expect(await decision.getByTestId("sign-blocker").textContent()).toMatch(/^Cannot be signed now: In version 1 of the project's criteria/);
    await browser.screenshot("signoff-preview-blocked");
    const previewPath = new URL(page.url()).pathname;

    await blocked.getByRole("link", { name: "Open the project's criteria" }).click();
    const criteria = page.getByRole("region", { name: "Design wind and acceptance criteria" });
    for (const phenomenon of ["flutter", "divergence", "vortexOnset", "gallopingOnset"]) {
      const state = criteria.getByTestId(`basis-state-${phenomenon}`);
      await state.getByRole("button", { name: /^Confirm the .+ basis$/ }).click();
      await expect.poll(() => state.textContent()).toContain("Confirmed by Mira Holloway");
    }

    await page.goto(browser.url(previewPath));
    await page.getByRole("note", { name: "Not signed yet" }).waitFor();
    expect(await page.getByRole("alert").filter({ hasText: "Criteria not confirmed" }).count()).toBe(0);
    expect(await page.getByTestId("unconfirmed-flutter").count()).toBe(0);
    expect(await decision.getByTestId("sign-blocker").count()).toBe(0);
    await decision.getByLabel("Reviewer's statement").fill("Read on the preview: margins against the confirmed criteria checked.");
    await decision.getByRole("button", { name: "Sign the summary" }).click();
    const done = page.getByRole("status").filter({ hasText: `${STUDY}: revision 1 is signed with your statement.` });
    await done.getByRole("link", { name: "Open the signed summary" }).click();
    await page.getByText("✓ Verified").waitFor();
    await page.getByText("Read on the preview: margins against the confirmed criteria checked.").waitFor();
    await signOutInPage(page);
  });

  it("the analyst sees each revision's review state on the studies table, the study header and the timeline", async () => {
    const { page } = browser;
    // Revision 2 is returned, then superseded by revision 3, which is in review.
    const second = await addRevision(baseUrl(), cookies.analyst, arranged.studyId, 1, 0.0045);
    expect((await api(baseUrl(), `/api/revisions/${second}/submit`, { cookie: cookies.analyst, body: { reviewerId } })).status).toBe(200);
    expect((await api(baseUrl(), `/api/revisions/${second}/return`, { cookie: cookies.reviewer, body: { comments: "State the tested range." } })).status).toBe(200);
    const third = await addRevision(baseUrl(), cookies.analyst, arranged.studyId, 2, 0.0044);
    expect((await api(baseUrl(), `/api/revisions/${third}/submit`, { cookie: cookies.analyst, body: { reviewerId } })).status).toBe(200);

    await signIn("analyst@stillspan.test", `/projects/${projectId}`);
    const row = page.getByRole("row").filter({ has: page.getByRole("link", { name: STUDY }) });
    await expect.poll(() => row.getByTestId("review-state-r3").textContent()).toBe("In review with Mira Holloway");
    expect(await row.getByRole("link", { name: "r1 signed" }).count()).toBe(1);
    await browser.screenshot("signoff-studies-table");

    await row.getByRole("link", { name: STUDY }).click();
    await page.waitForURL((url) => url.pathname === `/projects/${projectId}/studies/${arranged.studyId}`);
    await expect.poll(() => page.getByTestId("review-state-r3").first().textContent()).toBe("In review with Mira Holloway");

    await page.goto(browser.url(`/projects/${projectId}/studies/${arranged.studyId}?revision=2`));
    await expect.poll(() => page.getByTestId("review-state-r2").first().textContent()).toBe("Superseded returned by Mira Holloway; r3 is newer");
    const panel = page.getByRole("region", { name: "Review of revision 2" });
    await panel.getByText("Returned, and revision 3 supersedes it: revision 2 is not submitted again.").waitFor();
    expect(await panel.getByRole("button", { name: /Submit/ }).count()).toBe(0);
    await browser.screenshot("signoff-superseded-return");

    await page.goto(browser.url(`/projects/${projectId}/studies/${arranged.studyId}/revisions`));
    const timeline = page.getByRole("list", { name: "Revisions, newest first" });
    await expect.poll(() => timeline.getByTestId("review-state-r3").textContent()).toBe("In review with Mira Holloway");
    expect(await timeline.getByTestId("review-state-r2").textContent()).toBe("Superseded returned by Mira Holloway; r3 is newer");
    expect(await timeline.getByTestId("review-state-r1").textContent()).toBe("Signed by Mira Holloway");
    await browser.screenshot("signoff-timeline-states");
  });

  it("the analyst imports a study file after reading what it changes and writing the change note", async () => {
    const { page } = browser;
    await page.goto(browser.url(`/projects/${projectId}/studies/${arranged.studyId}`));
    const exported = await api<StudyDocument>(baseUrl(), `/api/revisions/${(await latestRevisionId())}/export`, { cookie: cookies.analyst });
    const study = exported.body;
    study.structure.mass = 15850;
    study.structure.modes[1].damping = 0.0041;

    // A broken file first: refused in the browser, nothing uploaded.
    const input = page.getByLabel("Study file to import");
    await input.setInputFiles({ name: "broken.study.json", mimeType: "application/json", buffer: Buffer.from('{"format": "stillspan.study/1",') });
    const refused = page.getByRole("alert").filter({ hasText: "broken.study.json cannot be imported: not valid JSON" });
    await refused.waitFor();
    await refused.getByRole("button", { name: "Dismiss" }).click();

    await input.setInputFiles({ name: "heavier.study.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify(study, null, 2)) });
    const preview = page.getByRole("region", { name: "Import a study file" });
    await preview.getByTestId("import-summary").waitFor();
    expect(await preview.getByTestId("import-summary").textContent()).toBe("2 fields would change from revision 3.");
    const changes = preview.getByRole("table", { name: "Changes the import would make to revision 3" });
    const massRow = changes.getByRole("row").filter({ hasText: "Mass m (kg/m)" });
    expect(await massRow.getByRole("cell").allTextContents()).toEqual(["15200", "15850"]);
    const dampingRow = changes.getByRole("row").filter({ hasText: "$.structure.modes[1].damping" });
    expect(await dampingRow.getByRole("cell").nth(1).textContent()).toBe("0.0041");
    const importButton = preview.getByRole("button", { name: "Import as revision 4" });
    expect(await importButton.isDisabled()).toBe(true);
    await browser.screenshot("signoff-import-diff");

    await preview.getByLabel("Change note of revision 4").fill("Heavier surfacing and the re-measured torsional damping (invented).");
    await importButton.click();
    await page.waitForURL((url) => url.search === "?revision=4");
    await page.getByText("“Heavier surfacing and the re-measured torsional damping (invented).”", { exact: false }).waitFor();
    await expect.poll(() => page.getByTestId("review-state-r4").first().textContent()).toBe("Draft not submitted");
    const diff = await api(baseUrl(), `/api/revisions/${await latestRevisionId(3)}/diff/${await latestRevisionId()}`, { cookie: cookies.analyst });
    expect(diff.body.changes.map((c: { path: string }) => c.path)).toEqual(["$.structure.mass", "$.structure.modes[1].damping"]);
  });

  /** The id of the study's revision `number` (default: the newest). */
  async function latestRevisionId(number?: number): Promise<string> {
    const list = await api<{ id: string; number: number }[]>(baseUrl(), `/api/studies/${arranged.studyId}/revisions`, { cookie: cookies.analyst });
    const wanted = number === undefined ? list.body.reduce((a, b) => (b.number > a.number ? b : a)) : list.body.find((r) => r.number === number)!;
    return wanted.id;
  }

  it("the visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
