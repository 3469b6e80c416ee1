// Browser test: an admin invites a reviewer; the e-mail reaches the local SMTP server; the link
// is opened, a password chosen; the new reviewer signs in and sees the studio.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { waitForMessage } from "../../fakes/inbox.ts";
import { launchBrowser } from "../setup/chromium.ts";
import { BASE, shot, signIn, signOut } from "./helpers.ts";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("inviting a reviewer", () => {
  it("goes from the admin's team page to the new reviewer's studio", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    page.on("console", (m) => m.type() === "error" && errors.push(m.text()));

    await page.goto(`${BASE}/studio`);
    await page.waitForURL(/\/login\?redirectTo=%2Fstudio/);
    await shot(page, "invite-01-login");

    await signIn(page, "admin@marrowby.example", "deep-time-demo");
    await page.getByRole("heading", { name: /Good to see you, Ada/ }).waitFor();
    await shot(page, "invite-02-admin-studio");

    await page.getByRole("navigation", { name: "Studio" }).getByRole("link", { name: "Team" }).click();
    await page.waitForURL(`${BASE}/studio/team`);
    const email = `new.reviewer+${Date.now()}@marrowby.example`;
    // A malformed address first: the field says why, nothing is sent.
    await page.getByLabel("E-mail address").fill("not an address");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText("Enter an e-mail address, like name@example.org.").waitFor();
    await shot(page, "invite-03-bad-address");

    await page.getByLabel("E-mail address").fill(email);
    // Roles are a set (checkboxes); the invitation form starts with Designer ticked.
    const inviteForm = page.locator("form", { has: page.getByRole("button", { name: "Send invitation" }) });
    await inviteForm.getByLabel("Designer", { exact: true }).uncheck();
    await inviteForm.getByLabel("Reviewer", { exact: true }).check();
    await page.getByRole("button", { name: "Send invitation" }).click();
    await page.getByText(`Invitation sent to ${email} as reviewer.`).waitFor();
    await page.getByText(email, { exact: false }).first().waitFor();
    await shot(page, "invite-04-sent");
    await signOut(page);

    const mail = await waitForMessage({ to: email, subjectIncludes: "invited", timeoutMs: 30_000 });
    expect(mail.subject).toBe("You're invited to Marrowby Museum of the Earth on Eonscale");
    const link = mail.text.match(/https?:\/\/\S+\/invite\/\S+/)?.[0];
    expect(link).toBeTruthy();

    await page.goto(link!);
    await page.getByRole("heading", { name: "Join Marrowby Museum of the Earth" }).waitFor();
    await shot(page, "invite-05-accept");
    await page.getByLabel("Your name").fill("Morag Flint");
    await page.getByLabel("Choose a password").fill("strata-and-stars");
    await page.getByLabel("Repeat the password").fill("strata-and-stars");
    await page.getByRole("button", { name: "Accept and join" }).click();
    await page.waitForURL(/\/studio\?welcome=1/);
    await page.getByText("You have joined as reviewer.").waitFor();
    await shot(page, "invite-06-joined");
    await signOut(page);

    // The link is spent.
    await page.goto(link!);
    await page.getByText("This invitation has already been used.", { exact: false }).waitFor();
    await shot(page, "invite-07-link-spent");

    await signIn(page, email, "strata-and-stars");
    await page.getByRole("heading", { name: "Good to see you, Morag" }).waitFor();
    expect(await page.getByText("Reviewer —", { exact: false }).count()).toBeGreaterThan(0);
    // A reviewer has no team page.
    expect(await page.getByRole("navigation", { name: "Studio" }).getByRole("link", { name: "Team" }).count()).toBe(0);
    const res = await page.goto(`${BASE}/studio/team`);
    expect(res?.status()).toBe(403);
    await shot(page, "invite-08-reviewer-403");
    // The deliberate bad address (400) and the reviewer on the team page (403) are the only errors expected.
    expect(errors.filter((e) => !/status of (400|403)/.test(e))).toEqual([]);
  });

  it("each demo role can sign in and open the studio", async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    for (const role of ["admin", "designer", "reviewer", "editor"]) {
      await signIn(page, `${role}@marrowby.example`, "deep-time-demo");
      await page.getByRole("heading", { name: /Good to see you/ }).waitFor();
      await shot(page, `roles-${role}-mobile`);
      await signOut(page);
    }
  });
});
