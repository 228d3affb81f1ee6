/**
 * Result plots in a real browser: plotly's own toolbar (which can offer to upload a chart's data to an outside
 * charting service) never shows, not even on hover, and nothing links to the library's site; our own control
 * downloads the figure as PNG and as SVG, made in the browser.
 */
import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { collectPageProblems, fillSignInForm, launchBrowser, type BrowserSession } from "../support/browser";

const DEMO_PROJECT = "Harrowmere Estuary Crossing (invented demo)";

/** What plotly's stock toolbar and its links look like in the page, if anything of it is there. */
async function libraryChrome(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(
      document.querySelectorAll(
        // plotly keeps an empty .modebar-container in every plot; the toolbar is what would go in it.
        '.modebar, .modebar-container > *, .modebar-btn, a[href*="plot.ly"], a[href*="plotly.com"], a[href*="chart-studio"], [data-title*="Chart Studio"], [data-title*="cloud" i]',
      ),
      (el) => `${el.tagName.toLowerCase()}.${String(el.className)} ${el.getAttribute("data-title") ?? el.getAttribute("href") ?? ""}`.trim(),
    ),
  );
}

async function download(page: Page, buttonName: RegExp) {
  const [file] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: buttonName }).click()]);
  return { name: file.suggestedFilename(), bytes: readFileSync((await file.path())!) };
}

describe("result plots", () => {
  let browser: BrowserSession;
  let problems: string[] = [];

  beforeAll(async () => {
    browser = await launchBrowser();
    problems = collectPageProblems(browser.page);
    await browser.page.goto(browser.url("/projects"));
    await fillSignInForm(browser.page, "analyst@stillspan.test", "/projects");
  });
  afterAll(async () => {
    await browser?.close();
  });

  it("show no plotly toolbar or cloud link in the study workspace, also while the pointer is on a plot", async () => {
    const { page } = browser;
    await page.getByRole("link", { name: DEMO_PROJECT }).click();
    await page.getByRole("table", { name: /^Studies of / }).first().getByRole("link").first().click();
    const poles = page.getByRole("figure", { name: /^Pole paths/ });
    await poles.locator(".main-svg").first().waitFor();
    await poles.hover();
    await page.getByRole("figure", { name: /^Damping ratio/ }).hover();
    expect(await page.locator(".js-plotly-plot").count()).toBeGreaterThanOrEqual(3);
    expect(await libraryChrome(page)).toEqual([]);
  });

  it("download the pole paths as PNG and the damping curves as SVG with our own control", async () => {
    const { page } = browser;
    const png = await download(page, /^Download pole paths .* as PNG$/);
    expect(png.name).toBe("pole-paths.png");
    expect(png.bytes.subarray(0, 8).toString("hex")).toBe("89504e470d0a1a0a"); // the PNG signature
    expect(png.bytes.length).toBeGreaterThan(5_000);

    const svg = await download(page, /^Download damping ratio .* as SVG$/);
    expect(svg.name).toBe("damping-ratio.svg");
    const text = svg.bytes.toString("utf8");
    expect(text).toMatch(/^<svg[^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(text).toContain("<path");
    await browser.screenshot("result-plot-download");
  });

  it("the signed summary's plots have the same control and no plotly toolbar", async () => {
    const { page } = browser;
    await page.goto(browser.url("/signed-summaries"));
    await page.getByRole("link", { name: /, revision \d+$/ }).first().click();
    const damping = page.getByRole("figure", { name: /^Damping ratio of each pole branch/ });
    await damping.locator(".main-svg").first().waitFor();
    await damping.hover();
    expect(await libraryChrome(page)).toEqual([]);
    const png = await download(page, /^Download damping ratio of each pole branch .* as PNG$/);
    expect(png.name).toMatch(/^summary-\d+-damping-ratio\.png$/);
    expect(png.bytes.subarray(0, 4).toString("hex")).toBe("89504e47");
    expect(problems).toEqual([]);
  });
});
