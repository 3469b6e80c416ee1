// Browser test of review and publication on a fresh exhibit: a designer builds a rope and the
// curator (designer and reviewer) edits it; the designer submits; the reviewer comments on a marker
// and requests changes; the designer resolves the comment, changes the exhibit and submits again;
// the curator is refused approval by the four-eyes rule (on the page and over a plain form post);
// the reviewer approves; the designer publishes; the public JSON shows the publication with its
// hash in the ETag. Screenshots at 1366 and 390 px of the status bar, review, history and compare.
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, shot, signIn } from "./helpers.ts";

const PASSWORD = "deep-time-demo";
const SLUG = `review-rope-${Date.now().toString(36)}`;
const TITLE = `Review rope ${SLUG.slice(-6)}`;
const WIDTHS = [1366, 390] as const;

let browser: Browser;
const contexts: BrowserContext[] = [];
const errors: string[] = [];

async function person(email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1366, height: 1000 } });
  contexts.push(context);
  const page = await context.newPage();
  page.on("pageerror", (e) => errors.push(`${email}: ${e.message}`));
  await signIn(page, email, PASSWORD);
  return page;
}

/** Full-page screenshots at both widths (the page reloaded at each), then back to desktop. */
async function shots(page: Page, name: string) {
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
    await page.reload();
    await shot(page, `review-${name}-${width}`);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow, `${name} at ${width} px scrolls sideways`).toBeLessThanOrEqual(0);
  }
  await page.setViewportSize({ width: 1366, height: 1000 });
}

/** The composer's status bar alone, at both widths. */
async function statusBarShots(page: Page, name: string) {
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: width === 390 ? 844 : 1000 });
    await page.reload();
    const bar = page.locator("section[aria-labelledby=lifecycle-heading]");
    await bar.scrollIntoViewIfNeeded();
    await bar.screenshot({ path: `test-results/screenshots/review-status-${name}-${width}.png` });
    const box = (await bar.boundingBox())!;
    expect(box.x + box.width, `status bar at ${width} px`).toBeLessThanOrEqual(width);
  }
  await page.setViewportSize({ width: 1366, height: 1000 });
}

const status = (page: Page) => page.getByTestId("exhibit-status").textContent();

/** Presses a lifecycle button and waits for the status; a refusal's words fail the test. */
async function moveOn(page: Page, button: string, want: string) {
  await page.getByRole("button", { name: button }).click();
  await expect
    .poll(async () => {
      const alert = page.locator("[role=alert]").first();
      return (await alert.isVisible()) ? `refused: ${await alert.textContent()}` : status(page);
    }, { timeout: 15_000 })
    .toBe(want);
}

const POLL = { timeout: 15_000 };

/** The composer's custom-age form: the quarry marker (330 Ma) with the given source. */
async function addQuarryAge(page: Page, source: string) {
  const form = page.locator("form").filter({ has: page.getByRole("button", { name: "Add the age" }) });
  await form.locator("input[name=label]").fill("Marrow quarry limestone");
  await form.locator("input[name=ageValue]").fill("330");
  await form.locator("select[name=ageUnit]").selectOption("Ma");
  await form.locator("input[name=source]").fill(source);
  await form.getByRole("button", { name: "Add the age" }).click();
  await page.getByText("Added “Marrow quarry limestone”.").waitFor();
}

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  for (const c of contexts) await c.close();
  await browser?.close();
});

describe("review and publication in the browser", () => {
  // Three people and a dozen page loads at two widths: longer than the project default on a shared machine.
  it("submit, comment on a marker, request changes, resolve and resubmit, four-eyes refusal, approve, publish, public JSON", { timeout: 300_000 }, async () => {
    const designer = await person("designer@marrowby.example");
    const reviewer = await person("reviewer@marrowby.example");
    const curator = await person("curator@marrowby.example");
    const exhibitUrl = `${BASE}/studio/exhibits/${SLUG}`;
    const reviewUrl = `${exhibitUrl}/review`;

    // The designer makes a 54.1 m rope over the last 541 million years with every period base.
    await designer.goto(`${BASE}/studio/exhibits/new`);
    await designer.getByLabel("Title").fill(TITLE);
    await designer.getByLabel("Web address (slug)").fill(SLUG);
    await designer.getByLabel("Older end").fill("541");
    await designer.getByLabel("A straight length (wall, rope, banner)").check();
    await designer.locator("#mediumType").selectOption("rope");
    await designer.getByLabel("Length", { exact: true }).fill("54.1");
    await designer.getByRole("button", { name: "Create the exhibit" }).click();
    await Promise.race([
      designer.waitForURL(exhibitUrl),
      designer.locator("[role=alert]").first().waitFor().then(async () => expect.unreachable(`not created: ${await designer.locator("[role=alert]").first().textContent()}`)),
    ]);
    await designer.getByLabel("All of a rank").selectOption("period");
    await designer.getByRole("button", { name: "Add all" }).click();
    await designer.getByText(/^Added \d+ boundaries\.$/).waitFor();
    expect(await status(designer)).toBe("Draft");

    // The curator (designer and reviewer) adds a custom age: now one of the editors.
    await curator.goto(exhibitUrl);
    await addQuarryAge(curator, "Marrowby Museum field notes, quarry survey 2019 (invented demo source)");

    // The designer submits it for review.
    await designer.reload();
    await statusBarShots(designer, "draft");
    await moveOn(designer, "Submit for review", "In review");
    await statusBarShots(designer, "in-review");

    // The reviewer comments on one marker and requests changes (a comment is required).
    await reviewer.goto(reviewUrl);
    expect(await reviewer.getByTestId("review-status").textContent()).toBe("In review");
    await reviewer.getByTestId("check-summary").waitFor();
    const aboutOptions = await reviewer.locator("#comment-marker option").allTextContents();
    const quarry = aboutOptions.find((o) => o.includes("Marrow quarry limestone"))!;
    expect(quarry).toBeTruthy();
    await reviewer.locator("#comment-marker").selectOption({ label: quarry });
    await reviewer.locator("#comment-body").fill("Please give the page number of the field notes for the quarry age.");
    await reviewer.getByRole("button", { name: "Add comment" }).click();
    const comment = reviewer.getByTestId("comment").filter({ hasText: "Please give the page number" });
    await comment.waitFor();
    expect(await comment.textContent()).toContain("on marker “Marrow quarry limestone”");
    await reviewer.getByRole("button", { name: "Request changes" }).click();
    await reviewer.locator("#changes-error").waitFor();
    expect(await reviewer.locator("#changes-error").textContent()).toBe("Say what needs to change: a comment is required when asking for changes.");
    await reviewer.locator("#changes-comment").fill("The quarry marker needs a fuller source.");
    await reviewer.getByRole("button", { name: "Request changes" }).click();
    await expect.poll(() => reviewer.getByTestId("review-status").textContent(), POLL).toBe("Changes requested");
    await shots(reviewer, "page-changes-requested");

    // The designer resolves the comment, fixes the source and submits again.
    await designer.goto(reviewUrl);
    await designer.getByTestId("comment").filter({ hasText: "Please give the page number" }).getByRole("button", { name: "Mark resolved" }).click();
    await designer.getByTestId("comment").filter({ hasText: "Please give the page number" }).filter({ hasText: "Resolved" }).waitFor();
    await designer.goto(exhibitUrl);
    expect(await status(designer)).toBe("Changes requested");
    const row = designer.locator("tr[id^=marker-]").filter({ hasText: "Marrow quarry limestone" });
    await row.getByText("Edit", { exact: true }).click();
    await row.getByRole("button", { name: "Remove" }).click();
    await designer.getByText("Removed “Marrow quarry limestone”.").waitFor();
    await addQuarryAge(designer, "Marrowby Museum field notes, quarry survey 2019, p. 14 (invented demo source)");
    await moveOn(designer, "Submit for review", "In review");

    // The curator edited this exhibit: refused by the four-eyes rule, on the page and over a plain post.
    await curator.goto(reviewUrl);
    const approveButton = curator.getByRole("button", { name: /^Approve revision \d+$/ });
    expect(await approveButton.isDisabled()).toBe(true);
    await curator.getByText(/^Four-eyes rule: you edited this exhibit since its last publication/).waitFor();
    await shots(curator, "page-four-eyes");
    const revision = (await approveButton.textContent())!.replace(/\D+/g, "");
    const refused = await curator.request.post(reviewUrl, { form: { intent: "approve", revision, comment: "" } });
    expect(refused.status()).toBe(403);
    expect(await refused.text()).toContain("Four-eyes rule: you edited this exhibit since its last publication, so a reviewer who did not edit it must approve it.");

    // The reviewer (who edited nothing) approves.
    await reviewer.goto(reviewUrl);
    await reviewer.getByRole("button", { name: `Approve revision ${revision}` }).click();
    await expect.poll(() => reviewer.getByTestId("review-status").textContent(), POLL).toBe("Approved");
    await shots(reviewer, "page-approved");

    // The designer publishes.
    await designer.goto(exhibitUrl);
    await statusBarShots(designer, "approved");
    await moveOn(designer, `Publish revision ${revision}`, "Published");
    await designer.getByText(/^Visitors see publication 1 \(revision \d+,/).waitFor();
    await statusBarShots(designer, "published");

    // History and compare (the first revision against the published one).
    await designer.goto(`${exhibitUrl}/revisions`);
    await designer.getByText("publication 1").waitFor();
    await shots(designer, "history");
    await designer.goto(`${exhibitUrl}/revisions/compare?from=2&to=published`);
    await designer.getByTestId("diff-added").waitFor();
    await shots(designer, "compare");

    // The public JSON, signed out: publication 1 with its hash in the ETag.
    const res = await fetch(`${BASE}/api/exhibits/marrowby/${SLUG}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { publication: { number: number; hash: string; approvedBy: string }; snapshot: { exhibit: { title: string; revision: number }; markers: { label: string; source: string; signNumber: number }[] } };
    expect(body.publication.number).toBe(1);
    expect(body.publication.approvedBy).toBe("Rhona Basalt");
    expect(res.headers.get("ETag")).toBe(`"${body.publication.hash}"`);
    expect(body.snapshot.exhibit).toMatchObject({ title: TITLE, revision: Number(revision) });
    expect(body.snapshot.markers.find((m) => m.label === "Marrow quarry limestone")!.source).toMatch(/p\. 14/);
    expect(body.snapshot.markers.map((m) => m.signNumber)).toEqual(body.snapshot.markers.map((_, i) => i + 1));
    expect(errors).toEqual([]);
  });
});
