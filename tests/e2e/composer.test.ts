// Browser test of the designer's day: a route exhibit from an uploaded GPX file, boundaries, a
// library event and a custom age, a legibility warning fixed by the suggested inset, the schedule.
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { geodesicDirect } from "../../app/lib/geo/geodesic.ts";
import { readCsv } from "../../app/lib/timescale/csv.ts";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, SHOTS, shot, signIn } from "./helpers.ts";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** An invented 2 km lakeside path as GPX: 200 legs of 10 m, gently curving. */
function gpxFile(): string {
  let lat = 55.1;
  let lon = -3.2;
  const pts = [`<trkpt lat="${lat}" lon="${lon}"><ele>120</ele></trkpt>`];
  for (let i = 0; i < 200; i++) {
    const next = geodesicDirect(lat, lon, 90 + 40 * Math.sin(i / 30), 10);
    lat = next.lat2;
    lon = next.lon2;
    pts.push(`<trkpt lat="${lat.toFixed(8)}" lon="${lon.toFixed(8)}"><ele>${120 + i / 10}</ele></trkpt>`);
  }
  const file = path.join(SHOTS, "..", "lakeside-path.gpx");
  writeFileSync(file, `<?xml version="1.0" encoding="UTF-8"?>\n<gpx version="1.1" creator="Eonscale test" xmlns="http://www.topografix.com/GPX/1/1"><trk><name>Lakeside path</name><trkseg>${pts.join("")}</trkseg></trk></gpx>`);
  return file;
}

describe("the exhibit composer", () => {
  it("builds a route exhibit from a GPX file and exports its schedule", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 }, acceptDownloads: true });
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    await signIn(page, "designer@marrowby.example", "deep-time-demo");

    await page.goto(`${BASE}/studio/exhibits/new`);
    await page.getByLabel("Title").fill("Lakeside walk");
    await page.getByLabel("A route (GeoJSON or GPX)").check();
    await page.getByLabel("Route file").setInputFiles(gpxFile());
    await shot(page, "composer-01-new-route");
    await page.getByRole("button", { name: "Create the exhibit" }).click();
    await page.waitForURL(`${BASE}/studio/exhibits/lakeside-walk`);
    await page.getByText("Before anyone walks this route").waitFor();
    await page.getByText(/2\.000 km measured on the/).waitFor();
    await shot(page, "composer-02-created");

    // Every period base.
    await page.getByLabel("All of a rank").selectOption("period");
    await page.getByRole("button", { name: "Add all" }).click();
    await page.getByText("Added 22 boundaries.").waitFor();
    // A library event, found by searching as you type.
    await page.getByLabel("Search the library").fill("zircon");
    await page.locator("#event-results button").first().click();
    await page.getByRole("button", { name: "Add the event" }).click();
    await page.getByText(/^Added “.*”\.$/).waitFor();
    // A custom age without a source is refused, with the reason; then with one it is added.
    const custom = page.locator("form").filter({ has: page.getByRole("button", { name: "Add the age" }) });
    await custom.locator("input[name=label]").fill("Boathouse built");
    await custom.locator("input[name=ageValue]").fill("150");
    await custom.locator("select[name=ageUnit]").selectOption("a");
    await custom.getByRole("button", { name: "Add the age" }).click();
    await page.getByText("Name the source of this age", { exact: false }).first().waitFor();
    await shot(page, "composer-03-custom-needs-source");
    await custom.locator("input[name=label]").fill("Boathouse built");
    await custom.locator("input[name=ageValue]").fill("150");
    await custom.locator("select[name=ageUnit]").selectOption("a");
    await custom.locator("input[name=source]").fill("Estate records, 1875 (invented demo source)");
    await custom.getByRole("button", { name: "Add the age" }).click();
    await page.getByText("Added “Boathouse built”.").waitFor();
    await shot(page, "composer-04-markers");

    // The preview warns, naming the markers by table number with links to their rows; the suggested
    // inset is one click away.
    const warning = page.getByText("Markers too close together:", { exact: false }).first();
    await warning.waitFor();
    await warning.scrollIntoViewIfNeeded();
    await shot(page, "composer-05-warning");
    const rowLink = page.locator("#warnings a[href^='#marker-']").first();
    const target = (await rowLink.getAttribute("href"))!;
    await rowLink.click();
    await expect(page.locator(target).isVisible()).resolves.toBe(true);
    const insetsBefore = await page.locator("#insets-h").innerText();
    await page.getByRole("button", { name: /Add the suggested inset/ }).first().click();
    await page.getByText(/^Inset added: /).waitFor();
    expect(await page.locator("#insets-h").innerText()).not.toBe(insetsBefore);
    await shot(page, "composer-06-inset-added");

    // A warning acknowledged with a reason: too short a reason is refused beside its form, then kept.
    const firstWarning = page.locator("#warnings li[data-warning-key]").first();
    const key = (await firstWarning.getAttribute("data-warning-key"))!;
    await firstWarning.getByText("Acknowledge with a reason…").click();
    await firstWarning.locator("textarea[name=reason]").fill("ok");
    await firstWarning.getByRole("button", { name: "Acknowledge" }).click();
    await page.locator(`#warnings li[data-warning-key="${key}"]`).getByText("Say why this warning is acceptable", { exact: false }).waitFor();
    await page.locator(`#warnings li[data-warning-key="${key}"] textarea[name=reason]`).fill("The two signs share one post; both names are printed on it.");
    await page.locator(`#warnings li[data-warning-key="${key}"]`).getByRole("button", { name: "Acknowledge" }).click();
    await page.locator(`#warnings li[data-warning-key="${key}"]`).getByText("The two signs share one post", { exact: false }).waitFor();
    await shot(page, "composer-06b-acknowledged");

    // The preview follows the settings as they are typed, before saving, and stays in view above them.
    const span = page.locator("input[name=spanOlderValue]");
    // The saved acknowledgement re-renders the composer: the field may be replaced while we scroll.
    for (let attempt = 0; ; attempt++) {
      try {
        await page.waitForLoadState("networkidle");
        await span.scrollIntoViewIfNeeded({ timeout: 5_000 });
        break;
      } catch (error) {
        if (attempt >= 4) throw error;
      }
    }
    await span.fill("541");
    await page.getByText("Unsaved settings shown", { exact: false }).waitFor();
    // the older markers now lie outside the span: named as the table names them, not by request paths or ids
    await page.locator("#preview-body").getByText(/markers lie outside the span \(541 Ma to the present\): 1 “/).waitFor();
    expect(await page.locator("#preview-body").innerText()).not.toMatch(/points\.\d|Invalid request|Point "/);
    const pane = await page.getByTestId("preview-pane").boundingBox();
    const field = await span.boundingBox();
    expect(pane && field && pane.y >= 0 && pane.y + pane.height <= field.y).toBe(true);
    await shot(page, "composer-06c-typing-with-preview");
    await span.fill("4567");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Marker schedule (CSV)" }).click()]);
    const file = path.join(SHOTS, "..", "lakeside-schedule.csv");
    await download.saveAs(file);
    const [header, ...rows] = readCsv(readFileSync(file, "utf8")).records.map((r) => r.fields);
    expect(header.join(",")).toBe("number,label,kind,interval,event,age_ma,age_uncertainty_ma,source,from_start_m,to_end_m,latitude,longitude,walk_minutes");
    expect(rows.filter((r) => r[2] === "boundary")).toHaveLength(22);
    expect(rows.filter((r) => r[2] === "event")).toHaveLength(1);
    // The boathouse (150 years) is the youngest marker, so the last a visitor reaches: numbered last.
    expect(rows.find((r) => r[1] === "Boathouse built")?.slice(0, 6)).toEqual([String(rows.length), "Boathouse built", "custom", "", "", "0.00015"]);
    expect(errors).toEqual([]);
  });

  it("shows the corridor wall as needing a re-check, with the impact report", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    await signIn(page, "reviewer@marrowby.example", "deep-time-demo");
    await page.goto(`${BASE}/studio/exhibits?recheck=1`);
    await page.getByRole("link", { name: "The corridor of the Phanerozoic" }).waitFor();
    await shot(page, "composer-07-list-recheck");
    await page.getByRole("link", { name: "The corridor of the Phanerozoic" }).click();
    await page.getByRole("heading", { name: /Impact of the newer chart edition: ICS 2023\/09 → ICS 2024\/12/ }).waitFor();
    await page.getByRole("heading", { name: /Impact of the newer chart edition/ }).scrollIntoViewIfNeeded();
    await shot(page, "composer-08-impact");
    // A reviewer reads; only designers change exhibits.
    expect(await page.getByRole("button", { name: /re-pin/i }).count()).toBe(0);
  });
});
