// Shared steps for browser tests: the app under test, screenshots, signing in.
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";
import { E2E_PORT } from "../setup/test-env.ts";

export const BASE = `http://127.0.0.1:${E2E_PORT}`;
export const SHOTS = path.resolve("test-results/screenshots");
mkdirSync(SHOTS, { recursive: true });

export async function shot(page: Page, name: string) {
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`), fullPage: true });
}

export async function signIn(page: Page, email: string, password: string) {
  await page.goto(`${BASE}/login`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/studio/);
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: "Sign out" }).click();
  await page.waitForURL(`${BASE}/`);
}
