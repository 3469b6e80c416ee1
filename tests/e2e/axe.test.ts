// Every page of the route table, signed in as the role that uses it, at 1366 px and on a 390 px
// phone: axe-core (run inside Chromium) finds no serious or critical problem, no page scrolls
// sideways, and no drawn chart text is smaller than 11 px. Each page is photographed at both
// widths under test-results/screenshots/ (page-<who>-<page>-<width>.png).
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { axeFindings, BASE, shot } from "./helpers.ts";

const PASSWORD = "deep-time-demo";
const WIDTHS = [
  { width: 1366, height: 900 },
  { width: 390, height: 844 },
] as const;

interface Problem {
  page: string;
  width: number;
  what: string;
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(email: string | null): Promise<BrowserContext> {
  // axe is injected as a script tag; the app's Content-Security-Policy would refuse it.
  const context = await browser.newContext({ bypassCSP: true });
  if (email) {
    const page = await context.newPage();
    await page.goto(`${BASE}/login`);
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/studio/);
    await page.close();
  }
  return context;
}

/** Elements that reach past the right edge of the window (what makes a phone page scroll sideways). */
async function sideways(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const vw = document.documentElement.clientWidth;
    if (document.documentElement.scrollWidth <= vw) return [];
    const out: string[] = [`page is ${document.documentElement.scrollWidth} px wide in a ${vw} px window`];
    for (const el of Array.from(document.body.querySelectorAll("*"))) {
      const r = el.getBoundingClientRect();
      if (r.right > vw + 1 && r.width > 0) {
        // Inside a frame that scrolls by itself it is fine.
        let p = el.parentElement;
        let scrolls = false;
        while (p && p !== document.body) {
          const o = getComputedStyle(p).overflowX;
          if (o === "auto" || o === "scroll" || o === "hidden") { scrolls = true; break; }
          p = p.parentElement;
        }
        if (!scrolls) out.push(`${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ""}.${String(el.getAttribute("class") ?? "").split(" ").slice(0, 3).join(".")} right=${Math.round(r.right)}`);
      }
      if (out.length > 6) break;
    }
    return out;
  });
}

/** Drawn text (SVG) smaller than 11 px as it appears on screen. */
async function tinyChartText(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const t of Array.from(document.querySelectorAll("svg text"))) {
      const el = t as SVGTextElement;
      if (!el.textContent?.trim() || el.getBoundingClientRect().width === 0) continue;
      const ctm = el.getScreenCTM();
      const size = parseFloat(getComputedStyle(el).fontSize) * (ctm ? Math.hypot(ctm.a, ctm.b) : 1);
      if (size < 10.99) out.push(`"${el.textContent.trim().slice(0, 20)}" at ${size.toFixed(1)} px`);
      if (out.length > 4) break;
    }
    return out;
  });
}

async function check(context: BrowserContext, who: string, name: string, path: string, problems: Problem[]) {
  for (const size of WIDTHS) {
    const page = await context.newPage();
    await page.setViewportSize(size);
    const res = await page.goto(`${BASE}${path}`, { waitUntil: "networkidle", timeout: 90_000 });
    // Drawings are drawn at their frame's width once the page has hydrated.
    await page.waitForFunction(
      () => Array.from(document.querySelectorAll("svg[data-testid=scale-strip], svg[data-testid=route-plan]")).every((svg) => Math.abs(Number(svg.getAttribute("width")) - (svg.parentElement as HTMLElement).clientWidth) < 1),
      undefined,
      { timeout: 60_000 },
    );
    expect(res?.status(), `${path} answered ${res?.status()}`).toBeLessThan(400);
    await shot(page, `page-${who}-${name}-${size.width}`).catch((e: Error) => problems.push({ page: path, width: size.width, what: `screenshot: ${e.message.split("\n")[0]}` }));
    for (const what of await axeFindings(page)) problems.push({ page: path, width: size.width, what });
    for (const what of await sideways(page)) problems.push({ page: path, width: size.width, what: `sideways: ${what}` });
    for (const what of await tinyChartText(page)) problems.push({ page: path, width: size.width, what: `chart text: ${what}` });
    await page.close();
  }
}

async function firstLink(context: BrowserContext, from: string, pattern: RegExp): Promise<string> {
  const page = await context.newPage();
  await page.goto(`${BASE}${from}`);
  const hrefs = await page.locator("a[href]").evaluateAll((as) => as.map((a) => a.getAttribute("href") ?? ""));
  await page.close();
  const found = hrefs.find((h) => pattern.test(h));
  if (!found) throw new Error(`No link like ${pattern} on ${from}`);
  return found;
}

const ROLES: { who: string; email: string | null; pages: [string, string][] }[] = [
  {
    who: "visitor",
    email: null,
    pages: [
      ["home", "/"],
      ["login", "/login"],
      ["forgot-password", "/forgot-password"],
      ["editions", "/editions"],
      ["edition", "/editions/ics-2024-12"],
      ["compare", "/editions/compare?from=ics-2023-09&to=ics-2024-12"],
      ["glossary", "/glossary"],
    ],
  },
  {
    who: "designer",
    email: "designer@marrowby.example",
    pages: [
      ["composer-route", "/studio/exhibits/riverside-walk"],
      ["composer-wall", "/studio/exhibits/corridor-wall"],
      ["composer-rope", "/studio/exhibits/school-rope"],
    ],
  },
  {
    who: "designer",
    email: "designer@marrowby.example",
    pages: [
      ["studio", "/studio"],
      ["exhibits", "/studio/exhibits"],
      ["exhibit-new", "/studio/exhibits/new"],
      ["library", "/studio/library"],
      ["library-decay", "/studio/library/decay"],
      ["account", "/studio/account"],
      ["editions", "/editions"],
    ],
  },
  {
    who: "editor",
    email: "editor@marrowby.example",
    pages: [
      ["manage-editions", "/studio/editions"],
      ["import-edition", "/studio/editions/import"],
      ["library-new", "/studio/library/new"],
      ["edition", "/editions/ics-2023-09"],
      ["compare", "/editions/compare"],
    ],
  },
  {
    who: "admin",
    email: "admin@marrowby.example",
    pages: [["team", "/studio/team"]],
  },
  {
    who: "reviewer",
    email: "reviewer@marrowby.example",
    pages: [["composer-wall", "/studio/exhibits/corridor-wall"]],
  },
];

describe("every page, at 1366 px and 390 px", () => {
  for (const role of ROLES) {
    it(`${role.who} (${role.pages.map(([name]) => name).join(", ")}): axe finds nothing serious, nothing scrolls sideways, chart text ≥ 11 px`, { timeout: 600_000 }, async () => {
      const context = await signedIn(role.email);
      const pages = [...role.pages];
      if (role.who === "designer" && pages.some(([name]) => name === "library")) pages.push(["library-entry", await firstLink(context, "/studio/library", /^\/studio\/library\/\d+$/)]);
      const problems: Problem[] = [];
      for (const [name, path] of pages) await check(context, role.who, name, path, problems);
      await context.close();
      expect(problems.map((p) => `${p.page} @${p.width}: ${p.what}`)).toEqual([]);
    });
  }
});
