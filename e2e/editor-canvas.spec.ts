import { expect, test, type Page } from "./helpers/test";
import { signIn } from "./helpers/sign-in";
import { analyzeJoint, type JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";

const DESIGNER = "dana.designer@kestrel-ridge.example";

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
export const violationIds = (page: Page, prefix = "violation-") =>
  page.evaluate((p) => window.__sealpitchStage!.ids(p), prefix);
export const boltPoint = (page: Page, id: string) =>
  page.evaluate((b) => window.__sealpitchStage!.boltClientPoint(b), id);

/** Resolves after the browser has drawn the next frame (the drag loop renders once per frame). */
const nextFrame = (page: Page) =>
  page.evaluate(
    () => new Promise<void>((done) => requestAnimationFrame(() => requestAnimationFrame(() => done()))),
  );

/** Resolves when a server action's response has arrived (Next marks them with a Next-Action header). */
const serverActionDone = (page: Page) =>
  page.waitForResponse((r) => r.request().method() === "POST" && !!r.request().headers()["next-action"]);

export async function expectSaved(page: Page): Promise<void> {
  await expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });
}

test("lay out 16 bolts, break a spacing rule by dragging, undo, save, reload, switch units", async ({
  page,
}) => {
  await signIn(page, DESIGNER);
  const url = await createRectangularCover(page, `Editor e2e cover ${Date.now()}`);

  await page.getByLabel("Bolts to place").fill("16");
  await page.getByRole("button", { name: "Place equally" }).click();
  await expect.poll(async () => (await boltIds(page)).length).toBe(16);
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expectSaved(page);
  const savedVersion = await page.getByTestId("design-version").textContent();
  await expect(page.getByTestId("readout-basis")).toHaveText("stored result");
  // The browser's core reproduced the stored server result exactly.
  await expect.poll(() => page.evaluate(() => window.__sealpitchAgreement?.at(-1)?.agree)).toBe(true);

  const before = (await boltPoint(page, "b1"))!;
  const b2 = (await boltPoint(page, "b2"))!;
  expect(await violationIds(page, "violation-spacing-min-pitch-b1-b2")).toEqual([]);

  // Drag b1 toward b2 along the path until the wrench-clearance spacing check fails.
  await page.mouse.move(before.x, before.y);
  await page.mouse.down();
  let failed = false;
  for (let f = 0.05; f <= 0.75 && !failed; f += 0.05) {
    await page.mouse.move(before.x + (b2.x - before.x) * f, before.y + (b2.y - before.y) * f, { steps: 3 });
    await nextFrame(page);
    failed = (await violationIds(page, "violation-spacing-min-pitch-b1-b2")).length > 0;
  }
  // While the bolt is held the drawing and the drag gauge follow the core's light preview; the
  // Readout keeps what it showed at the drag start and catches up on release.
  await expect(page.getByTestId("readout-basis")).toHaveText(/held while you drag/);
  await expect(page.getByRole("status", { name: "Drag gauge" })).toContainText(/spacing: \d+ pairs? fail/);
  await page.mouse.up();
  expect(failed).toBe(true);
  await expect(page.getByRole("status", { name: "Drag gauge" })).toHaveCount(0);
  // On release the full analysis runs in the core worker; what the desk then shows is exactly
  // analyzeJoint of the dropped layout (the same core; compared as JSON, every double's digits).
  await expect.poll(() => page.evaluate(() => window.__sealpitchReleased?.result != null)).toBe(true);
  const released = JSON.parse(await page.evaluate(() => JSON.stringify(window.__sealpitchReleased))) as {
    document: JointDesign;
    result: JointAnalysis;
  };
  // The dropped layout's, not the stored one's: b1 sits too close to b2 there.
  expect(released.result.checks.find((c) => c.id === "spacing.min-pitch:b1-b2")?.status).toBe("fail");
  expect(JSON.stringify(released.result)).toBe(JSON.stringify(analyzeJoint(released.document)));
  await expect(page.getByTestId("save-state")).toHaveText("Unsaved changes");
  // The Readout groups checks by rule: one row for the minimum-spacing rule, failing, whose
  // pairs are listed on expand; picking the rule highlights its failing pair on the drawing.
  const row = page.getByRole("list", { name: "Checks by rule" }).locator('li[data-rule="spacing.min-pitch"]');
  await expect(row).toHaveCount(1);
  await expect(row).toHaveAttribute("data-status", "fail");
  await row.getByRole("button", { name: /^Show the \d+ pairs$/ }).click();
  await expect(row.locator('[data-check-id="spacing.min-pitch:b1-b2"]')).toHaveAttribute(
    "data-status",
    "fail",
  );
  await expect(row).not.toContainText("spacing.min-pitch");
  await row.getByRole("button", { name: /Minimum bolt spacing/ }).click();
  await expect
    .poll(() => violationIds(page, "highlight-"))
    .toEqual(expect.arrayContaining(["highlight-b1", "highlight-b2"]));

  // One drag is one history entry: a single undo puts b1 back.
  await page.keyboard.press("Control+z");
  await expect.poll(async () => (await boltPoint(page, "b1"))!.x).toBeCloseTo(before.x, 0);
  await expect.poll(() => violationIds(page, "violation-spacing-min-pitch-b1-b2")).toEqual([]);
  await expect(page.getByTestId("save-state")).toHaveText("Saved");

  // Turn the pattern a little so there is something to save, save, and reload.
  await page.getByLabel("Turn pattern by degrees").fill("3");
  await page.getByRole("button", { name: "Turn pattern clockwise" }).click();
  // Client coordinates depend on the scroll position (clicking a control may scroll the page):
  // compare the bolt before and after the reload from the top of the page.
  await page.evaluate(() => window.scrollTo(0, 0));
  const turned = (await boltPoint(page, "b1"))!;
  expect(Math.abs(turned.x - before.x) + Math.abs(turned.y - before.y)).toBeGreaterThan(2);
  await page.keyboard.press("Control+s");
  await expectSaved(page);
  await expect(page.getByTestId("design-version")).not.toHaveText(savedVersion!);
  await page.goto(url);
  await waitForDrawing(page);
  expect((await boltIds(page)).length).toBe(16);
  await page.evaluate(() => window.scrollTo(0, 0));
  const reloaded = (await boltPoint(page, "b1"))!;
  expect(reloaded.x).toBeCloseTo(turned.x, 0);
  expect(reloaded.y).toBeCloseTo(turned.y, 0);
  await expect.poll(() => page.evaluate(() => window.__sealpitchAgreement?.at(-1)?.agree)).toBe(true);

  // Units: every field converts; the choice is remembered for the user.
  const lengthMm = Number(await page.getByLabel("Bolt length (mm)").inputValue());
  await page.getByRole("radio", { name: /US/ }).click();
  const lengthIn = Number(await page.getByLabel("Bolt length (in)").inputValue());
  expect(lengthIn).toBeCloseTo(lengthMm / 25.4, 3);
  await expect(page.getByLabel(/Design pressure \(psi\)/)).toBeVisible();
  await expect(page.getByRole("table", { name: "Bolts" })).toContainText(" in");
  await page.reload();
  await waitForDrawing(page);
  await expect(page.getByLabel("Bolt length (in)")).toBeVisible();
  const remembered = serverActionDone(page);
  await page.getByRole("radio", { name: /SI/ }).click();
  await expect(page.getByLabel("Bolt length (mm)")).toBeVisible();
  await remembered;
});

test("bad input is refused at the field and nothing is saved", async ({ page }) => {
  await signIn(page, DESIGNER);
  const url = await createRectangularCover(page, `Editor e2e bad input ${Date.now()}`);
  await expectSaved(page);
  const version = await page.getByTestId("design-version").textContent();
  const length = page.getByLabel("Bolt length (mm)");
  const original = await length.inputValue();
  const cases: [string, RegExp][] = [
    ["", /Bolt length is required/],
    ["-5", /Bolt length must be at least 1 mm/],
    ["1e9", /Bolt length must be at most/],
    ["twelve", /Bolt length must be a number/],
  ];
  for (const [value, message] of cases) {
    await length.fill(value);
    await length.press("Tab");
    const describedBy = await length.getAttribute("aria-describedby");
    expect(describedBy).toBeTruthy();
    await expect(page.locator(`#${describedBy}`)).toHaveText(message);
    await expect(length).toHaveAttribute("aria-invalid", "true");
  }
  const pressure = page.getByLabel("Design pressure (MPa)");
  await pressure.fill("-1");
  await pressure.press("Tab");
  await expect(page.locator(`#${await pressure.getAttribute("aria-describedby")}`)).toHaveText(
    /at least 0 MPa/,
  );
  const count = page.getByLabel("Bolt count");
  await count.fill("10000");
  await count.press("Tab");
  await expect(page.locator(`#${await count.getAttribute("aria-describedby")}`)).toHaveText(/at most 512/);
  // Refused field values are never saved: the version stays, and a reload shows the stored values.
  await expect(page.getByTestId("save-state")).toHaveText("Saved");
  await expect(page.getByTestId("design-version")).toHaveText(version!);
  await page.goto(url);
  await waitForDrawing(page);
  await expect(page.getByLabel("Bolt length (mm)")).toHaveValue(original);
  expect((await boltIds(page)).length).toBe(16);
});

test("two sessions edit one design: the second save is refused and its edits stay on screen", async ({
  browser,
}) => {
  const a = await browser.newContext();
  const b = await browser.newContext();
  // B's page runs on Playwright's clock (time flows as usual) so the test can jump past the
  // autosave pause instead of sleeping through it.
  await b.clock.install();
  const pa = await a.newPage();
  const pb = await b.newPage();
  await signIn(pa, DESIGNER);
  const url = await createRectangularCover(pa, `Editor e2e concurrency ${Date.now()}`);
  await signIn(pb, DESIGNER);
  await pb.goto(url);
  await waitForDrawing(pb);

  await pa.getByLabel("Design pressure (MPa)").fill("2.5");
  await pa.getByLabel("Design pressure (MPa)").press("Tab");
  await pa.getByRole("button", { name: "Save", exact: true }).click();
  await expectSaved(pa);

  const temp = pb.getByLabel("Design temperature (°C)");
  await temp.fill("333");
  await temp.press("Tab");
  await pb.getByRole("button", { name: "Save", exact: true }).click();
  await expect(pb.getByTestId("save-state")).toHaveText("Conflict", { timeout: 15_000 });
  await expect(
    pb
      .getByRole("alert")
      .filter({ hasText: /changed|version/i })
      .first(),
  ).toBeVisible();
  await expect(pb.getByRole("button", { name: "Reload theirs" })).toBeVisible();
  await expect(temp).toHaveValue("333");
  // Autosave does not retry into the conflict, and the local edit is still there.
  await pb.clock.fastForward(5_000); // past the 2 s autosave pause
  await expect(pb.getByTestId("save-state")).toHaveText("Conflict");
  await expect(temp).toHaveValue("333");

  // The stored design has A's edit, not B's.
  await pa.reload();
  await waitForDrawing(pa);
  await expect(pa.getByLabel("Design pressure (MPa)")).toHaveValue("2.5");
  await expect(pa.getByLabel("Design temperature (°C)")).not.toHaveValue("333");

  // Reload theirs (confirmed) discards B's local edit and shows A's.
  pb.once("dialog", (d) => void d.accept());
  await pb.getByRole("button", { name: "Reload theirs" }).click();
  await waitForDrawing(pb);
  await expect(pb.getByLabel("Design pressure (MPa)")).toHaveValue("2.5");
  await a.close();
  await b.close();
});
