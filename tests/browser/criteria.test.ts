/**
 * The design wind and acceptance criteria in the browser: the project page shows v_m at deck level and the
 * required speeds with who stands behind each basis; a reviewer (the criteria's owner) edits the basic wind speed
 * and sees v_m follow, saves, meets a stale-version conflict with a way to reload, and confirms default bases one by
 * one; the analyst reads without an editor.
 *
 * Expected numbers come from shared/criteria (the module the server uses) applied to what GET returns, and the
 * headline one also from EN 1991-1-4:2005 Expr. (4.3)–(4.5) written out by hand.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { evaluateCriteria } from "../../shared/criteria/evaluate-criteria.js";
import { screenStudy } from "../../shared/criteria/screen-study.js";
import { STABILITY_CHECKS, type StoredAssessmentDto } from "../../shared/schemas/assessment.js";
import inventedStudy from "../../shared/schemas/__tests__/fixtures/invented-deck-study.json";
import { DEFAULT_REQUIREMENTS } from "../../shared/criteria/default-requirements.js";
import { PHENOMENA, type ProjectCriteria, type ProjectCriteriaDto } from "../../shared/schemas/criteria.js";
import { createProjectWithMembers, openTestDb } from "../support/db.js";
import { DEMO_PASSWORD } from "../support/http.js";
import path from "node:path";
import { artifactsDir, launchBrowser, type BrowserSession } from "../support/browser.js";

const DEMO_PROJECT = "Harrowmere Estuary Crossing (invented demo)";
const db = openTestDb();
let analyst: BrowserSession;
let owner: BrowserSession;
let ownProjectId: string;
const problems: string[] = [];

function watchProblems(session: BrowserSession, who: string) {
  session.page.on("pageerror", (error) => problems.push(`${who} uncaught: ${error.message}`));
  session.page.on("console", (message) => {
    const expectedRefusal = /Failed to load resource: the server responded with a status of 40[149]/;
    if ((message.type() === "error" || message.type() === "warning") && !expectedRefusal.test(message.text())) {
      problems.push(`${who} ${message.type()}: ${message.text()}`);
    }
  });
}

async function signIn(session: BrowserSession, email: string) {
  const { page } = session;
  // Open a page of the app first (as a visitor would): the guard sends the browser to the sign-in page.
  await page.goto(session.url("/projects"));
  await page.waitForURL((url) => url.pathname === "/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => url.pathname !== "/sign-in");
}

/** A JSON request from inside the page, with the page's session (as another tab of the same user would). */
async function pageApi<T>(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const res = await fetch(path, {
        method,
        headers: body === undefined ? {} : { "Content-Type": "application/json" },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: await res.json() };
    },
    { method, path, body },
  );
}

const mps = (value: number) => `${value.toFixed(2)} m/s`;
const panel = (page: Page) => page.getByRole("region", { name: "Design wind and acceptance criteria" });

const ownCriteria = (basicSpeed: number): ProjectCriteria => ({
  wind: {
    basicSpeed,
    probability: { kind: "return-period", years: 100 },
    terrain: { kind: "category", category: "II" },
    deckHeight: 60,
    orographyFactor: 1,
  },
  requirements: structuredClone(DEFAULT_REQUIREMENTS),
});

beforeAll(async () => {
  const suffix = Date.now().toString(36);
  ownProjectId = String(
    await createProjectWithMembers(db, `Criteria browser crossing ${suffix}`, {
      "analyst@stillspan.test": "analyst",
      "reviewer@stillspan.test": "reviewer",
    }),
  );
  analyst = await launchBrowser();
  watchProblems(analyst, "analyst");
  await signIn(analyst, "analyst@stillspan.test");
  owner = await launchBrowser();
  watchProblems(owner, "reviewer");
  await signIn(owner, "reviewer@stillspan.test");
});

afterAll(async () => {
  await analyst?.close();
  await owner?.close();
  await db.$client.end();
});

describe("design wind and criteria on the project page", () => {
  it("the demo crossing's page shows v_m at deck level, its factors and every required speed of the seeded criteria", async () => {
    const { page } = analyst;
    await page.goto(analyst.url("/projects"));
    await page.getByRole("link", { name: DEMO_PROJECT }).click();
    await page.waitForURL((url) => /^\/projects\/\d+$/.test(url.pathname));
    const demoId = new URL(page.url()).pathname.split("/").pop() as string;
    const designSpeed = panel(page).getByTestId("design-speed");
    await designSpeed.waitFor();

    const { body: dto } = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${demoId}/criteria`);
    expect(dto.criteria).not.toBeNull();
    const expected = evaluateCriteria(dto.criteria as ProjectCriteria);
    const { wind } = dto.criteria as ProjectCriteria;
    expect(wind.terrain).toEqual({ kind: "category", category: "0" });
    // EN 1991-1-4:2005 Expr. (4.5), (4.4), (4.3) by hand for category 0 (z0 = 0.003 m, Table 4.1), c_prob = 1 at 50 years.
    const byHand = 0.19 * Math.pow(0.003 / 0.05, 0.07) * Math.log(wind.deckHeight / 0.003) * wind.basicSpeed;
    expect(expected.designWind.meanSpeedMps).toBeCloseTo(byHand, 9);

    expect(await designSpeed.textContent()).toBe(mps(expected.designWind.meanSpeedMps));
    expect(await panel(page).getByTestId("factor-k_r").textContent()).toBe(expected.designWind.terrainFactor.toFixed(4));
    expect(await panel(page).getByTestId("factor-c_r").textContent()).toBe(expected.designWind.roughnessFactor.toFixed(4));
    for (const phenomenon of PHENOMENA) {
      const shown = await panel(page).getByTestId(`required-${phenomenon}`).textContent();
      expect(shown, phenomenon).toBe(mps(expected.required[phenomenon].requiredSpeedMps));
    }
    // The demo cites its own (invented) design basis, each written by the demo reviewer: nothing is left to confirm.
    for (const phenomenon of PHENOMENA) {
      const state = panel(page).getByTestId(`basis-state-${phenomenon}`);
      expect(await state.textContent(), phenomenon).toMatch(/^Written by Mira Holloway, .+ \(version \d+\)$/);
    }
    expect(await panel(page).getByRole("note", { name: "Criteria not confirmed" }).count()).toBe(0);
    expect(await panel(page).getByText(/§4\.3\.2, Expr\. \(4\.5\)/).count()).toBeGreaterThan(0);
    await analyst.screenshot("criteria-project-page");

    // At tablet width the wide tables scroll inside the panel; the page itself does not scroll sideways.
    await page.setViewportSize({ width: 820, height: 1180 });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await analyst.screenshot("criteria-project-page-tablet");
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it("the reviewer edits the basic wind speed, sees v_m follow before saving, and saves a new version", async () => {
    const { page } = owner;
    const saved = await pageApi<ProjectCriteriaDto>(page, "PUT", `/api/projects/${ownProjectId}/criteria`, {
      criteria: ownCriteria(26),
      baseVersion: null,
    });
    expect(saved.status).toBe(200);
    await page.goto(owner.url(`/projects/${ownProjectId}`));
    await panel(page).getByTestId("design-speed").waitFor();
    expect(await panel(page).getByTestId("design-speed").textContent()).toBe(
      mps(evaluateCriteria(ownCriteria(26)).designWind.meanSpeedMps),
    );

    await panel(page).getByRole("button", { name: "Edit criteria" }).click();
    const basicSpeed = page.getByLabel("Basic wind speed v_b");
    await basicSpeed.waitFor();
    expect(await basicSpeed.evaluate((element) => element === document.activeElement)).toBe(true);
    await basicSpeed.fill("30.5");

    const preview = page.getByRole("region", { name: "Preview of the design wind" });
    const expected = evaluateCriteria(ownCriteria(30.5));
    await expect.poll(() => preview.getByTestId("design-speed").textContent()).toBe(mps(expected.designWind.meanSpeedMps));
    expect(await preview.getByTestId("required-flutter").textContent()).toBe(mps(expected.required.flutter.requiredSpeedMps));
    // The default texts are named as such in the editor, with the saved version's state beside each.
    expect(await page.getByText(/^Stillspan's default text, recalled from memory/).count()).toBe(4);
    expect(await page.getByText("Default text — not confirmed").count()).toBe(4);
    await owner.screenshot("criteria-editor");

    await page.getByRole("button", { name: "Save as version 2" }).click();
    await panel(page).getByRole("status").filter({ hasText: "Saved as version 2." }).waitFor();
    expect(await panel(page).getByTestId("design-speed").textContent()).toBe(mps(expected.designWind.meanSpeedMps));
    const after = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${ownProjectId}/criteria`);
    expect(after.body.version).toBe(2);
    expect(after.body.criteria?.wind.basicSpeed).toBe(30.5);
    // Focus returns to the button that opened the editor.
    await expect
      .poll(() => panel(page).getByRole("button", { name: "Edit criteria" }).evaluate((b) => b === document.activeElement))
      .toBe(true);
  });

  it("a bad input is named at its field and pauses the preview; nothing is saved", async () => {
    const { page } = owner;
    await panel(page).getByRole("button", { name: "Edit criteria" }).click();
    const deckHeight = page.getByLabel("Deck height z");
    await deckHeight.fill("250");
    await deckHeight.blur();
    await page.getByText("must be at most 200 (z_max of EN 1991-1-4 §4.3.2)", { exact: true }).waitFor();
    expect(await deckHeight.getAttribute("aria-invalid")).toBe("true");
    await page.getByText(/Preview paused: wind\.deckHeight must be at most 200/).waitFor();
    await page.getByRole("button", { name: "Cancel" }).click();
    const after = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${ownProjectId}/criteria`);
    expect(after.body.version).toBe(2);
  });

  it("a save on a stale version is refused with a way to load the newer version", async () => {
    const { page } = owner;
    await panel(page).getByRole("button", { name: "Edit criteria" }).click();
    await page.getByLabel("Deck height z").fill("65");
    // Someone else saves version 3 meanwhile.
    const other = await pageApi<ProjectCriteriaDto>(page, "PUT", `/api/projects/${ownProjectId}/criteria`, {
      criteria: ownCriteria(27),
      baseVersion: 2,
    });
    expect(other.status).toBe(200);

    await page.getByRole("button", { name: "Save as version 3" }).click();
    const alert = panel(page).getByRole("alert");
    await alert.waitFor();
    expect(await alert.textContent()).toContain("Someone saved the criteria meanwhile");
    await owner.screenshot("criteria-conflict");
    await alert.getByRole("button", { name: /Load the latest version/ }).click();

    await page.getByRole("button", { name: "Save as version 4" }).waitFor();
    expect(await page.getByLabel("Basic wind speed v_b").inputValue()).toBe("27");
    await page.getByRole("button", { name: "Cancel" }).click();
    const after = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${ownProjectId}/criteria`);
    expect(after.body.version).toBe(3);
    expect(after.body.criteria?.wind.deckHeight).toBe(60);
  });

  it("marks each default basis, refuses nothing silently, and lets the reviewer confirm them one by one", async () => {
    const { page } = owner;
    await page.goto(owner.url(`/projects/${ownProjectId}`));
    const note = panel(page).getByRole("note", { name: "Criteria not confirmed" });
    await note.waitFor();
    expect(await note.textContent()).toContain(
      "In version 3 of the project's criteria, flutter, torsional divergence, vortex-shedding onset, galloping onset still have the default basis text.",
    );
    for (const phenomenon of PHENOMENA) {
      expect(await panel(page).getByTestId(`basis-state-${phenomenon}`).textContent(), phenomenon).toContain("Default text — not confirmed");
    }
    await owner.screenshot("criteria-default-bases");
    let version = 3;
    for (const phenomenon of PHENOMENA) {
      const state = panel(page).getByTestId(`basis-state-${phenomenon}`);
      await state.getByRole("button", { name: /^Confirm the .+ basis$/ }).click();
      version += 1;
      await expect.poll(() => state.textContent()).toMatch(new RegExp(`^Default text Confirmed by Mira Holloway, .+ \\(version ${version}\\)$`));
    }
    expect(await note.count()).toBe(0);
    const after = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${ownProjectId}/criteria`);
    expect(after.body.version).toBe(7);
    expect(after.body.criteria?.wind.basicSpeed).toBe(27); // confirming changes no value
    await owner.screenshot("criteria-bases-confirmed");
  });

  it("the analyst reads the criteria, who stands behind each basis and their history, but gets no editor", async () => {
    const { page } = analyst;
    await page.goto(analyst.url(`/projects/${ownProjectId}`));
    const analystPanel = panel(page);
    await analystPanel.getByTestId("design-speed").waitFor();
    expect(await analystPanel.getByTestId("design-speed").textContent()).toBe(mps(evaluateCriteria(ownCriteria(27)).designWind.meanSpeedMps));
    expect(await analystPanel.getByRole("button", { name: "Edit criteria" }).count()).toBe(0);
    expect(await analystPanel.getByRole("button", { name: /^Confirm the / }).count()).toBe(0);
    await analystPanel.getByText("Read-only: the project's reviewers and administrators own the criteria.").waitFor();
    expect(await analystPanel.getByTestId("basis-state-flutter").textContent()).toMatch(/Confirmed by Mira Holloway/);

    await analystPanel.getByRole("button", { name: "History" }).click();
    const rows = analystPanel.getByRole("table", { name: /Saved versions/ }).getByRole("row");
    await expect.poll(() => rows.count()).toBe(8); // header + versions 7 … 1
    expect(await rows.nth(1).getByRole("rowheader").textContent()).toBe("7");
    expect(await rows.nth(1).textContent()).toContain("all confirmed");
    expect(await rows.nth(4).textContent()).toContain("not confirmed: torsional divergence (default text), vortex-shedding onset (default text)");
    expect(await rows.nth(5).textContent()).toContain("not confirmed: flutter (default text), torsional divergence (default text)");
    await analyst.screenshot("criteria-analyst-history");
  });

  it("the study workspace shows the assessment's margins and the screening table of the shown result", async () => {
    const { page } = analyst;
    const alternative = await pageApi<{ id: string }>(page, "POST", `/api/projects/${ownProjectId}/alternatives`, {
      name: "Twin box (screening test)",
      deckWidthM: inventedStudy.deck.width,
      deckDepthM: inventedStudy.deck.depth,
    });
    expect(alternative.status).toBe(201);
    const study = await pageApi<{ id: string; latestRevision: { id: string } }>(
      page,
      "POST",
      `/api/alternatives/${alternative.body.id}/studies`,
      { name: "Screening baseline", study: inventedStudy },
    );
    expect(study.status).toBe(201);
    const revision = await pageApi<{ assessment: StoredAssessmentDto }>(page, "GET", `/api/revisions/${study.body.latestRevision.id}`);
    let { body: dto } = await pageApi<ProjectCriteriaDto>(page, "GET", `/api/projects/${ownProjectId}/criteria`);
    if (dto.criteria === null) {
      // Run on its own (-t), the earlier tests have not saved criteria for this project yet (the reviewer owns them).
      dto = (await pageApi<ProjectCriteriaDto>(owner.page, "PUT", `/api/projects/${ownProjectId}/criteria`, { criteria: ownCriteria(27) })).body;
    }
    const criteria = dto.criteria as ProjectCriteria;
    const screening = screenStudy(inventedStudy as Parameters<typeof screenStudy>[0], criteria);
    const assessment = revision.body.assessment.assessment;

    await page.goto(analyst.url(`/projects/${ownProjectId}/studies/${study.body.id}`));
    const screeningRegion = page.getByRole("region", { name: "Screening" });
    await screeningRegion.getByTestId("vortex-table").waitFor();
    for (const mode of screening.vortexShedding.modes) {
      expect(await screeningRegion.getByTestId(`onset-${mode.modeId}`).textContent()).toBe(mps(mode.onsetSpeedMps as number));
      expect(await screeningRegion.getByTestId(`scruton-${mode.modeId}`).textContent()).toBe(mode.scruton.value.toFixed(2));
    }
    // Heave Scruton number by hand, EN 1991-1-4 E.1.3.3 Expr. (E.4): Sc = 2 δ_s m / (ρ D²), δ_s = 2πζ.
    const heave = inventedStudy.structure.modes[0];
    const scByHand = (2 * (2 * Math.PI * heave.damping) * inventedStudy.structure.mass) / (inventedStudy.air.density * inventedStudy.deck.depth ** 2);
    expect(await screeningRegion.getByTestId(`scruton-${heave.id}`).textContent()).toBe(scByHand.toFixed(2));
    // B/D = 27.5/3.6 = 7.6 lies outside the rectangles of EN 1991-1-4 Table E.7 and the study has no static
    // coefficients: galloping is not evaluated (no a_G is assumed for a deck), and the reason says what would do.
    expect(screening.galloping.standard).toBeNull();
    expect(await screeningRegion.getByTestId("galloping-standard").textContent()).toBe("not evaluated — no a_G for this section");
    expect(await screeningRegion.getByTestId("galloping-not-evaluated").textContent()).toContain("give a_G with its source");
    // Divergence is the result's: both figures as its assessment names them, not a screening value of its own.
    const closed = assessment.divergence.closedForm.speedMps;
    expect(await screeningRegion.getByTestId("divergence-closed-form").textContent()).toBe(closed !== null ? mps(closed) : "none");
    expect(await screeningRegion.getByTestId("divergence-basis").textContent()).toBe(assessment.divergence.marginBasis);
    expect(await screeningRegion.getByText(/Results are indicative/).count()).toBeGreaterThan(0);

    const marginsRegion = page.getByRole("region", { name: "Margins" });
    // The lowest onset, D n / St ≈ 4 m/s, lies far below 1.25 v_m: lock-in is possible and must be investigated
    // (EN 1991-1-4 E.1.2(2), E.1.5) — a screening result in its own words, not a stability margin, not a failed deck.
    expect(assessment.vortexShedding.status).toBe("investigate");
    expect(await marginsRegion.getByTestId("vortex-screening").textContent()).toContain(assessment.vortexShedding.statement);
    expect(await marginsRegion.locator('[data-testid="margin-vortexOnset"]').count()).toBe(0);
    expect(assessment.margins!.gallopingOnset.status).toBe("not-evaluated");
    const statusLabel = { pass: "pass", fail: "fail", undetermined: "undetermined — extend the sweep", "not-evaluated": "not evaluated" };
    for (const check of STABILITY_CHECKS) {
      const margin = assessment.margins![check];
      const row = marginsRegion.getByRole("row").filter({ has: page.locator(`[data-testid="margin-${check}"]`) });
      const expectedRatio = margin.margin === null ? "—" : `${margin.marginIsLowerBound ? "≥ " : ""}${margin.margin.toFixed(2)}`;
      expect(await marginsRegion.getByTestId(`margin-${check}`).textContent(), check).toBe(expectedRatio);
      expect(await row.textContent(), check).toContain(margin.statement);
      expect(await marginsRegion.getByTestId(`status-${check}`).textContent(), check).toBe(statusLabel[margin.status]);
    }
    // A measured Strouhal number replaces the table's: it must name its source, then every onset follows D n / St.
    await screeningRegion.getByText("Measured values for the screening").click();
    const optionsForm = screeningRegion.getByRole("form", { name: "Measured values for the screening" });
    await optionsForm.getByLabel("Strouhal number St").fill("0.11");
    await optionsForm.getByRole("button", { name: "Screen with these values" }).click();
    await optionsForm.getByText("say where the Strouhal number comes from (test report, reference)").waitFor();
    await optionsForm.getByLabel("Source of St").fill("Section-model test, smooth flow (invented for this test)");
    await optionsForm.getByRole("button", { name: "Screen with these values" }).click();
    await expect.poll(() => screeningRegion.getByTestId("strouhal").textContent()).toBe("0.11");
    for (const mode of inventedStudy.structure.modes) {
      // EN 1991-1-4 E.1.3.1, Expr. (E.2) by hand: v_crit = b n / St with b = D.
      const byHand = (inventedStudy.deck.depth * mode.frequency) / 0.11;
      await expect.poll(() => screeningRegion.getByTestId(`onset-${mode.id}`).textContent()).toBe(mps(byHand));
    }
    expect(await screeningRegion.getByText(/Section-model test, smooth flow \(invented for this test\)/).count()).toBeGreaterThan(0);
    await marginsRegion.screenshot({ path: path.join(artifactsDir, "criteria-workspace-margins.png") });
    // An a_G given with its source evaluates galloping by EN 1991-1-4 E.2.2, Expr. (E.18): v_CG = 2 Sc n D / a_G.
    await optionsForm.getByLabel("Galloping factor a_G").fill("2");
    await optionsForm.getByLabel("Source of a_G").fill("Static coefficient tests (invented for this test)");
    await optionsForm.getByRole("button", { name: "Screen with these values" }).click();
    const gallopingByHand = (2 * scByHand * heave.frequency * inventedStudy.deck.depth) / 2;
    await expect.poll(() => screeningRegion.getByTestId("galloping-standard").textContent()).toBe(mps(gallopingByHand));
    // A trial: the margins stay the stored assessment's (from the study's own data), and the screening says so.
    expect(await marginsRegion.getByTestId("status-gallopingOnset").textContent()).toBe("not evaluated");
    expect(await page.getByRole("region", { name: "Screening" }).textContent()).toContain("a trial");
    await analyst.screenshot("criteria-workspace-screening");
    await screeningRegion.screenshot({ path: path.join(artifactsDir, "criteria-workspace-screening-table.png") });

    // On a phone the wide tables scroll sideways inside their panels; the page itself does not.
    await page.setViewportSize({ width: 390, height: 844 });
    for (const id of ["margins-table", "vortex-table"]) {
      const table = page.getByTestId(id);
      await table.scrollIntoViewIfNeeded();
      const fit = await table.evaluate((el) => {
        const box = el.parentElement!.getBoundingClientRect();
        return { right: box.right, viewport: window.innerWidth, scrolls: el.parentElement!.scrollWidth > el.parentElement!.clientWidth };
      });
      expect(fit.right, id).toBeLessThanOrEqual(fit.viewport);
      expect(fit.scrolls, id).toBe(true);
    }
    // Elements that reach past the screen's edge without a scrolling container to hold them (named, to fix).
    const sticking = await page.evaluate(() => {
      const clipped = (el: Element) => {
        for (let a = el.parentElement; a && a !== document.body; a = a.parentElement) {
          const o = getComputedStyle(a).overflowX;
          if (o === "auto" || o === "scroll" || o === "hidden" || o === "clip") return true;
        }
        return false;
      };
      return [...document.body.querySelectorAll("*")]
        .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 0.5 && !clipped(el))
        .map((el) => `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 60)} "${(el.textContent ?? "").slice(0, 40)}"`)
        .slice(0, 8);
    });
    expect(sticking).toEqual([]);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await analyst.screenshot("criteria-workspace-phone");
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it("the visits logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
