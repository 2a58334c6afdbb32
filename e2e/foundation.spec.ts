import { expect, test } from "./helpers/test";

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
