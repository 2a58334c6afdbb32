import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect, test } from "./helpers/test";
import { signedInPage } from "./helpers/sign-in";
import { createSampleCover } from "./helpers/designs";

// The FE cross-check as a designer and an approver use it, on the production build with the
// server's own FE worker and the real CalculiX and Gmsh: run it from the design page, watch the
// progress, read the table, see the FE curve on the Seat trace and the FE field on the drawing,
// then approve and find the run cited on the bolt-spacing sheet. The design is this spec's own.
const DANA = "dana.designer@kestrel-ridge.example";
const ARLO = "arlo.approver@kestrel-ridge.example";

function pdfText(bytes: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-fe-sheet-"));
  try {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, bytes);
    return execFileSync("/usr/bin/pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

test("a designer runs the FE cross-check, sees it beside the estimate, and the approved sheet cites it", async ({
  browser,
}) => {
  test.setTimeout(240_000);
  const name = `FE check E-3310 ${randomUUID().slice(0, 6)}`;
  const dana = await signedInPage(browser, DANA);
  const designId = await createSampleCover(dana, name, "E-3310");

  await dana.goto(`/designs/${designId}`);
  const panel = dana.getByRole("region", { name: "FE cross-check" });
  await expect(panel).toContainText("No FE cross-check of this revision yet.");
  // No FE run yet: the drawing offers no FE field.
  await expect(dana.getByRole("group", { name: "Heat map field" })).toHaveCount(0);
  await panel.getByRole("button", { name: "Run FE cross-check" }).click();
  // Live progress from the job: the stage, the mesh and the solver runs.
  const progress = panel.getByTestId("fe-progress");
  await expect(progress).toBeVisible();
  await expect(progress).toContainText(/Mesh [\d,]+ elements · \d+ solver runs? ·/);

  const table = panel.getByRole("table", { name: "Estimate against FE" });
  await expect(table).toBeVisible({ timeout: 180_000 });
  for (const quantity of [
    "Minimum gasket stress along the path",
    "Maximum gasket stress along the path",
    "Lifted length of the gasket path",
    "Loaded-zone radius at the gasket plane",
    "Clamped-stack stiffness",
  ])
    await expect(table).toContainText(quantity);
  await expect(table.getByRole("row", { name: /Minimum gasket stress/ })).not.toContainText("not solved");
  await expect(
    panel.getByRole("figure", { name: "Gasket stress along the path, FE against the estimate" }),
  ).toBeVisible();
  await expect(panel).toContainText("not a substitute for an FE analysis qualified under the governing code");

  // The Layout desk draws the run of the saved document: the FE curve on the Seat trace ...
  await expect(dana.getByTestId("seat-trace-fe")).toContainText("FE cross-check, minimum preload: min");
  await expect(dana.locator('[data-series="fe"]')).toHaveCount(1);
  // ... and the heat map switches to the FE field, its colour key saying so.
  const field = dana.getByRole("group", { name: "Heat map field" });
  await field.getByLabel("FE cross-check").check();
  await expect(dana.getByRole("figure", { name: "Gasket stress colour key" })).toContainText(
    "Gasket stress (FE cross-check, minimum preload)",
  );
  await field.getByLabel("Estimate").check();
  await expect(dana.getByRole("figure", { name: "Gasket stress colour key" })).toContainText(
    "Gasket stress (minimum preload)",
  );

  // Submit, and the approver approves on the sign-off sheet, which shows the same run.
  const reviewPath = `/designs/${designId}/revisions/1`;
  await dana.goto(reviewPath);
  await dana.getByRole("button", { name: "Submit for review" }).click();
  await expect(dana.getByTestId("revision-status")).toHaveText("In review");
  const arlo = await signedInPage(browser, ARLO);
  await arlo.goto(reviewPath);
  await expect(
    arlo.getByRole("region", { name: "FE cross-check" }).getByRole("table", { name: "Estimate against FE" }),
  ).toBeVisible();
  const approveForm = arlo.getByRole("form", { name: "Approve" });
  const justifications = approveForm.getByRole("textbox", { name: /^Justification for/ });
  const count = await justifications.count();
  for (let i = 0; i < count; i++)
    await justifications.nth(i).fill("Accepted: checked against the FE cross-check and the maker's data.");
  const acknowledge = approveForm.getByRole("checkbox", { name: /I have read these \d+ unverified values/ });
  if (await acknowledge.count()) await acknowledge.check();
  await approveForm.getByRole("button", { name: "Approve revision" }).click();
  await expect(arlo.getByTestId("revision-status")).toHaveText("Approved");
  // An approved revision keeps the run its approval cites: no new run is offered.
  await expect(
    arlo.getByRole("region", { name: "FE cross-check" }).getByRole("button", { name: "Run FE cross-check" }),
  ).toHaveCount(0);

  const feRun = (await (
    await arlo.request.get(`/api/v1/designs/${designId}/revisions/1/fe-check`)
  ).json()) as { feCheck: { resultHash: string } };
  const sheet = await arlo.request.get(`/api/v1/designs/${designId}/revisions/1/sheet.pdf?paper=a4&units=SI`);
  expect(sheet.status()).toBe(200);
  const text = pdfText(await sheet.body()).replace(/\s+/g, " ");
  expect(text).toContain("FE cross-check");
  expect(text).toContain("cited by the approval");
  expect(text).toContain("Minimum gasket stress along the path");
  expect(text).toContain(feRun.feCheck.resultHash.slice(0, 12));

  await dana.context().close();
  await arlo.context().close();
});
