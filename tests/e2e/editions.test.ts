// Browser test of the chart-edition workflow against the built app (tests/setup/e2e-server.ts):
// the demo editor signs in, imports a CSV with one deliberate error, sees the problem with its
// line number, uploads the corrected file, imports it as a draft and compares it with the current
// edition. Screenshots of every step go to test-results/screenshots/.
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { E2E_PORT } from "../setup/test-env.ts";

const BASE = `http://127.0.0.1:${E2E_PORT}`;
const SHOTS = path.resolve("test-results/screenshots");
const FIXTURES = path.resolve("tests/fixtures/editions");
const SLUG = `test-edition-${Date.now().toString(36)}`;

let browser: Browser;
let page: Page;

async function shot(name: string, fullPage = false) {
  await page.screenshot({ path: path.join(SHOTS, `editions-${name}.png`), fullPage });
}

/** A sharper (2×) picture of one element, at most 700 CSS px tall, from the same URL and session. */
async function detail(name: string, testId: string, prepare?: (p: Page) => Promise<void>, url = page.url()) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, deviceScaleFactor: 2, storageState: await page.context().storageState() });
  const p = await context.newPage();
  await p.goto(url);
  const el = p.getByTestId(testId);
  await el.waitFor();
  if (prepare) await prepare(p);
  const box = (await el.boundingBox())!;
  await p.screenshot({ path: path.join(SHOTS, `editions-${name}.png`), clip: { x: box.x, y: box.y, width: Math.min(box.width, 1100), height: Math.min(box.height, 700) }, fullPage: true });
  await context.close();
}

beforeAll(async () => {
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
});

afterAll(async () => {
  await browser?.close();
});

describe("chart editions in the browser", () => {
  it("the editor signs in and opens the chart editions", async () => {
    await page.goto(`${BASE}/login?redirectTo=%2Fstudio`);
    await page.getByLabel("E-mail address").fill("editor@marrowby.example");
    await page.getByLabel("Password").fill("deep-time-demo");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${BASE}/studio`);
    await page.getByRole("link", { name: "Manage chart editions" }).waitFor();
    await shot("01-studio-home");
    // One chart-editions area: the site navigation opens the editions, whose own tabs lead to managing them.
    await page.getByRole("navigation", { name: "Studio" }).getByRole("link", { name: "Chart editions" }).click();
    await page.waitForURL(`${BASE}/editions`);
    await page.getByRole("navigation", { name: "Chart editions" }).getByRole("link", { name: "Manage" }).click();
    await page.waitForURL(`${BASE}/studio/editions`);
    await page.getByRole("cell", { name: /ICS 2024\/12/ }).waitFor();
    await shot("02-manage-editions");
  });

  it("uploads a CSV with one deliberate error and sees the problem with its line number", async () => {
    await page.getByRole("main").getByRole("link", { name: "Import an edition" }).click();
    await page.waitForURL(`${BASE}/studio/editions/import`);
    await page.getByLabel("Label", { exact: true }).fill("Test edition (Cretaceous base moved)");
    await page.getByLabel("Slug", { exact: true }).fill(SLUG);
    await page.getByLabel("Source citation").fill("Test fixture derived from ICS 2024/12 (tests/fixtures/editions/README.md); not a real chart edition.");
    await page.getByLabel("File", { exact: true }).setInputFiles(path.join(FIXTURES, "test-edition-one-error.csv"));
    await page.getByRole("button", { name: "Upload and check" }).click();
    const problems = page.getByTestId("import-problems");
    await problems.waitFor();
    const rows = problems.locator("tbody tr");
    await expect(rows.count()).resolves.toBe(2);
    const first = await rows.first().innerText();
    expect(first).toContain("131");
    expect(first).toContain("Berriasian");
    expect(first).toMatch(/does not meet the base of its parent/);
    await page.getByText(/Nothing has been saved/).first().waitFor();
    await expect(page.getByRole("button", { name: "Import as draft" }).count()).resolves.toBe(0);
    await shot("03-problem-with-line");
  });

  it("uploads the corrected file, sees a clean preview and imports it as a draft", async () => {
    await page.getByRole("heading", { name: "Upload the corrected file" }).waitFor();
    await page.getByLabel("File", { exact: true }).setInputFiles(path.join(FIXTURES, "test-edition.csv"));
    await page.getByRole("button", { name: "Upload and check" }).click();
    await page.getByText(/No problems: all 177 intervals pass every check/).waitFor();
    await expect(page.getByText(/3 interval bases moved/).count()).resolves.toBe(1);
    await shot("04-clean-preview");
    await page.getByRole("button", { name: "Import as draft" }).click();
    await page.waitForURL(`${BASE}/editions/${SLUG}`);
    await page.getByText(/has been imported as a draft/).waitFor();
    await page.getByTestId("timescale-chart").waitFor();
    await shot("05-draft-edition");
    // The chart: hide the ages, choose the Mesozoic box, draw only its time, then box heights by duration.
    await page.getByRole("button", { name: "Age", exact: true }).click();
    await page.getByRole("button", { name: /^Mesozoic \(era\)/ }).click();
    await page.getByRole("button", { name: "Draw only its time" }).click();
    await expect(page.getByTestId("timescale-chart").locator("text").filter({ hasText: "Berriasian" }).count()).resolves.toBe(0);
    await expect(page.getByTestId("timescale-chart").locator("text").filter({ hasText: "Early Cretaceous" }).count()).resolves.toBe(1);
    await page.getByTestId("timescale-chart").scrollIntoViewIfNeeded();
    await shot("06-chart-mesozoic-no-ages");
    await detail("06b-chart-top-detail", "timescale-chart");
    await detail("06c-chart-mesozoic-detail", "timescale-chart", async (p) => {
      await p.waitForLoadState("networkidle");
      await p.getByLabel("Draw from (million years ago)").fill("251.902");
      await p.getByLabel("to (million years ago)").fill("66");
      await p.getByRole("button", { name: "Draw this stretch" }).click();
      await p.getByText("Drawn: 251.902 to 66 million years ago").waitFor();
    });
    await page.getByLabel("By duration — time as distance").check();
    await page.getByRole("button", { name: "Whole chart again" }).click();
    await page.getByRole("button", { name: "Age", exact: true }).click();
    await expect(page.getByText(/each pixel of height is about \d/).count()).resolves.toBe(1);
    await page.getByTestId("timescale-chart").scrollIntoViewIfNeeded();
    await shot("06d-chart-whole-to-scale");
    // The table: filter by name, sort by base.
    await page.getByLabel("Name or parent contains").fill("Cretaceous");
    await page.getByText(/Showing \d+ of 177 intervals/).scrollIntoViewIfNeeded();
    await shot("07-table-filtered");
  });

  it("compares the draft with the current edition", async () => {
    await page.getByRole("link", { name: "Compare with ICS 2024/12" }).first().click();
    await page.waitForURL(new RegExp(`/editions/compare\\?from=ics-2024-12&to=${SLUG}$`));
    const table = page.getByTestId("moved-table");
    await table.waitFor();
    const rows = table.locator("tbody tr");
    await expect(rows.count()).resolves.toBe(1);
    const row = await rows.first().innerText();
    expect(row).toContain("Cretaceous");
    expect(row).toContain("143.1");
    expect(row).toContain("−0.1");
    await page.getByTestId("shift-chart").waitFor();
    await shot("08-compare-with-current", true);
    await detail("08b-shift-chart-detail", "shift-chart");
  });

  it("the draft is not public: a visitor gets 404 on its page and in the API", async () => {
    const visitor = await browser.newPage();
    const res = await visitor.goto(`${BASE}/editions/${SLUG}`);
    expect(res?.status()).toBe(404);
    const api = await visitor.goto(`${BASE}/api/timescales/${SLUG}`);
    expect(api?.status()).toBe(404);
    const list = await visitor.goto(`${BASE}/editions`);
    expect(list?.status()).toBe(200);
    await visitor.setViewportSize({ width: 1280, height: 900 });
    await visitor.screenshot({ path: path.join(SHOTS, "editions-09-visitor-list.png") });
    await visitor.goto(`${BASE}/editions/compare`);
    await visitor.getByTestId("shift-chart").waitFor();
    await visitor.screenshot({ path: path.join(SHOTS, "editions-10-visitor-compare-seeded.png"), fullPage: true });
    await detail("10b-seeded-shift-chart-detail", "shift-chart", undefined, `${BASE}/editions/compare`);
    await visitor.close();
  });
});
