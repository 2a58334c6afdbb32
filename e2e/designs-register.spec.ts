import { expect, test } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

// The Joint register as the demo designer: the seeded examples, search, a filter, and a new
// rectangular cover from its template, landing in the editor.
const DESIGNER = "dana.designer@kestrel-ridge.example";
const EXAMPLES = [
  "V-3304 obround manway M1",
  "E-2107 inlet nozzle N1, NPS 6 Class 150 RF",
  "E-2107 channel cover inspection hatch",
];

test("the register lists the demo designs, searches and filters them", async ({ page }) => {
  await signIn(page, DESIGNER);
  await page.goto("/designs");
  await expect(page.getByRole("heading", { level: 1, name: "Joint register" })).toBeVisible();
  const table = page.getByRole("table", { name: "Joint register" });
  for (const name of EXAMPLES) await expect(table.getByRole("link", { name, exact: true })).toBeVisible();
  await expect(table.getByText("Draft").first()).toBeVisible();

  await page.getByRole("searchbox", { name: "Search" }).fill("V-3304");
  await page.getByRole("button", { name: "Apply" }).click();
  await expect(page).toHaveURL(/q=V-3304/);
  await expect(table.getByRole("link", { name: EXAMPLES[0], exact: true })).toBeVisible();
  await expect(table.getByRole("link", { name: EXAMPLES[2], exact: true })).toHaveCount(0);

  await page.goto("/designs");
  await page.getByLabel("Outline").selectOption({ label: "Rectangular" });
  await page.getByRole("button", { name: "Apply" }).click();
  await expect(page).toHaveURL(/outline=rectangle/);
  await expect(table.getByRole("link", { name: EXAMPLES[2], exact: true })).toBeVisible();
  await expect(table.getByRole("link", { name: EXAMPLES[0], exact: true })).toHaveCount(0);

  await page.getByRole("link", { name: /^Name/ }).click();
  await expect(page).toHaveURL(/sort=name/);
});

test("a rectangular cover from the template: a bad field is named, then it lands on its editor page", async ({
  page,
}) => {
  await signIn(page, DESIGNER);
  await page.goto("/designs/new");
  await page.getByLabel("Rectangular cover").check();
  const name = `E2E hatch ${Date.now()}`;
  await page.getByLabel("Name", { exact: true }).fill(name);
  await page.getByLabel("Equipment tag").fill("E-2107");
  await page.getByLabel("Width (mm)", { exact: true }).fill("-600");
  await page.getByRole("button", { name: "Create design" }).click();
  await expect(page.getByText("Width must be greater than zero")).toBeVisible();
  await expect(page.getByLabel("Name", { exact: true })).toHaveValue(name);
  await page.getByLabel("Width (mm)", { exact: true }).fill("600");
  await page.getByRole("button", { name: "Create design" }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);

  await page.goto(`/designs?q=${encodeURIComponent(name)}`);
  await expect(
    page.getByRole("table", { name: "Joint register" }).getByRole("link", { name, exact: true }),
  ).toBeVisible();
});
