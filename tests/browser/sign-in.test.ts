import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { collectPageProblems, launchBrowser, type BrowserSession } from "../support/browser";

const DEMO_PROJECT = "Harrowmere Estuary Crossing (invented demo)";
const DEMO_PASSWORD = "stillspan-demo";

describe("signing in and out in the browser", () => {
  let browser: BrowserSession;
  /** Uncaught exceptions and console errors or warnings, except the browser's own note on a 401/404 resource. */
  let problems: string[] = [];

  beforeAll(async () => {
    browser = await launchBrowser();
    problems = collectPageProblems(browser.page);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("a visitor opening /sign-in directly sees the sign-in form", async () => {
    const { page } = browser;

    await page.goto(browser.url("/sign-in"));

    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    expect(await page.getByLabel("E-mail").isVisible()).toBe(true);
  });

  it("a visitor opening the site lands on the sign-in page", async () => {
    const { page } = browser;

    await page.goto(browser.url("/projects"));

    await page.waitForURL((url) => url.pathname === "/sign-in");
    expect(new URL(page.url()).searchParams.get("redirectTo")).toBe("/projects");
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    expect(await page.getByText(/Results are indicative/).isVisible()).toBe(true);
    await browser.screenshot("sign-in");
  });

  it("a wrong password is refused with a message and the visitor stays on the sign-in page", async () => {
    const { page } = browser;

    await page.getByLabel("E-mail").fill("analyst@stillspan.test");
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();

    const alert = page.getByRole("alert");
    await alert.waitFor();
    expect(await alert.textContent()).toContain("The e-mail address or the password is not correct.");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await browser.screenshot("sign-in-refused");
  });

  it("the analyst signs in and sees the projects list with the demo crossing", async () => {
    const { page } = browser;

    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();

    await page.waitForURL((url) => url.pathname === "/projects");
    const projectLink = page.getByRole("link", { name: DEMO_PROJECT });
    await projectLink.waitFor();
    const row = page.getByRole("row").filter({ has: projectLink });
    expect(await row.textContent()).toContain("Analyst");
    const nav = page.getByRole("navigation", { name: "Main" });
    expect(await nav.getByRole("link").allTextContents()).toEqual(["Projects", "Signed summaries"]);
    await browser.screenshot("projects");
  });

  it("the project page shows the crossing, its site notes and the analyst's role", async () => {
    const { page } = browser;

    await page.getByRole("link", { name: DEMO_PROJECT }).click();

    await page.getByRole("heading", { level: 1, name: DEMO_PROJECT }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/^\/projects\/[^/]+$/);
    await page.getByRole("heading", { name: "Site notes" }).waitFor();
    expect(await page.getByText("Your role").first().isVisible()).toBe(true);
    await browser.screenshot("project");
  });

  it("the projects list stays usable at tablet width", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 820, height: 1180 });

    await page.goto(browser.url("/projects"));

    await page.getByRole("link", { name: DEMO_PROJECT }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await browser.screenshot("projects-tablet");
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it("signing out returns to the sign-in page and the session is gone", async () => {
    const { page } = browser;

    await page.getByRole("button", { name: "Sign out" }).click();

    await page.waitForURL((url) => url.pathname === "/sign-in");
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    const meStatus = await page.evaluate(async () => (await fetch("/api/auth/me")).status);
    expect(meStatus).toBe(401);
    await page.goto(browser.url("/projects"));
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await browser.screenshot("signed-out");
  });

  it("the whole visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
