/**
 * Real-browser support for tests/browser: Debian's Chromium driven by playwright-core, against the app that
 * scripts/test.ts starts (its address in TEST_BASE_URL). Each launch gets a fresh profile folder, removed on close.
 */
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { chromium, type BrowserContext, type Page } from "playwright-core";

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
