import { expect, test } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

test("the landing page renders with the product's job and the cautions", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Seat the gasket everywhere");
  await expect(page.getByRole("complementary", { name: "Cautions" })).toContainText("governing code");
  await expect(page.getByRole("link", { name: "Sign in", exact: true })).toBeVisible();
  await expect(page.locator("body")).not.toContainText("TODO");
});

test("/api/health is green with the database migrated", async ({ request }) => {
  const response = await request.get("/api/health");
  expect(response.status()).toBe(200);
  expect(await response.json()).toMatchObject({ ok: true });
});

test("an unknown address or design shows Sealpitch's own not-found page with a way back", async ({
  page,
}) => {
  const response = await page.goto("/no-such-page");
  expect(response?.status()).toBe(404);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Nothing at this address");
  await expect(page.getByRole("link", { name: "Back to your desk" })).toHaveAttribute("href", "/desk");
  await expect(page.locator("body")).not.toContainText("This page could not be found"); // Next's default
  await signIn(page, "dana.designer@kestrel-ridge.example");
  await page.goto("/designs/00000000-0000-4000-8000-000000000000");
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Nothing at this address");
  await page.getByRole("link", { name: "Back to your desk" }).click();
  await expect(page).toHaveURL(/\/desk$/);
});
