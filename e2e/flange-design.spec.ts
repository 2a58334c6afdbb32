import { expect, test, type Page } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

const DESIGNER = "dana.designer@kestrel-ridge.example";

async function createRectangularCover(page: Page, name: string): Promise<void> {
  await page.goto("/designs/new");
  await page.getByLabel(/Rectangular cover/).check();
  await page.getByLabel("Name", { exact: true }).fill(name);
  await page.getByLabel("Equipment tag").fill("E-2108");
  await page.getByRole("button", { name: "Create design" }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  await page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
}

const expectSaved = (page: Page) =>
  expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });

test("a cover gets its UG-34 thickness once the sketch and material are chosen; an entered bolt allowable adds the seating case", async ({
  page,
}) => {
  await signIn(page, DESIGNER);
  await createRectangularCover(page, `Flange e2e cover ${Date.now()}`);
  const flange = page.getByTestId("flange-summary");
  await expect(flange).toContainText("Cover attachment sketch (C factor) not chosen");
  await expect(flange).toContainText("code-specific");

  const form = page.getByRole("group", { name: "Flange and cover" });
  await form.getByLabel("Cover attachment (UG-34 sketch, C)").selectOption("ug34-j");
  await form.getByLabel("Cover material").selectOption("sa-516-70");
  await expect(flange).toContainText(/UG-34 non-circular cover: t required \/ actual/);
  await expect(flange).toContainText(/C 0\.3 — ASME VIII-1 UG-34\(d\)\(2\), sketch \(j\)/);
  // The template's ISO 898-1 bolting has no ASME allowable: seating is not computed until one is entered.
  await expect(flange).toContainText(/seating —\)/);
  await form.getByLabel("Allowable bolt stress, entered (0: none) (MPa)").fill("200");
  await form.getByLabel("Allowable bolt stress, entered (0: none) (MPa)").press("Tab");
  await form.getByLabel("Source of the bolt allowable").fill("owner's bolting spec KR-B12");
  await form.getByLabel("Source of the bolt allowable").press("Tab");
  await expect(flange).toContainText(/seating \d+(\.\d+)? mm\)/);

  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expectSaved(page);
  await page.reload();
  await expect(page.getByTestId("flange-summary")).toContainText(/seating \d+(\.\d+)? mm\)/);
  await expect(
    page.getByRole("group", { name: "Flange and cover" }).getByLabel("Cover material"),
  ).toHaveValue("sa-516-70");
});
