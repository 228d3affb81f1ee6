/**
 * Real-browser support for tests/browser: Debian's Chromium driven by playwright-core, against the app that
 * scripts/test.ts starts (its address in TEST_BASE_URL). Each launch gets a fresh profile folder, removed on close.
 */
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { DEMO_PASSWORD } from "./http";

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

/** Flags for a closed network and a headless run; `--user-data-dir` must not be here (playwright sets it). */
const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
export const artifactsDir = path.join(projectRoot, "test-artifacts");

/** The running app's origin, without a trailing slash. */
export function baseUrl(): string {
  const url = process.env.TEST_BASE_URL;
  if (!url) {
    throw new Error(
      "TEST_BASE_URL is not set. Run the browser tests through `npm test` (scripts/test.ts starts the app), " +
        "or start the app yourself and set TEST_BASE_URL=http://127.0.0.1:<port>.",
    );
  }
  return url.replace(/\/+$/, "");
}

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** An absolute URL on the app under test. */
  url: (pathname: string) => string;
  /** Saves a full-page PNG as test-artifacts/<name>.png and returns its path. */
  screenshot: (name: string) => Promise<string>;
  close: () => Promise<void>;
}

export async function launchBrowser(options: { viewport?: { width: number; height: number } } = {}): Promise<BrowserSession> {
  const origin = baseUrl();
  const profileDir = mkdtempSync(path.join(tmpdir(), "stillspan-chromium-"));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: options.viewport ?? { width: 1280, height: 800 },
    locale: "en-GB",
  });
  context.setDefaultTimeout(15_000);
  const page = context.pages()[0] ?? (await context.newPage());

  return {
    context,
    page,
    url: (pathname) => `${origin}${pathname}`,
    screenshot: async (name) => {
      mkdirSync(artifactsDir, { recursive: true });
      const file = path.join(artifactsDir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    close: async () => {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/**
 * Collects what a clean visit never shows: uncaught exceptions, and console errors or warnings other than the
 * browser's own "Failed to load resource" note for `expectedStatuses` (the session probe's 401, and answers a
 * test provokes on purpose). Returns the list it fills, for a final `expect(problems).toEqual([])`.
 */
export function collectPageProblems(page: Page, expectedStatuses: readonly number[] = [401, 404]): string[] {
  const problems: string[] = [];
  const expectedRefusal = new RegExp(`Failed to load resource: the server responded with a status of (${expectedStatuses.join("|")})\\b`);
  page.on("pageerror", (error) => problems.push(`uncaught: ${error.message}`));
  page.on("console", (message) => {
    if ((message.type() === "error" || message.type() === "warning") && !expectedRefusal.test(message.text())) {
      problems.push(`${message.type()}: ${message.text()}`);
    }
  });
  return problems;
}

/** Fills the sign-in form the page is on and waits for the page it lands on. */
export async function fillSignInForm(page: Page, email: string, landing: string, password = DEMO_PASSWORD): Promise<void> {
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => url.pathname === landing);
}

/** Signs out with the header's button and waits for the sign-in page. */
export async function signOutInPage(page: Page): Promise<void> {
  await page.getByRole("button", { name: "Sign out" }).click();
  await page.waitForURL((url) => url.pathname === "/sign-in");
}
