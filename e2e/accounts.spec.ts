import { expect, test } from "@playwright/test";
import { signIn, signOut } from "./helpers/sign-in";

const DEMO = [
  { email: "dana.designer@kestrel-ridge.example", name: "Dana", roles: "Designer", admin: false },
  { email: "arlo.approver@kestrel-ridge.example", name: "Arlo", roles: "Approver", admin: false },
  { email: "ines.admin@kestrel-ridge.example", name: "Ines", roles: "Designer, Administrator", admin: true },
  { email: "piet.lead@kestrel-ridge.example", name: "Piet", roles: "Designer, Approver", admin: false },
];

test.describe("demo sign-ins", () => {
  for (const user of DEMO) {
    test(`${user.email} lands on the desk with their roles`, async ({ page }) => {
      await signIn(page, user.email);
      await expect(page.getByRole("heading", { level: 1 })).toContainText(`Good to see you, ${user.name}`);
      await expect(page.getByTestId("desk-roles")).toHaveText(user.roles);
      await expect(page.getByText("Kestrel Ridge Process Works").first()).toBeVisible();
      const nav = page.getByRole("navigation", { name: "Workspace" });
      await expect(nav.getByRole("link", { name: "Joint register" })).toBeVisible();
      await expect(nav.getByRole("link", { name: "Crew" })).toHaveCount(user.admin ? 1 : 0);
      await signOut(page);
      await page.goto("/desk");
      await expect(page).toHaveURL(/\/sign-in\?next=%2Fdesk/);
    });
  }
});

test("a signed-out visit keeps ?next= and returns there after sign-in", async ({ page }) => {
  await page.goto("/desk");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fdesk/);
  await page.getByLabel("E-mail").fill("dana.designer@kestrel-ridge.example");
  await page.getByLabel("Password").fill("halden-creek-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/desk$/);
  await page.goto("/");
  await expect(page.getByRole("link", { name: "Open your desk" })).toBeVisible();
});

test("a designer gets the 403 page on the admin screen", async ({ page }) => {
  await signIn(page, "dana.designer@kestrel-ridge.example");
  const response = await page.goto("/team");
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Your role does not open this page");
});
