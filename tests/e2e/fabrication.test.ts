// Browser test of the fabrication pages: the composer's slope profile under the route plan (the
// demo walk's flagged stretch hatched and listed in words) at 1366 and 390 px, and print panels of
// the corridor wall asked for from the signs page, made in the background with a progress bar that
// reaches 100 %; screenshots of each.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, shot, signIn } from "./helpers.ts";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("fabrication in the browser", () => {
  it("the route's slope profile shows under the route plan, flagged stretch by pattern and in words", async () => {
    for (const width of [1366, 390]) {
      const page = await browser.newPage({ viewport: { width, height: 900 } });
      const errors: string[] = [];
      page.on("pageerror", (e) => errors.push(e.message));
      await signIn(page, "designer@marrowby.example", "deep-time-demo");
      await page.goto(`${BASE}/studio/exhibits/riverside-walk`);
      const chart = page.getByTestId("profile-chart");
      await chart.scrollIntoViewIfNeeded();
      await expect.poll(() => chart.locator("rect[data-flagged=yes]").count()).toBe(1);
      expect(await chart.textContent()).toMatch(/ABA §1017: steeper than 8\.33 % for at most 9 m/);
      await chart.screenshot({ path: `test-results/screenshots/fabrication-profile-${width}.png` });
      expect(errors).toEqual([]);
      await page.close();
    }
  });

  it("print panels from the signs page: 202, a progress bar to 100 %, then the file", async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 1000 }, acceptDownloads: true });
    await signIn(page, "designer@marrowby.example", "deep-time-demo");
    await page.goto(`${BASE}/studio/exhibits/corridor-wall/signs`);
    await page.evaluate(() => {
      const seen: number[] = [];
      (window as unknown as { __seen: number[] }).__seen = seen;
      new MutationObserver(() => {
        for (const p of document.querySelectorAll("progress")) seen.push(Number((p as HTMLProgressElement).value));
      }).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ["value"] });
    });
    await page.getByLabel("Panel width (mm)").fill("600");
    const download = page.waitForEvent("download", { timeout: 60_000 });
    await page.getByRole("button", { name: "Make panels.pdf" }).click();
    await page.getByTestId("export-jobs").waitFor();
    await shot(page, "fabrication-panels-progress");
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/corridor-wall-.*panels\.pdf$/);
    const seen = await page.evaluate(() => (window as unknown as { __seen: number[] }).__seen);
    expect(Math.max(...seen)).toBe(1);
    await shot(page, "fabrication-signs-page");
  });
});
