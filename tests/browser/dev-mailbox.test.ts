import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestApp, type TestApp } from "../support/app.js";
import { baseUrl, launchBrowser, type BrowserSession } from "../support/browser";
import { api, DEMO_PASSWORD, signIn as apiSignIn } from "../support/http.js";

const RUN = Date.now().toString(36);
const FIRST_PROJECT = `Marl Firth Crossing ${RUN} (invented)`;
const SECOND_PROJECT = `Hesket Narrows Bridge ${RUN} (invented)`;
const INVITEE = `mailbox-invitee-${RUN}@stillspan.test`;

/** Creates a project of this test's own and invites INVITEE to it: a real message through the app's fake SMTP. */
async function inviteToNewProject(adminCookie: string, projectName: string): Promise<void> {
  const project = await api<{ id: string }>(baseUrl(), "/api/projects", { cookie: adminCookie, body: { name: projectName } });
  expect(project.status, JSON.stringify(project.body)).toBe(201);
  const invitation = await api(baseUrl(), `/api/projects/${project.body.id}/invitations`, {
    cookie: adminCookie,
    body: { email: INVITEE, role: "viewer" },
  });
  expect(invitation.status, JSON.stringify(invitation.body)).toBe(201);
}

describe("development mailbox in the browser", () => {
  let browser: BrowserSession;
  /** Uncaught exceptions and console errors or warnings, except the browser's own note on a refused resource. */
  const problems: string[] = [];

  beforeAll(async () => {
    const admin = await apiSignIn(baseUrl(), "admin@stillspan.test");
    await inviteToNewProject(admin, FIRST_PROJECT);
    await inviteToNewProject(admin, SECOND_PROJECT);

    browser = await launchBrowser({ viewport: { width: 1280, height: 900 } });
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

  /** Opens `landing` on `origin`, is sent to the sign-in page, signs in and comes back. */
  async function signIn(email: string, landing: string, origin = baseUrl()) {
    const { page } = browser;
    await page.goto(`${origin}${landing}`);
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

  it("the administrator opens the mailbox from the navigation and finds both invitations to the invitee, newest first", async () => {
    const { page } = browser;
    await signIn("admin@stillspan.test", "/projects");

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mailbox" }).click();
    await page.getByRole("heading", { level: 1, name: "Development mailbox" }).waitFor();
    const filter = page.getByRole("form", { name: "Filter by recipient" });
    await filter.getByLabel("Recipient").fill(INVITEE);
    await filter.getByRole("button", { name: "Show", exact: true }).click();

    await page.waitForURL((url) => url.searchParams.get("to") === INVITEE);
    const list = page.getByRole("table", { name: "Received messages" });
    await list.getByRole("rowheader").first().waitFor();
    expect(await list.getByRole("rowheader").allTextContents()).toEqual([
      `You are invited to ${SECOND_PROJECT} on Stillspan`,
      `You are invited to ${FIRST_PROJECT} on Stillspan`,
    ]);
    expect(await list.getByRole("row").nth(1).getByRole("cell").nth(1).textContent()).toBe(INVITEE);
  });

  it("the open message shows its one-time link, the HTML part in a script-less sandbox and the plain-text part", async () => {
    const { page } = browser;
    const subject = `You are invited to ${FIRST_PROJECT} on Stillspan`;

    await page.getByRole("table", { name: "Received messages" }).getByRole("button", { name: subject }).click();

    const message = page.getByRole("region", { name: `Message: ${subject}` });
    await message.waitFor();
    const link = message.getByRole("region", { name: "Links in this message" }).getByRole("link");
    expect(await link.count()).toBe(1);
    const href = (await link.getAttribute("href"))!;
    expect(href).toMatch(new RegExp(`^${baseUrl().replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}/accept-invite\\?token=[\\w-]{20,}$`));

    const frame = message.locator("iframe");
    expect(await frame.getAttribute("sandbox")).toBe("");
    const html = page.frameLocator(`iframe[title="HTML part of “${subject}”"]`);
    expect(await html.getByRole("link", { name: "Set your password" }).getAttribute("href")).toBe(href);
    expect(await html.locator("body").textContent()).toContain(FIRST_PROJECT);

    const text = await message.getByRole("region", { name: "Plain-text part" }).textContent();
    expect(text).toContain(href);
    expect(text).toContain(FIRST_PROJECT);
    await browser.screenshot("dev-mailbox");
  });

  it("a half-typed recipient is refused beside the field and the list stays as it was", async () => {
    const { page } = browser;
    const filter = page.getByRole("form", { name: "Filter by recipient" });

    await filter.getByLabel("Recipient").fill("mailbox-invitee");
    await filter.getByRole("button", { name: "Show", exact: true }).click();

    expect(await filter.getByLabel("Recipient").getAttribute("aria-invalid")).toBe("true");
    expect(new URL(page.url()).searchParams.get("to")).toBe(INVITEE);
    expect(await page.getByRole("table", { name: "Received messages" }).getByRole("rowheader").count()).toBe(2);
    await signOut();
  });

  it("an analyst has no mailbox link, and opening its address leads to the analyst's start page", async () => {
    const { page } = browser;
    await signIn("analyst@stillspan.test", "/projects");
    const nav = page.getByRole("navigation", { name: "Main" });
    expect(await nav.getByRole("link").allTextContents()).not.toContain("Mailbox");

    await page.goto(browser.url("/admin/mailbox"));

    await page.waitForURL((url) => url.pathname === "/projects");
    expect(await page.getByRole("heading", { name: "Development mailbox" }).count()).toBe(0);
    await signOut();
  });

  describe("on a server configured with a real SMTP server", () => {
    let realSmtpApp: TestApp;
    let proxy: http.Server;
    let proxyOrigin = "";

    beforeAll(async () => {
      realSmtpApp = await startTestApp({ env: { SMTP_HOST: "smtp.invalid", SMTP_PORT: "587" } });
      // One origin for the browser: the API of the real-SMTP app, the client pages from the app under test.
      proxy = http.createServer((req, res) => {
        const target = new URL(req.url ?? "/", req.url?.startsWith("/api/") ? realSmtpApp.baseUrl : baseUrl());
        const upstream = http.request(target, { method: req.method, headers: req.headers }, (answer) => {
          res.writeHead(answer.statusCode ?? 502, answer.headers);
          answer.pipe(res);
        });
        upstream.on("error", () => res.writeHead(502).end());
        req.pipe(upstream);
      });
      await new Promise<void>((resolve) => proxy.listen(0, "127.0.0.1", resolve));
      proxyOrigin = `http://127.0.0.1:${(proxy.address() as AddressInfo).port}`;
    });

    afterAll(async () => {
      proxy?.closeAllConnections();
      await new Promise<void>((resolve) => (proxy ? proxy.close(() => resolve()) : resolve()));
      await realSmtpApp?.close();
    });

    it("the administrator is told there is no local mailbox because the server sends real e-mail", async () => {
      const { page } = browser;
      await signIn("admin@stillspan.test", "/admin/mailbox", proxyOrigin);

      await page.getByText("No local mailbox: this server sends real e-mail.").waitFor();
      expect(await page.getByRole("table", { name: "Received messages" }).count()).toBe(0);
      await browser.screenshot("dev-mailbox-real-smtp");
    });
  });

  it("the whole visit logged no uncaught error and no console error or warning", () => {
    expect(problems).toEqual([]);
  });
});
