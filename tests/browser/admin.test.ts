import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { collectPageProblems, fillSignInForm, launchBrowser, type BrowserSession } from "../support/browser";

const PROJECT_NAME = `Corrow Sound Footbridge ${Date.now().toString(36)} (invented)`;

describe("administration in the browser", () => {
  let browser: BrowserSession;
  /** Uncaught exceptions and console errors or warnings, except the browser's own note on a refused resource. */
  let problems: string[] = [];

  beforeAll(async () => {
    browser = await launchBrowser({ viewport: { width: 1280, height: 900 } });
    problems = collectPageProblems(browser.page);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it("the administrator opens the administration page from the navigation", async () => {
    const { page } = browser;
    await page.goto(browser.url("/projects"));
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await fillSignInForm(page, "admin@stillspan.test", "/projects");

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Admin" }).click();

    await page.getByRole("heading", { level: 1, name: "Administration" }).waitFor();
    const accounts = page.getByRole("table", { name: "Accounts" });
    await accounts.getByRole("rowheader", { name: /Owen Farrant/ }).waitFor();
    expect(await accounts.getByRole("row").count()).toBeGreaterThanOrEqual(5);
  });

  it("a blank project name is refused in the form, with the message beside the field", async () => {
    const { page } = browser;
    const form = page.getByRole("form", { name: "New project" });

    await form.getByRole("button", { name: "Create project" }).click();

    const name = form.getByLabel("Name");
    expect(await name.getAttribute("aria-invalid")).toBe("true");
    expect(await form.getByText("must not be blank").isVisible()).toBe(true);
  });

  it("the administrator creates a project, and it opens with no members", async () => {
    const { page } = browser;
    const form = page.getByRole("form", { name: "New project" });

    await form.getByLabel("Name").fill(PROJECT_NAME);
    await form.getByLabel("Description").fill("Invented crossing for the administration test.");
    await form.getByRole("button", { name: "Create project" }).click();

    await page.getByRole("heading", { name: `Members of ${PROJECT_NAME}` }).waitFor();
    expect(await page.getByText("No members yet.").isVisible()).toBe(true);
    expect(await page.getByLabel("Project", { exact: true }).inputValue()).toBe(
      new URL(page.url()).searchParams.get("project"),
    );
    expect(await form.getByLabel("Name").inputValue()).toBe("");
  });

  it("the administrator adds the demo viewer as viewer, and the server records it", async () => {
    const { page } = browser;
    const addForm = page.getByRole("form", { name: "Add a member" });

    await addForm.getByLabel("Person").selectOption({ label: "Owen Farrant (viewer@stillspan.test)" });
    await addForm.getByLabel("Role").selectOption("viewer");
    await addForm.getByRole("button", { name: "Add member" }).click();

    const members = page.getByRole("table", { name: `Members of ${PROJECT_NAME}` });
    await members.getByRole("rowheader", { name: "Owen Farrant" }).waitFor();
    expect(await members.getByLabel("Role of Owen Farrant").inputValue()).toBe("viewer");
    const projectId = new URL(page.url()).searchParams.get("project");
    const stored = await page.evaluate(async (id) => {
      const res = await fetch(`/api/projects/${id}/members`);
      return (await res.json()) as { email: string; role: string }[];
    }, projectId);
    expect(stored.map((m) => `${m.email}:${m.role}`)).toEqual(["viewer@stillspan.test:viewer"]);
    const accountRow = page.getByRole("table", { name: "Accounts" }).getByRole("row").filter({ hasText: "viewer@stillspan.test" });
    await accountRow.getByText(PROJECT_NAME).waitFor();
    await page.waitForSelector('form[aria-label="Add a member"] button[type="submit"]:not([aria-busy])');
    await browser.screenshot("admin");
  });

  it("the administrator invites someone by e-mail, and the invitation reaches the local mailbox", async () => {
    const { page } = browser;
    const email = `invitee-${Date.now().toString(36)}@stillspan.test`;
    const inviteForm = page.getByRole("form", { name: "Invite by e-mail" });

    await inviteForm.getByLabel("E-mail").fill(email);
    await inviteForm.getByLabel("Role").selectOption("reviewer");
    await inviteForm.getByRole("button", { name: "Send invitation" }).click();

    await inviteForm.getByRole("status").filter({ hasText: `Invitation sent to ${email}` }).waitFor();
    const subjects = await page.evaluate(async (to) => {
      const res = await fetch(`/api/dev/mailbox?to=${encodeURIComponent(to)}`);
      return ((await res.json()) as { messages: { subject: string }[] }).messages.map((m) => m.subject);
    }, email);
    expect(subjects).toHaveLength(1);
    expect(subjects[0]).toContain(PROJECT_NAME);
  });

  it("the administrator's own flag cannot be removed from the page", async () => {
    const { page } = browser;
    const ownRow = page.getByRole("table", { name: "Accounts" }).getByRole("row").filter({ hasText: "admin@stillspan.test" });
    expect(await ownRow.getByRole("button", { name: /Remove the administrator flag/ }).count()).toBe(0);
    expect(await ownRow.getByText("another administrator can remove it").isVisible()).toBe(true);
  });

  it("the administration page has no sideways scroll at tablet width", async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 820, height: 1180 });

    await page.getByRole("heading", { name: `Members of ${PROJECT_NAME}` }).waitFor();

    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await browser.screenshot("admin-tablet");
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it("the whole visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
