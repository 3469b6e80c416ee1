// Browser test of the event library against the built app: the demo editor searches the shared
// library, adds the museum's own entry (a wrong age first: the field says why), opens the decay
// systems and their calculator; the demo designer reads the library without the editing controls.
// Screenshots go to test-results/screenshots/library-*.png.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, shot, signIn, signOut } from "./helpers.ts";

let browser: Browser;
let page: Page;
const errors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on("pageerror", (e) => errors.push(e.message));
  page.on("console", (m) => m.type() === "error" && errors.push(m.text()));
});

afterAll(async () => {
  await browser?.close();
});

describe("the event library in the browser", () => {
  it("the editor searches the shared library", async () => {
    await signIn(page, "editor@marrowby.example", "deep-time-demo");
    await page.getByRole("navigation", { name: "Studio" }).getByRole("link", { name: "Event library" }).click();
    await page.waitForURL(`${BASE}/studio/library`);
    await page.getByRole("link", { name: "Oldest dated mineral grain on Earth (Jack Hills zircon)" }).waitFor();
    await shot(page, "library-01-list-editor");
    await page.getByRole("searchbox", { name: "Search" }).fill("extinction");
    await page.waitForURL(/q=extinction/);
    await page.getByRole("link", { name: "End-Permian mass extinction begins" }).waitFor();
    expect(await page.getByRole("link", { name: "Oldest dated rock on Earth (Acasta Gneiss)" }).count()).toBe(0);
    await shot(page, "library-02-search");
  });

  it("opens a shared entry: read-only, with how-we-know figures", async () => {
    await page.goto(`${BASE}/studio/library?q=zircon`);
    await page.getByRole("link", { name: "Oldest dated mineral grain on Earth (Jack Hills zircon)" }).click();
    await page.getByRole("heading", { name: "How we know" }).waitFor();
    await page.getByText("Shared entries are read-only reference data").waitFor();
    expect(await page.getByRole("button", { name: "Save changes" }).count()).toBe(0);
    await shot(page, "library-03-shared-entry");
  });

  it("adds the museum's own entry, after a wrong age is refused with its reason", async () => {
    await page.goto(`${BASE}/studio/library/new`);
    const name = `Marrowby Weir basalt ${Date.now().toString(36)}`;
    await page.getByLabel("Name").fill(name);
    await page.getByLabel("Summary").fill("A lava flow exposed below the weir on the museum's riverside trail.");
    await page.getByLabel("Age", { exact: true }).fill("61,2");
    await page.getByLabel("±").fill("0.4");
    await page.getByLabel("Dating method").fill("40Ar/39Ar groundmass");
    await page.getByLabel("Citation").fill("Quarrie, A. & Strand, E. (2026). The Marrowby Weir basalt. Marrowby Museum Occasional Papers 3, 1–12.");
    await page.getByRole("button", { name: "Add to the library" }).click();
    await page.getByText("Age: write a plain number such as 4567.30 or 0.315", { exact: false }).first().waitFor();
    await shot(page, "library-04-form-error");
    await page.getByLabel("Age", { exact: true }).fill("61.2");
    await page.getByRole("button", { name: "Add to the library" }).click();
    await page.getByText(`“${name}” is in Marrowby Museum of the Earth's library.`).waitFor();
    await page.getByRole("heading", { name: "Edit this entry" }).waitFor();
    await shot(page, "library-05-own-entry");
    await page.goto(`${BASE}/studio/library?scope=ours`);
    await page.getByRole("link", { name }).waitFor();
    await shot(page, "library-06-ours");
  });

  it("shows the decay systems and works out what is left", async () => {
    await page.goto(`${BASE}/studio/library/decay`);
    await page.getByRole("rowheader", { name: /²³⁸U → ²⁰⁶Pb/ }).waitFor();
    await page.getByLabel("Age", { exact: true }).fill("4404");
    await page.getByRole("columnheader", { name: "Left after 4404 Ma" }).waitFor();
    await page.getByRole("cell", { name: /50\.5 %/ }).first().waitFor();
    await shot(page, "library-07-decay-systems");
    await signOut(page);
  });

  it("the designer reads the library without editing controls (mobile)", async () => {
    const mobile = await browser.newPage({ viewport: { width: 390, height: 844 } });
    await signIn(mobile, "designer@marrowby.example", "deep-time-demo");
    await mobile.goto(`${BASE}/studio/library`);
    await mobile.getByRole("heading", { name: "Event library" }).waitFor();
    expect(await mobile.getByRole("link", { name: "Add an event" }).count()).toBe(0);
    await shot(mobile, "library-08-designer-mobile");
    const res = await mobile.goto(`${BASE}/studio/library/new`);
    expect(res?.status()).toBe(403);
    await mobile.close();
    // The deliberate wrong age (400) and the designer on the editors' page (403) are the only errors expected.
    expect(errors.filter((e) => !/status of (400|403)/.test(e))).toEqual([]);
  });
});
