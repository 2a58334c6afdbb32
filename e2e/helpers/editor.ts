import { expect, type Page } from "@playwright/test";

/** Creates a rectangular cover from the template form and waits for the editor's drawing. */
export async function createRectangularCover(page: Page, name: string): Promise<string> {
  await page.goto("/designs/new");
  await page.getByLabel(/Rectangular cover/).check();
  await page.getByLabel("Name", { exact: true }).fill(name);
  await page.getByLabel("Equipment tag").fill("E-2107");
  await page.getByRole("button", { name: "Create design" }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  await waitForDrawing(page);
  return page.url();
}

export async function waitForDrawing(page: Page): Promise<void> {
  await page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
}

export const boltIds = (page: Page) => page.evaluate(() => window.__sealpitchStage!.ids("bolt-"));
export const violationIds = (page: Page, prefix = "violation-") => page.evaluate((p) => window.__sealpitchStage!.ids(p), prefix);
export const boltPoint = (page: Page, id: string) => page.evaluate((b) => window.__sealpitchStage!.boltClientPoint(b), id);

export async function expectSaved(page: Page): Promise<void> {
  await expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });
}
