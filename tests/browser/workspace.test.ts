/**
 * The study workspace in a real browser, as the analyst uses it on the demo crossing: open the demo study,
 * change the torsional frequency, run the sweep on the server and read the new flutter speed (checked against
 * the engine run here on the same document), save it as a revision, find it in the timeline and its diff,
 * compare two revisions, and load a broken derivative CSV whose row error shows in place. One browser, few
 * page loads; a screenshot of each main screen goes to test-artifacts/.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runSweep } from "../../shared/engine/run-sweep";
import type { RevisionDto } from "../../shared/schemas/revisions";
import { parseStudy, type StudyDocument } from "../../shared/schemas/study";
import { collectPageProblems, fillSignInForm, launchBrowser, signOutInPage, type BrowserSession } from "../support/browser";

const DEMO_PROJECT = "Harrowmere Estuary Crossing (invented demo)";

describe("the analyst's study workspace", () => {
  let browser: BrowserSession;
  let studyPath = "";
  let startRevision: RevisionDto;
  let savedNumber = 0;
  let problems: string[] = [];

  beforeAll(async () => {
    browser = await launchBrowser();
    // 401 (session probe), 404, and the 400 / 409 / 403 answers this file provokes on purpose.
    problems = collectPageProblems(browser.page, [400, 401, 403, 404, 409]);
    const { page } = browser;
    await page.goto(browser.url("/projects"));
    await signIn("analyst@stillspan.test", "/projects");
  });

  /** Fills the sign-in form the browser is on and waits for the landing page. */
  const signIn = (email: string, landing: string) => fillSignInForm(browser.page, email, landing);
  const signOut = () => signOutInPage(browser.page);

  /** POSTs JSON from the page (with its session cookie); returns the status and body. */
  function post(url: string, body: unknown) {
    return browser.page.evaluate(
      async ({ url, body }) => {
        const res = await fetch(url, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
        return { status: res.status, body: await res.json().catch(() => null) };
      },
      { url, body },
    );
  }

  afterAll(async () => {
    await browser?.close();
  });

  it("the project page lists the alternatives with their studies, critical speeds and the required speeds", async () => {
    const { page } = browser;

    await page.getByRole("link", { name: DEMO_PROJECT }).click();

    await page.getByRole("heading", { name: "Deck alternatives" }).waitFor();
    const studies = page.getByRole("table", { name: /^Studies of / });
    await studies.first().waitFor();
    expect(await studies.first().textContent()).toMatch(/\d+\.\d\d m\/s/);
    expect(await page.getByTestId("margins-basis").textContent()).toMatch(/Margins against flutter \d+\.\d m\/s/);
    // A delivered file with a bad value is refused with its line and column; nothing is stored.
    await page.getByRole("button", { name: "Upload a data set…" }).first().click();
    const uploadForm = page.getByRole("form", { name: "Upload a data set" });
    const badCsv = "Ur,H1,H2,H3,H4,A1,A2,A3,A4\n2,-0.6,-0.1,-0.3,0.3,0.15,-0.03,0.06,0.02\n4,-1.9,-0.5,-1.4,0.6,0.49,n/a,0.38,0.09\n";
    await uploadForm.getByLabel("CSV file (≤ 1 MB)").setInputFiles({ name: "tunnel.csv", mimeType: "text/csv", buffer: Buffer.from(badCsv) });
    await uploadForm.getByRole("button", { name: "Upload and convert" }).click();
    const refusal = uploadForm.getByRole("alert");
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/tunnel\.csv: line 3.*A2/i);
    expect(await refusal.textContent()).toContain("Nothing was stored.");
    await browser.screenshot("project-studies");
    await uploadForm.getByRole("button", { name: "Cancel" }).click();
  });

  it("opening the demo study shows its inputs, derived quantities and the stored result", async () => {
    const { page } = browser;

    await page.getByRole("table", { name: /^Studies of / }).first().getByRole("link").first().click();

    await page.waitForURL((url) => /\/studies\/[^/]+$/.test(url.pathname));
    studyPath = new URL(page.url()).pathname;
    await page.getByTestId("flutter-speed").waitFor();
    const studyId = studyPath.split("/").pop()!;
    startRevision = await page.evaluate(async (id) => {
      const study = await (await fetch(`/api/studies/${id}`)).json();
      return (await fetch(`/api/revisions/${study.latestRevision.id}`)).json();
    }, studyId);
    const stored = startRevision.result.flutter;
    expect(await page.getByTestId("flutter-speed").textContent()).toContain(stored ? stored.speed.toFixed(2) : "None up to");
    const torsion = startRevision.study.structure.modes.find((m) => m.dof === "torsion")!;
    const heave = startRevision.study.structure.modes.find((m) => m.dof === "heave")!;
    expect(await page.getByTestId("frequency-ratio").textContent()).toBe((torsion.frequency / heave.frequency).toFixed(3));
    await page.getByRole("figure", { name: /Pole paths/ }).locator(".main-svg").first().waitFor();
    await browser.screenshot("workspace");
  });

  it("a changed torsional frequency, run on the server, gives the engine's flutter speed for that document", async () => {
    const { page } = browser;
    const torsion = startRevision.study.structure.modes.find((m) => m.dof === "torsion")!;
    const newFrequency = Number((torsion.frequency * 1.12).toFixed(4));
    const changed: StudyDocument = structuredClone(startRevision.study);
    changed.structure.modes.find((m) => m.dof === "torsion")!.frequency = newFrequency;
    const parsed = parseStudy(changed);
    if (!parsed.ok) throw new Error(`test document invalid: ${JSON.stringify(parsed.issues)}`);
    const full = runSweep(parsed.study);
    const expected = full.flutter;
    expect(expected, "the changed demo deck must still flutter within its sweep").not.toBeNull();
    expect(expected!.speed.toFixed(2)).not.toBe(startRevision.result.flutter?.speed.toFixed(2));

    await page.getByLabel("Torsional frequency").fill(String(newFrequency));
    await page.getByTestId("preview-flutter").filter({ hasText: expected!.speed.toFixed(2) }).waitFor();
    await page.getByRole("button", { name: "Run sweep" }).click();

    await page.getByTestId("result-source").filter({ hasText: "Server run" }).waitFor();
    expect(await page.getByTestId("flutter-speed").textContent()).toContain(`${expected!.speed.toFixed(2)} m/s`);
    await browser.screenshot("workspace-after-run");

    // The full step table of this unsaved run: the server runs it again and the browser saves the CSV.
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "CSV", exact: true }).click()]);
    const lines = readFileSync(await download.path(), "utf8").trimEnd().split("\r\n");
    expect(lines[0]).toMatch(/^branch,speed_m_s,frequency_hz,/);
    expect(lines).toHaveLength(1 + full.modes.reduce((n, m) => n + m.steps.length, 0));
  });

  it("saving with a change note stores a new revision that the timeline and the diff show", async () => {
    const { page } = browser;
    const note = "Torsional frequency raised 12 % after the stiffened-tower global model";

    await page.getByLabel("Change note").fill(note);
    await page.getByRole("button", { name: "Save revision" }).click();

    savedNumber = startRevision.latestNumber + 1;
    await page.waitForURL((url) => url.searchParams.get("revision") === String(savedNumber));
    await page.getByText(`Revision ${savedNumber} (latest)`).waitFor();
    await page.getByRole("link", { name: /^Revisions/ }).click();
    const timeline = page.getByRole("list", { name: "Revisions, newest first" });
    await timeline.waitFor();
    const newest = timeline.getByRole("listitem").first();
    expect(await newest.textContent()).toContain(note);
    expect(await newest.textContent()).toContain(`r${savedNumber}`);
    const diff = page.getByRole("table", { name: `Changes from revision ${startRevision.number} to revision ${savedNumber}` });
    await diff.waitFor();
    const torsionIndex = startRevision.study.structure.modes.findIndex((m) => m.dof === "torsion");
    expect(await diff.textContent()).toContain(`$.structure.modes[${torsionIndex}].frequency`);
    await page.getByRole("figure", { name: "Critical speeds by revision" }).locator(".main-svg").first().waitFor();
    await browser.screenshot("revisions");
  });

  it("comparing the two revisions overlays them and lists both flutter speeds side by side", async () => {
    const { page } = browser;

    await page.getByRole("link", { name: "Compare the picked two" }).click();

    const table = page.getByRole("table", { name: "Critical speeds and margins side by side" });
    await table.waitFor();
    const heads = await table.getByRole("columnheader").allTextContents();
    expect(heads.slice(1).map((h) => h.replace(/.* r(\d+)$/, "$1")).sort()).toEqual([String(startRevision.number), String(savedNumber)].sort());
    const flutterRow = await table.getByRole("row", { name: /Flutter speed/ }).textContent();
    expect(flutterRow?.match(/\d+\.\d\d m\/s/g)?.length).toBe(2);
    await page.getByRole("figure", { name: /Damping ratio against wind speed/ }).locator(".main-svg").first().waitFor();
    await browser.screenshot("compare");
  });

  it("a derivative CSV with a bad value shows the row error in place, blocks the run and guards against leaving", async () => {
    const { page } = browser;
    await page.goto(browser.url(studyPath));
    await page.getByRole("radio", { name: "Own table" }).check({ force: true });
    const csv = ["Ur,H1,H2,H3,H4,A1,A2,A3,A4", "2,-0.6,-0.1,-0.3,0.3,0.15,-0.03,0.06,0.02", "4,-1.9,-0.5,-1.4,0.6,0.49,abc,0.38,0.09", "6,-3.3,-0.8,-3.3,0.5,0.84,-0.33,0.88,0.18"].join("\n");

    await page.getByTestId("derivative-csv-input").setInputFiles({ name: "delivered.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });

    await page.getByText('Row 2: A2* "abc" is not a number').waitFor();
    expect(await page.getByLabel("Row 2, A2*").getAttribute("aria-invalid")).toBe("true");
    expect(await page.getByRole("button", { name: "Run sweep" }).isDisabled()).toBe(true);
    await browser.screenshot("workspace-csv-error");
    await page.getByRole("link", { name: "← Project" }).click();
    const guard = page.getByRole("alertdialog", { name: "Leave without saving?" });
    await guard.getByRole("button", { name: "Stay and keep editing" }).click();
    expect(new URL(page.url()).pathname).toBe(studyPath);
    await page.setViewportSize({ width: 820, height: 1180 });
    // Plots follow the resize a moment later; the page must settle without sideways scrolling.
    await expect
      .poll(() => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth), { timeout: 5000 })
      .toBeLessThanOrEqual(0);
    await browser.screenshot("workspace-tablet");
    await page.setViewportSize({ width: 1280, height: 800 });
    // The broken table is an unsaved change: leaving the page asks first (the browser's own question here).
    page.once("dialog", (dialog) => void dialog.accept());
  });

  it("a save that meets a newer revision is refused with a way to re-base, and the re-applied edit saves", async () => {
    const { page } = browser;
    const studyId = studyPath.split("/").pop()!;
    await page.goto(browser.url(studyPath));
    await page.getByText(`Revision ${savedNumber} (latest)`).waitFor();
    await page.getByLabel("Torsional damping ratio").fill("0.006");
    const latest: RevisionDto = await page.evaluate(async (id) => {
      const study = await (await fetch(`/api/studies/${id}`)).json();
      return (await fetch(`/api/revisions/${study.latestRevision.id}`)).json();
    }, studyId);
    const theirs = structuredClone(latest.study);
    theirs.air.density = 1.25;
    const background = await post(`/api/studies/${studyId}/revisions`, { parentRevision: savedNumber, changeNote: "Winter air density", study: theirs });
    expect(background.status).toBe(201);

    await page.getByLabel("Change note").fill("Torsional damping from the decay records");
    await page.getByRole("button", { name: "Save revision" }).click();

    await page.getByText(`Revision ${savedNumber + 1} was saved meanwhile`).waitFor();
    await page.getByRole("button", { name: `Load revision ${savedNumber + 1} and re-apply my edits` }).click();
    await page.getByText(`Your 1 edit re-applied on revision ${savedNumber + 1}.`).waitFor();
    expect(await page.getByLabel("Air density ρ").inputValue()).toBe("1.25");
    expect(await page.getByLabel("Torsional damping ratio").inputValue()).toBe("0.006");
    await page.getByLabel("Change note").fill("Torsional damping from the decay records");
    await page.getByRole("button", { name: "Save revision" }).click();
    await page.waitForURL((url) => url.searchParams.get("revision") === String(savedNumber + 2));
    await page.getByText(`Revision ${savedNumber + 2} (latest)`).waitFor();
  });

  it("the analyst starts a new study from the latest revision of another and lands in its workspace", async () => {
    const { page } = browser;
    await page.getByRole("link", { name: "← Project" }).click();
    await page.getByRole("heading", { name: "Deck alternatives" }).waitFor();

    await page.getByRole("button", { name: "New study…" }).first().click();
    const form = page.getByRole("form", { name: /^New study of / });
    await form.getByLabel("Study name").fill("Erection stage, deck 60 % closed");
    await form.getByRole("button", { name: "Create and open" }).click();

    await page.getByRole("heading", { level: 1, name: "Erection stage, deck 60 % closed" }).waitFor();
    await page.getByText("Revision 1 (latest)").waitFor();
    await page.getByTestId("flutter-speed").waitFor();
  });

  it("a reviewer sees the study read-only, can download it as a file, and the API refuses a revision from them", async () => {
    const { page } = browser;
    await signOut();
    await page.goto(browser.url(studyPath));
    await signIn("reviewer@stillspan.test", studyPath);

    await page.getByTestId("flutter-speed").waitFor();
    await page.getByText("Read-only:").waitFor();
    const form = page.getByRole("form", { name: "Study inputs" });
    // Only the km/h display toggle remains; the model choice is shown but disabled.
    expect(await form.locator("input:not([type=radio]):not([type=checkbox]), textarea, select").count()).toBe(0);
    expect(await form.getByRole("radio", { disabled: false }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /Run sweep|Save revision|Upload CSV/ }).count()).toBe(0);
    const href = (await page.getByRole("link", { name: /^Download study file/ }).getAttribute("href")) ?? "";
    const exported = await page.evaluate(async (url) => (await fetch(url)).text(), href);
    expect(parseStudy(JSON.parse(exported)).ok).toBe(true);
    const refused = await post(`/api/studies/${studyPath.split("/").pop()}/revisions`, { parentRevision: savedNumber + 2, changeNote: "x", study: startRevision.study });
    expect(refused.status).toBe(403);
    await browser.screenshot("workspace-reviewer");
  });

  it("a viewer never reaches the workspace and gets 403 when forcing an edit through the API", async () => {
    const { page } = browser;
    await signOut();
    await signIn("viewer@stillspan.test", "/signed-summaries");

    await page.goto(browser.url(studyPath));

    await page.waitForURL((url) => url.pathname === "/signed-summaries");
    expect(await page.getByRole("button", { name: /Run sweep|Save revision/ }).count()).toBe(0);
    expect(await page.getByRole("form", { name: "Study inputs" }).count()).toBe(0);
    const studyId = studyPath.split("/").pop()!;
    const save = await post(`/api/studies/${studyId}/revisions`, { parentRevision: savedNumber + 2, changeNote: "forced", study: startRevision.study });
    expect(save.status).toBe(403);
    const sweep = await post("/api/sweep", startRevision.study);
    expect(sweep.status).toBe(403);
  });

  it("the visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
