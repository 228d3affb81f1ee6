import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SUMMARY_CAUTIONS } from "../../shared/schemas/summary.js";
import { pdfText } from "../../server/pdf/__tests__/pdf-text.js";
import { artifactsDir, baseUrl, collectPageProblems, fillSignInForm, launchBrowser, signOutInPage, type BrowserSession } from "../support/browser";
import { api, signIn as apiSignIn } from "../support/http.js";
import { waitForMail } from "../support/review.js";

const DEMO_STUDY = "Flutter and divergence — alternative B";

describe("review and signed summary in the browser", () => {
  let browser: BrowserSession;
  let problems: string[] = [];
  let signedRevision = 0;
  let summaryPath = "";
  let queueFigures = { flutter: "", warnings: "" };

  beforeAll(async () => {
    browser = await launchBrowser();
    problems = collectPageProblems(browser.page);
  });
  afterAll(async () => {
    await browser?.close();
  });

  /** Opens `landing`, is sent to the sign-in page, signs in and comes back. */
  async function signIn(email: string, landing: string) {
    const { page } = browser;
    await page.goto(browser.url(landing));
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await fillSignInForm(page, email, landing);
  }

  const signOut = () => signOutInPage(browser.page);

  it("the reviewer finds the demo study's latest revision in the review queue, reads its summary preview and signs it there", async () => {
    const { page } = browser;
    await signIn("reviewer@stillspan.test", "/reviews");
    expect(await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents()).toContain("Review queue");

    const card = page.getByRole("region", { name: new RegExp(`^Review of ${DEMO_STUDY}, revision \\d+$`) });
    await card.waitFor();
    signedRevision = Number((await card.getAttribute("aria-label"))!.match(/revision (\d+)$/)![1]);
    expect(await card.textContent()).not.toContain("already exists"); // it is the study's latest revision
    // Flutter and divergence each with its margin against the project's required speed, and the warning count —
    // the revision's assessment, as the study and the signed summary state it.
    const facts = (await card.locator("dl").first().textContent()) ?? "";
    expect(facts.match(/margin ≥? ?\d+\.\d{2} against \d+\.\d{2} m\/s · (pass|fail)/g)).toHaveLength(2);
    expect(facts).toMatch(/Warnings(none|\d+ warnings?)/);
    queueFigures = {
      flutter: (await card.getByTestId("queue-flutter").textContent()) ?? "",
      warnings: (await card.getByTestId("queue-warnings").textContent()) ?? "",
    };
    await browser.screenshot("review-queue");

    // No signing from a queue row: the row leads to the summary exactly as it will be signed.
    expect(await card.getByRole("button", { name: "Sign the summary" }).count()).toBe(0);
    await card.getByRole("link", { name: "Read the summary to sign or return" }).click();
    await page.waitForURL((url) => /^\/reviews\/\d+\/summary$/.test(url.pathname));
    await page.getByRole("heading", { level: 1, name: `Summary to sign — ${DEMO_STUDY}, revision ${signedRevision}` }).waitFor();
    await page.getByRole("note", { name: "Not signed yet" }).waitFor();
    // The demo's criteria cite its own confirmed design basis: nothing stands in the way.
    expect(await page.getByRole("alert").filter({ hasText: "Criteria not confirmed" }).count()).toBe(0);
    const criteriaCard = page.locator("section").filter({ has: page.getByRole("heading", { name: "Criteria and their basis" }) });
    expect(await criteriaCard.textContent()).toContain("Harrowmere Crossing design basis, invented for the demo");
    const decision = page.getByRole("region", { name: "Your decision" });
    await decision.getByLabel("Reviewer's statement").fill("Checked the derivatives, the sweep and the margins: stable with margin at this design stage.");
    await browser.screenshot("review-summary-preview");
    await decision.getByRole("button", { name: "Sign the summary" }).click();
    const done = page.getByRole("status").filter({ hasText: `${DEMO_STUDY}: revision ${signedRevision} is signed with your statement.` });
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
    // The same flutter speed and warning count as the queue card showed the reviewer.
    expect(await page.getByTestId("summary-flutter").textContent()).toBe(queueFigures.flutter);
    expect(await page.getByTestId("summary-verdict").textContent()).toContain(queueFigures.warnings);
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

    // The PDF points to the public page that checks it by its code: it finds the summary and verifies it.
    const code = /Verification code\s*([0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4})/.exec(flat)?.[1];
    expect(code, "verification code in the PDF").toBeDefined();
    expect(flat).toContain(`/verify/${code}`);
    await page.goto(browser.url(`/verify/${code}`));
    await page.getByTestId("server-check").waitFor();
    expect(await page.getByTestId("server-check").textContent()).toMatch(/^On record here, and the server's check of its signature succeeds/);
    await page.getByText("✓ Verified").waitFor();
    expect(await page.getByTestId("code-check").textContent()).toContain(`${flutterSpeed} m/s`);
    await browser.screenshot("summary-checked-by-code");
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

  it("the analyst sees the signed revision's review in the study workspace and submits revision 1 from there", async () => {
    const { page } = browser;
    await signOut(); // the viewer of the tests above
    await signIn("analyst@stillspan.test", "/projects");
    await page.getByRole("link", { name: "Harrowmere Estuary Crossing (invented demo)" }).click();
    await page.getByRole("link", { name: DEMO_STUDY }).first().click();
    await page.waitForURL((url) => /\/studies\/[^/]+$/.test(url.pathname));
    const signed = page.getByRole("region", { name: `Review of revision ${signedRevision}` });
    await signed.getByText("Signed by Mira Holloway").waitFor();
    // At 1280 px the review runs across both columns, below them both: no blank area beside it.
    await page.setViewportSize({ width: 1280, height: 800 });
    const [panelBox, formBox, resultBox] = await Promise.all([
      signed.boundingBox(),
      page.getByRole("form", { name: "Study inputs" }).boundingBox(),
      page.getByTestId("result-source").locator("xpath=ancestor::section[1]").boundingBox(),
    ]);
    expect(resultBox!.x).toBeGreaterThan(formBox!.x + formBox!.width - 1); // two columns at this width
    expect(panelBox!.x).toBeCloseTo(formBox!.x, 0);
    expect(panelBox!.x + panelBox!.width).toBeCloseTo(resultBox!.x + resultBox!.width, 0);
    expect(panelBox!.y).toBeGreaterThanOrEqual(formBox!.y + formBox!.height);

    await page.goto(`${page.url()}?revision=1`);
    const panel = page.getByRole("region", { name: "Review of revision 1" });
    await panel.getByText("Not submitted for review").waitFor();
    await panel.getByLabel("Reviewer").locator("option", { hasText: "Mira Holloway" }).waitFor({ state: "attached" });
    expect(await panel.getByLabel("Reviewer").locator("option:checked").textContent()).toBe("Mira Holloway");
    await panel.getByLabel("Note to the reviewer (optional)").fill("The first sweep, for the record.");
    await panel.getByRole("button", { name: "Submit for review" }).click();
    await panel.getByText(/^Reviewer: Mira Holloway · submitted by Tomas Reedwell/).waitFor();
    await browser.screenshot("workspace-review-submitted");
    await signOut();
  });

  it("the visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});

describe("one-time links in the browser: accepting an invitation, resetting a password", () => {
  let browser: BrowserSession;
  let problems: string[] = [];
  const suffix = Date.now().toString(36);
  const email = `invited-${suffix}@stillspan.test`;
  let admin: string;

  beforeAll(async () => {
    browser = await launchBrowser();
    problems = collectPageProblems(browser.page, [401, 404, 410]);
    admin = await apiSignIn(baseUrl(), "admin@stillspan.test");
  });
  afterAll(async () => {
    await browser?.close();
  });

  it("an invited owner's representative opens the e-mailed link, chooses a password and signs in", async () => {
    const { page } = browser;
    // A project of its own, so the demo crossing's members stay as seeded.
    const project = await api(baseUrl(), "/api/projects", { cookie: admin, body: { name: `Invitation crossing ${suffix} (invented)` } });
    expect(project.status, JSON.stringify(project.body)).toBe(201);
    const invited = await api(baseUrl(), `/api/projects/${project.body.id}/invitations`, {
      cookie: admin,
      body: { email, role: "viewer", name: "Ines Harlow" },
    });
    expect(invited.status).toBe(201);
    const [mail] = await waitForMail(baseUrl(), admin, email, "You are invited to");
    const link = new URL(/https?:\/\/\S+\/accept-invite\?token=\S+/.exec(mail.text)![0]);

    await page.goto(browser.url(`${link.pathname}${link.search}`));
    await page.getByRole("heading", { name: "Accept your invitation" }).waitFor();
    await page.getByLabel("Your name").fill("Ines Harlow");
    await page.getByLabel("Password", { exact: true }).fill("short");
    await page.getByLabel("Password again").fill("short");
    await page.getByRole("button", { name: "Accept the invitation" }).click();
    expect(await page.getByRole("alert").textContent()).toContain("at least 10 characters");
    await page.getByLabel("Password", { exact: true }).fill("owner-rep-passphrase");
    await page.getByLabel("Password again").fill("owner-rep-passphrase");
    await page.getByRole("button", { name: "Accept the invitation" }).click();
    await page.getByText("Your account is ready.").waitFor();
    await browser.screenshot("accept-invitation");

    // The same link again: refused, with the reason.
    await page.goto(browser.url(`${link.pathname}${link.search}`));
    await page.getByLabel("Your name").fill("Someone Else");
    await page.getByLabel("Password", { exact: true }).fill("another-passphrase");
    await page.getByLabel("Password again").fill("another-passphrase");
    await page.getByRole("button", { name: "Accept the invitation" }).click();
    expect(await page.getByRole("alert").textContent()).toContain("already been used");

    await page.goto(browser.url("/signed-summaries"));
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill("owner-rep-passphrase");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => url.pathname === "/signed-summaries");
    await page.getByText("No summary has been signed yet.").waitFor();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL((url) => url.pathname === "/sign-in");
  });

  it("a forgotten password is reset from the sign-in page through the e-mailed link", async () => {
    const { page } = browser;
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.getByRole("heading", { name: "Reset your password" }).waitFor();
    await page.getByLabel("E-mail address").fill(email);
    await page.getByRole("button", { name: "Send me a link" }).click();
    await page.getByText("If an account exists for this address").waitFor();
    await browser.screenshot("password-reset-requested");

    const [mail] = await waitForMail(baseUrl(), admin, email, "Choose a new Stillspan password");
    const link = new URL(/https?:\/\/\S+\/reset-password\?token=\S+/.exec(mail.text)![0]);
    await page.goto(browser.url(`${link.pathname}${link.search}`));
    await page.getByLabel("New password", { exact: true }).fill("renewed-passphrase");
    await page.getByLabel("New password again").fill("renewed-passphrase");
    await page.getByRole("button", { name: "Set the new password" }).click();
    await page.getByText("Your password is changed.").waitFor();
    await browser.screenshot("password-reset-done");

    const res = await api(baseUrl(), "/api/auth/sign-in", { body: { email, password: "renewed-passphrase" } });
    expect(res.status).toBe(200);
  });

  it("the visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
