import { expect, type Browser, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "halden-creek-2026";

/** Signs in through the real form and waits for the desk (or the ?next= page). */
export async function signIn(
  page: Page,
  email: string,
  password = DEMO_PASSWORD,
  next?: string,
): Promise<void> {
  await page.goto(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(next ? new RegExp(next.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")) : /\/desk$/);
}

/** Signs out through the account menu. */
export async function signOut(page: Page): Promise<void> {
  await page.getByLabel("Account menu").click();
  await page.getByRole("button", { name: "Sign out", exact: true }).click();
  await expect(page).toHaveURL(/\/sign-in/);
}

/** A page in a fresh browser context (cookies of its own), signed in as `email`. */
export async function signedInPage(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email);
  return page;
}
