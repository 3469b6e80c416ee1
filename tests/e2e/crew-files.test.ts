// Browser test of the exhibit page's export menu: a designer opens "Export files" on the published
// riverside walk, downloads the GPX from publication 1 and the GeoJSON from the working copy
// (DRAFT — not checked) through the real server, and the public publication file route answers
// without a cookie. Screenshots of the open menu at 1366 px and 390 px.
import { readFileSync } from "node:fs";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, SHOTS, signIn } from "./helpers.ts";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function openMenu(page: Page) {
  await page.goto(`${BASE}/studio/exhibits/riverside-walk`, { waitUntil: "networkidle", timeout: 90_000 });
  const menu = page.getByTestId("export-menu");
  await menu.locator("summary").click();
  await expect.poll(() => menu.getByRole("link", { name: "Marker waypoints (GPX) from publication 1" }).isVisible()).toBe(true);
  return menu;
}

describe("export menu", () => {
  it("downloads points.gpx from the publication and points.geojson from the working copy", async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 }, acceptDownloads: true });
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await signIn(page, "designer@marrowby.example", "deep-time-demo");
    const menu = await openMenu(page);
    await menu.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SHOTS, "crew-files-menu-desktop.png") });
    const [gpx] = await Promise.all([page.waitForEvent("download"), menu.getByRole("link", { name: "Marker waypoints (GPX) from publication 1" }).click()]);
    expect(gpx.suggestedFilename()).toBe("riverside-walk-publication-1-points.gpx");
    const gpxText = readFileSync((await gpx.path())!, "utf8");
    expect(gpxText).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<gpx version="1.1"/);
    expect(gpxText).not.toContain("DRAFT");

    const geoLink = menu.getByRole("link", { name: "Marker points (GeoJSON) from the working copy (draft)" });
    const [geo] = await Promise.all([page.waitForEvent("download"), geoLink.click()]);
    expect(geo.suggestedFilename()).toMatch(/^riverside-walk-draft-rev\d+-points\.geojson$/);
    const fc = JSON.parse(readFileSync((await geo.path())!, "utf8"));
    expect(fc.eonscale.status).toBe("DRAFT — not checked");
    expect(errors).toEqual([]);

    // The same server: a bad `from` is a 400 with the reason; the public route needs no cookie.
    const bad = await page.request.get(`${BASE}/studio/exhibits/riverside-walk/points.gpx?from=latest`);
    expect(bad.status()).toBe(400);
    expect(await bad.text()).toMatch(/from: must be/);
    const anonymous = await browser.newContext();
    const pub = await anonymous.request.get(`${BASE}/api/exhibits/marrowby/riverside-walk/publications/1/points.gpx`);
    expect(pub.status()).toBe(200);
    expect(pub.headers()["cache-control"]).toMatch(/^public/);
    expect(await pub.text()).toBe(gpxText);
    const unknown = await anonymous.request.get(`${BASE}/api/exhibits/marrowby/riverside-walk/publications/1/points.kml`);
    expect(unknown.status()).toBe(404);
    expect((await unknown.json()).error.message).toMatch(/No file "points.kml"/);
    await anonymous.close();
    await page.close();
  });

  it("the open menu fits a phone screen", async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    await signIn(page, "designer@marrowby.example", "deep-time-demo");
    const menu = await openMenu(page);
    const box = (await menu.locator("div").first().boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(390);
    await page.screenshot({ path: path.join(SHOTS, "crew-files-menu-phone.png") });
    await page.close();
  });
});
