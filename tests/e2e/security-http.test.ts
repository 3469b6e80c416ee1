// The production build over HTTP and in Chromium: cross-origin posts refused on routes without a
// component (/logout, /studio/switch-organisation) while same-origin ones work, signed-in pages
// and their .data private and uncached, public pages cookie-free, and the stricter style policy
// (no <style> elements from elsewhere; style="" attributes allowed) with no violation on the pages.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "../../db/seeders/demo/2026.12.01T00.00.00.marrowby-team.ts";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, signIn } from "./helpers.ts";

const form = (fields: Record<string, string>) => new URLSearchParams(fields).toString();

async function signInByHttp(email: string): Promise<string> {
  const res = await fetch(`${BASE}/login`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: BASE, "X-Forwarded-For": "203.0.113.9" },
    body: form({ email, password: DEMO_PASSWORD, redirectTo: "/\t/evil.example" }),
  });
  expect(res.status).toBe(302);
  expect(res.headers.get("location")).toBe("/studio");
  return res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

describe("over HTTP", () => {
  it("a cross-origin POST to /logout or /studio/switch-organisation is refused and the session lives on; a same-origin one works", async () => {
    const cookie = await signInByHttp("designer@marrowby.example");
    const studio = () => fetch(`${BASE}/studio.data`, { headers: { Cookie: cookie }, redirect: "manual" });
    expect((await studio()).status).toBe(200);
    for (const path of ["/logout", "/studio/switch-organisation"]) {
      const evil = await fetch(`${BASE}${path}`, { method: "POST", redirect: "manual", headers: { Cookie: cookie, Origin: "https://evil.example", "Content-Type": "application/x-www-form-urlencoded" }, body: form({ organisationId: "1" }) });
      expect([path, evil.status]).toEqual([path, 403]);
    }
    expect((await studio()).status).toBe(200);
    const out = await fetch(`${BASE}/logout`, { method: "POST", redirect: "manual", headers: { Cookie: cookie, Origin: BASE } });
    expect(out.status).toBe(302);
    expect((await studio()).status).not.toBe(200);
  });

  it("signed-in pages and .data are private, no-store; public pages and JSON set no cookie and stay cacheable", async () => {
    const cookie = await signInByHttp("editor@marrowby.example");
    for (const path of ["/studio", "/studio.data", "/studio/team.data", "/studio/editions", "/editions", "/editions.data"]) {
      const res = await fetch(`${BASE}${path}`, { headers: { Cookie: cookie }, redirect: "manual" });
      expect([path, res.headers.get("cache-control")]).toEqual([path, "private, no-store"]);
    }
    for (const path of ["/", "/editions", "/api/timescales", "/editions/ics-2024-12/intervals.json"]) {
      const res = await fetch(`${BASE}${path}`, { redirect: "manual" });
      expect([path, res.status, res.headers.get("set-cookie")]).toEqual([path, 200, null]);
      expect(res.headers.get("cache-control") ?? "").not.toMatch(/no-store/);
    }
  });
});

describe("in Chromium", () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it("no Content-Security-Policy violation on studio, composer, chart and visitor pages; inline colours still apply", async () => {
    const page = await browser.newPage();
    const violations: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy/i.test(m.text())) violations.push(`${page.url()}: ${m.text()}`);
    });
    await signIn(page, "designer@marrowby.example", DEMO_PASSWORD);
    for (const path of ["/studio", "/studio/exhibits", "/studio/exhibits/riverside-walk", "/editions/ics-2024-12", "/studio/library", "/visit/marrowby/riverside-walk"]) {
      await page.goto(`${BASE}${path}`);
      await page.waitForLoadState("networkidle");
    }
    // A colour chip set by a style attribute keeps its colour.
    await page.goto(`${BASE}/editions/ics-2024-12`);
    const chip = page.locator("span[aria-hidden='true'][style*='background']").first();
    if (await chip.count()) expect(await chip.evaluate((el) => getComputedStyle(el).backgroundColor)).not.toBe("rgba(0, 0, 0, 0)");
    expect(violations).toEqual([]);
    // An injected <style> element from the page itself is refused.
    const applied = await page.evaluate(() => {
      const s = document.createElement("style");
      s.textContent = "body { outline: 7px solid rgb(1, 2, 3) }";
      document.head.append(s);
      return getComputedStyle(document.body).outlineWidth;
    });
    expect(applied).not.toBe("7px");
    await page.close();
  });
});
