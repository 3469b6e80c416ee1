// Visitor pages in Chromium: axe finds nothing serious or critical on the exhibit, marker and embed
// pages on a 390 px phone, at 320 px and at 200 % zoom, nothing scrolls sideways, targets ≥ 24 px;
// the marker page reads with no JavaScript; the nearest-marker button with a granted (faked)
// position and with a refused one; the embed alone can be framed; signed-in members get the same
// bytes; and the offline copy: keep the exhibit, go offline, open a marker page never opened before
// — answered by the service worker's copy, with the "you are offline" note.
import { once } from "node:events";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { axeFindings, BASE, shot } from "./helpers.ts";

const EXHIBIT = "/visit/marrowby/riverside-walk";
const PAGES: [string, string][] = [
  ["exhibit", EXHIBIT],
  ["marker", `${EXHIBIT}/6`],
  ["marker-de", `${EXHIBIT}/30?lang=de`],
  ["embed", `${EXHIBIT}/embed`],
];
const VIEWS = [
  { name: "390", viewport: { width: 390, height: 844 }, deviceScaleFactor: 1 },
  { name: "320", viewport: { width: 320, height: 640 }, deviceScaleFactor: 1 },
  // 200 % zoom of a 1366 px window: half as many CSS pixels, each drawn twice as large.
  { name: "zoom200", viewport: { width: 683, height: 450 }, deviceScaleFactor: 2 },
  { name: "1366", viewport: { width: 1366, height: 900 }, deviceScaleFactor: 1 },
];

let browser: Browser;
let snapshot: any;
beforeAll(async () => {
  browser = await launchBrowser();
  snapshot = (await (await fetch(`${BASE}/api/exhibits/marrowby/riverside-walk`)).json()).snapshot;
});
afterAll(async () => {
  await browser?.close();
});

/** Links and buttons smaller than 24 × 24 CSS px that are not inline in a sentence (WCAG 2.2 2.5.8). */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(document.querySelectorAll("a, button, summary"))
      .filter((el) => {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0) return false;
        const inline = getComputedStyle(el).display === "inline" && el.parentElement && el.parentElement.textContent!.trim() !== el.textContent!.trim();
        return !inline && (r.width < 24 || r.height < 24) && !el.closest("svg");
      })
      .map((el) => `${el.tagName.toLowerCase()} "${el.textContent!.trim().slice(0, 30)}" ${Math.round(el.getBoundingClientRect().width)}×${Math.round(el.getBoundingClientRect().height)}`),
  );
}

async function sidewaysBy(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
}

describe("accessibility and layout", () => {
  for (const view of VIEWS) {
    it(`${view.name}: axe finds nothing serious, nothing scrolls sideways, targets ≥ 24 px`, async () => {
      const context = await browser.newContext({ viewport: view.viewport, deviceScaleFactor: view.deviceScaleFactor, bypassCSP: true, serviceWorkers: "block" });
      const problems: string[] = [];
      try {
        for (const [name, path] of PAGES) {
          const page = await context.newPage();
          await page.goto(`${BASE}${path}`);
          await shot(page, `visit-${name}-${view.name}`);
          for (const p of await axeFindings(page)) problems.push(`${path}: ${p}`);
          const extra = await sidewaysBy(page);
          if (extra > 0) problems.push(`${path}: ${extra} px sideways`);
          for (const p of await smallTargets(page)) problems.push(`${path}: small target ${p}`);
          await page.close();
        }
      } finally {
        await context.close();
      }
      expect(problems).toEqual([]);
    });
  }

  it("labels on chart colours have at least 4.5:1 contrast (computed in the page)", async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${BASE}${EXHIBIT}`);
    const ratios = await page.evaluate(() => {
      const lum = (rgb: string) => {
        const [r, g, b] = rgb.match(/\d+/g)!.slice(0, 3).map((v) => {
          const s = Number(v) / 255;
          return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
        });
        return 0.2126 * r + 0.7152 * g + 0.0722 * b;
      };
      return Array.from(document.querySelectorAll(".visit-band, .visit-chip")).map((el) => {
        const cs = getComputedStyle(el);
        const [a, b] = [lum(cs.color), lum(cs.backgroundColor)].sort((x, y) => y - x);
        return (a + 0.05) / (b + 0.05);
      });
    });
    await context.close();
    expect(ratios.length).toBeGreaterThan(40);
    expect(Math.min(...ratios)).toBeGreaterThanOrEqual(4.5);
  });
});

describe("no JavaScript needed", () => {
  it("the marker page reads with JavaScript off: name, age (its unit in words), source, neighbours", async () => {
    const context = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${BASE}${EXHIBIT}/6`);
    const m = snapshot.markers.find((x: any) => x.signNumber === 6);
    expect(await page.locator("h1").textContent()).toBe(m.label);
    const text = await page.locator("main").innerText();
    expect(text).toContain(m.ageText);
    // the age's unit in plain words, for visitors who do not read "Ga" or "Ma"
    expect(text).toContain("Ages: Ga = billion years ago, Ma = million years ago, ka = thousand years ago.");
    expect(text).toContain(m.source.slice(0, 40));
    expect(text).toContain(snapshot.markers[4].label);
    expect(text).toContain(snapshot.markers[6].label);
    // No framework script on the page at all: only the small external script.
    const scripts = await page.locator("script").evaluateAll((els) => els.map((e) => (e as HTMLScriptElement).src || "inline"));
    expect(scripts).toEqual([`${BASE}/visit.js`]);
    await context.close();
  });
});

describe("nearest marker", () => {
  async function nearestWith(context: BrowserContext): Promise<string> {
    const page = await context.newPage();
    await page.goto(`${BASE}${EXHIBIT}`);
    await page.getByRole("button", { name: "Find the nearest marker" }).click();
    const out = page.locator("[data-nearest-out]");
    await out.filter({ hasNotText: /Asking/ }).filter({ hasText: /./ }).waitFor();
    const text = await out.innerText();
    await shot(page, "visit-nearest");
    return text;
  }

  /** A marker at least 30 m along the route from both neighbours (several signs share a place). */
  const alone = () => snapshot.markers.find((m: any, i: number, all: any[]) => i > 0 && i < all.length - 1 && m.walking.fromStartMetres - all[i - 1].walking.fromStartMetres > 30 && all[i + 1].walking.fromStartMetres - m.walking.fromStartMetres > 30);

  it("with a granted position at a sign it names that sign, about 0 m along the path", async () => {
    const m = alone();
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, permissions: ["geolocation"], geolocation: { latitude: m.position.lat, longitude: m.position.lon }, serviceWorkers: "block" });
    const text = await nearestWith(context);
    await context.close();
    expect(text.startsWith(`Nearest marker: sign ${m.signNumber}, ${m.label}, `)).toBe(true);
    expect(text).toMatch(/, [0-2] m along the path\.$/);
  });

  it("between two signs, 40 m off the path, it names the closer one along the path and says how far off", async () => {
    const a = alone();
    const b = snapshot.markers[snapshot.markers.indexOf(a) + 1];
    // A quarter of the way from a lone sign to the next, moved about 40 m north.
    const lat = a.position.lat + (b.position.lat - a.position.lat) / 4 + 40 / 111_250;
    const lon = a.position.lon + (b.position.lon - a.position.lon) / 4;
    const context = await browser.newContext({ permissions: ["geolocation"], geolocation: { latitude: lat, longitude: lon }, serviceWorkers: "block" });
    const text = await nearestWith(context);
    await context.close();
    expect(text).toMatch(new RegExp(`sign ${a.signNumber}, `));
    expect(text).toMatch(/You are about \d+ m from the path\./);
  });

  it("with the location refused it says so and what to do instead", async () => {
    const context = await browser.newContext({ permissions: [], serviceWorkers: "block" });
    const text = await nearestWith(context);
    await context.close();
    expect(text).toMatch(/Your location was not shared/);
  });
});

describe("HTTP: framing, same bytes signed in or out", () => {
  it("only the embed may be framed by another site; it shows the strip inside an iframe", async () => {
    const embed = await fetch(`${BASE}${EXHIBIT}/embed`);
    expect(embed.headers.get("x-frame-options")).toBeNull();
    expect(embed.headers.get("content-security-policy")).toMatch(/frame-ancestors \*/);
    for (const path of [EXHIBIT, `${EXHIBIT}/6`, "/"]) {
      const res = await fetch(`${BASE}${path}`);
      expect(res.headers.get("x-frame-options"), path).toBe("SAMEORIGIN");
    }
    // A museum's own page on another origin: a little server on another loopback port (Chromium
    // keeps pages it sees as public from framing local addresses, so the page must really be local).
    const museum = createServer((req, res) => {
      const src = req.url === "/other" ? `${BASE}${EXHIBIT}` : `${BASE}${EXHIBIT}/embed`;
      res.writeHead(200, { "Content-Type": "text/html" }).end(`<!doctype html><title>Museum</title><iframe title="strip" src="${src}" width="600" height="400"></iframe>`);
    });
    museum.listen(0, "127.0.0.1");
    await once(museum, "listening");
    const museumUrl = `http://localhost:${(museum.address() as AddressInfo).port}`;
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${museumUrl}/`);
    await expect(page.frameLocator("iframe").locator("h1").textContent()).resolves.toMatch(/Riverside walk/);
    await shot(page, "visit-embed-framed");
    // The exhibit page itself refuses to be framed.
    await page.goto(`${museumUrl}/other`);
    await page.waitForTimeout(500);
    expect(await page.frames()[1].content()).not.toContain("Riverside walk");
    await context.close();
    museum.close();
  });

  it("a signed-in member gets the same bytes, and no page or JSON sets a cookie", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${BASE}/login`);
    await page.getByLabel("E-mail address").fill("curator@marrowby.example");
    await page.getByLabel("Password").fill("deep-time-demo");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/studio/);
    for (const path of [EXHIBIT, `${EXHIBIT}/6`, `${EXHIBIT}/embed`, "/api/exhibits/marrowby/riverside-walk"]) {
      const member = await context.request.get(`${BASE}${path}`, { headers: { "Accept-Language": "en" } });
      const visitor = await fetch(`${BASE}${path}`, { headers: { "Accept-Language": "en" } });
      expect(Buffer.from(await member.body()).equals(Buffer.from(await visitor.arrayBuffer())), path).toBe(true);
      expect(member.headers()["set-cookie"], path).toBeUndefined();
      expect(visitor.headers.get("set-cookie"), path).toBeNull();
    }
    await context.close();
  });
});

describe("offline", () => {
  it("keeps the exhibit by itself after load; offline, another marker page comes from the service worker with the note", async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${BASE}${EXHIBIT}`);
    await page.waitForSelector("html[data-kept=yes]", { timeout: 60_000 });
    await expect(page.locator("[data-keep-out]").innerText()).resolves.toMatch(/^Saved for use without signal on /);
    await context.setOffline(true);
    // Sign 33 was never opened in this browser: only the kept copy can answer.
    const res = await page.goto(`${BASE}${EXHIBIT}/33`);
    expect(res?.fromServiceWorker()).toBe(true);
    expect(await page.locator("h1").textContent()).toBe(snapshot.markers.find((x: any) => x.signNumber === 33).label);
    const note = page.locator("#visit-offline");
    await note.waitFor({ state: "visible" });
    expect(await note.innerText()).toMatch(/^You are offline — showing the version saved on .+\.$/);
    await shot(page, "visit-offline-390");
    await context.setOffline(false);
    await context.close();
  });

  it("with Save-Data nothing is kept by itself, but the button keeps it", async () => {
    const context = await browser.newContext({ extraHTTPHeaders: { "Save-Data": "on" } });
    const page = await context.newPage();
    await page.addInitScript(() => Object.defineProperty(navigator, "connection", { value: { saveData: true } }));
    await page.goto(`${BASE}${EXHIBIT}`);
    const button = page.getByRole("button", { name: "Keep this exhibit for use without signal" });
    await button.waitFor();
    await page.waitForTimeout(1500);
    expect(await page.evaluate(() => caches.keys())).toEqual([]);
    await button.click();
    await page.waitForSelector("html[data-kept=yes]", { timeout: 60_000 });
    expect((await page.evaluate(() => caches.keys())).length).toBe(1);
    await context.close();
  });
});
