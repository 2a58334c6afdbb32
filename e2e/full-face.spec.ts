import { expect, test, type Page } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

const DESIGNER = "dana.designer@kestrel-ridge.example";

const waitForDrawing = (page: Page) =>
  page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
const expectSaved = (page: Page) =>
  expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });

test("a full-face gasket from the new-design template, and the ring/full-face switch in the editor", async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signIn(page, DESIGNER);
  await page.goto("/designs/new");
  await page.getByLabel(/Full-face round flange/).check();
  await page.getByLabel("Name", { exact: true }).fill(`Full-face e2e ${Date.now()}`);
  await page.getByRole("button", { name: "Create design" }).click();
  await expect(page).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  const designId = page.url().split("/").at(-1)!;
  await waitForDrawing(page);
  const form = page.getByRole("radiogroup", { name: "Gasket form" });
  await expect(form.getByRole("radio", { name: "Full-face gasket" })).toBeChecked();
  await expect(page.getByTestId("gasket-form-note")).toContainText("Full-face gasket");
  const stored = async () =>
    (
      (await (await page.request.get(`/api/v1/designs/${designId}`)).json()) as {
        workingRevision: {
          document: { gasket: { kind: string } };
          result: { gasketStress: { pathKind: string } };
        };
      }
    ).workingRevision;
  expect((await stored()).document.gasket.kind).toBe("full-face");
  expect((await stored()).result.gasketStress.pathKind).toBe("bolt-path");
  // The Readout has results (the core accepted the layout) and keeps the cautions.
  await expect(page.getByTestId("check-summary")).toBeVisible();
  await expect(page.getByRole("region", { name: "Readout" })).toContainText(/licensed/i);

  // Switch to a ring gasket and back: each is one edit, saved like any other.
  await form.getByRole("radio", { name: "Ring gasket" }).check();
  await expect(page.getByTestId("gasket-form-note")).toHaveText("Ring gasket (circular).");
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expectSaved(page);
  expect((await stored()).document.gasket.kind).toBe("ring");
  await form.getByRole("radio", { name: "Full-face gasket" }).check();
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expectSaved(page);
  expect((await stored()).document.gasket.kind).toBe("full-face");
});
