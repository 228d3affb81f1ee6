import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SUMMARY_CAUTIONS } from "../../shared/schemas/summary.js";
import { pdfText } from "../../server/pdf/__tests__/pdf-text.js";
import { artifactsDir, launchBrowser, type BrowserSession } from "../support/browser";

const DEMO_PASSWORD = "stillspan-demo";
const DEMO_STUDY = "Flutter and divergence — alternative B";

describe("review and signed summary in the browser", () => {
  let browser: BrowserSession;
  const problems: string[] = [];
  let signedRevision = 0;
  let summaryPath = "";

  beforeAll(async () => {
    browser = await launchBrowser();
    browser.page.on("pageerror", (error) => problems.push(`uncaught: ${error.message}`));
    browser.page.on("console", (message) => {
      const expectedRefusal = /Failed to load resource: the server responded with a status of 40[14]/;
      if ((message.type() === "error" || message.type() === "warning") && !expectedRefusal.test(message.text())) {
        problems.push(`${message.type()}: ${message.text()}`);
      }
    });
  });
  afterAll(async () => {
    await browser?.close();
  });

  /** Opens `landing`, is sent to the sign-in page, signs in and comes back. */
  async function signIn(email: string, landing: string) {
    const { page } = browser;
    await page.goto(browser.url(landing));
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => url.pathname === landing);
  }

  async function signOut() {
    await browser.page.getByRole("button", { name: "Sign out" }).click();
    await browser.page.waitForURL((url) => url.pathname === "/sign-in");
  }

  it("the reviewer finds the demo study's latest revision in the review queue and signs it with a statement", async () => {
    const { page } = browser;
    await signIn("reviewer@stillspan.test", "/reviews");
    expect(await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents()).toContain("Review queue");

    const card = page.getByRole("region", { name: new RegExp(`^Review of ${DEMO_STUDY}, revision \\d+$`) });
    await card.waitFor();
    signedRevision = Number((await card.getAttribute("aria-label"))!.match(/revision (\d+)$/)![1]);
    expect(await card.textContent()).not.toContain("already exists"); // it is the study's latest revision
    await browser.screenshot("review-queue");

    await card.getByLabel("Reviewer's statement").fill("Checked the derivatives, the sweep and the margins: stable with margin at this design stage.");
    await card.getByRole("button", { name: "Sign the summary" }).click();
    const done = page.getByRole("status").filter({ hasText: `${DEMO_STUDY}: revision ${signedRevision} is signed.` });
    await done.waitFor();
    await browser.screenshot("review-signed");
    await done.getByRole("link", { name: "Open the signed summary" }).click();
    await page.getByText("✓ Verified").waitFor();
    summaryPath = new URL(page.url()).pathname;
    expect(summaryPath).toMatch(/^\/summaries\/\d+$/);
    await signOut();
  });

  it("the viewer signs in, opens the summary from the list and sees it verified in the browser", async () => {
    const { page } = browser;
    await signIn("viewer@stillspan.test", "/signed-summaries");
    const link = page.getByRole("link", { name: `${DEMO_STUDY}, revision ${signedRevision}` });
    await link.waitFor();
    const row = page.getByRole("row").filter({ has: link });
    expect(await row.textContent()).toContain("Current");
    await browser.screenshot("signed-summaries");

    await link.click();
    await page.waitForURL((url) => url.pathname === summaryPath);
    const status = page.getByTestId("verification-status");
    await status.waitFor();
    await page.getByText("✓ Verified").waitFor();
    const heading = await page.getByRole("heading", { level: 1 }).textContent();
    expect(heading).toBe(`Stability summary — ${DEMO_STUDY}, revision ${signedRevision}`);
    expect(await page.getByText("Signed by Mira Holloway").first().isVisible()).toBe(true);
    const cautions = page.getByRole("note", { name: "Cautions" });
    for (const caution of SUMMARY_CAUTIONS) expect(await cautions.getByText(caution).isVisible()).toBe(true);
    expect(await page.getByRole("figure").count()).toBe(3);
    // Let plotly draw before the screenshot.
    await page.locator(".js-plotly-plot").first().waitFor();
    await page.waitForTimeout(500);
    await browser.screenshot("summary-verified");
  });

  it("the viewer downloads the PDF: its text holds the flutter speed and the cautions", async () => {
    const { page } = browser;
    const flutterText = (await page.getByRole("region", { name: /Margins/ }).textContent()) ?? "";
    const flutterSpeed = /Flutter: ([\d.]+) m\/s/.exec(flutterText)?.[1];
    expect(flutterSpeed, `flutter speed in: ${flutterText}`).toBeDefined();

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download PDF" }).click()]);
    expect(download.suggestedFilename()).toMatch(/^stability-summary-.+\.pdf$/);
    const file = path.join(artifactsDir, "signed-summary.pdf");
    await download.saveAs(file);
    const { text } = await pdfText(readFileSync(file));
    const flat = text.replace(/\s+/g, " ");
    expect(flat).toContain(`${flutterSpeed} m/s`);
    expect(flat).toContain(SUMMARY_CAUTIONS[0]);
    expect(flat).toContain("wind-tunnel verification");
  });

  it("the summary of the earlier signed revision shows it is superseded, with a link to the current one", async () => {
    const { page } = browser;
    await page.goto(browser.url("/signed-summaries"));
    const older = page.getByRole("link", { name: `${DEMO_STUDY}, revision ${signedRevision - 1}` });
    await older.waitFor();
    await older.click();
    const banner = page.getByRole("alert").filter({ hasText: "Superseded" });
    await banner.waitFor();
    await page.getByText("✓ Verified").waitFor();
    await browser.screenshot("summary-superseded");
    await banner.getByRole("link", { name: `Open the current summary (revision ${signedRevision})` }).click();
    await page.waitForURL((url) => url.pathname === summaryPath);
  });

  it("the visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
