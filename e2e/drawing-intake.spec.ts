import { randomUUID } from "node:crypto";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import iconv from "iconv-lite";
import { expect, test, type Browser, type Page } from "./helpers/test";
import { signedInPage } from "./helpers/sign-in";

// The Drawing intake's confirmation (layer switches, the drawing unit of a file that states none)
// on fixtures written by independent DXF libraries (tests/fixtures/intake/generate-fixtures.ts),
// and the Stockroom CSV intake's preview and confirm with a Windows-1252 file.
const INES = "ines.admin@kestrel-ridge.example";
const DANA = "dana.designer@kestrel-ridge.example";
const FIXTURES = path.join(process.cwd(), "tests/fixtures/intake");
const suffix = randomUUID().slice(0, 6);

/** Dana's Drawing intake with one of our DXF fixtures chosen. */
async function drawingOpened(browser: Browser, fixture: string): Promise<Page> {
  const dana = await signedInPage(browser, DANA);
  await dana.goto("/designs/import");
  await dana.getByLabel("DXF drawing (outline and holes)").setInputFiles(path.join(FIXTURES, fixture));
  return dana;
}

test("layer switches: the title block is off by default, and switching the holes off refuses with names", async ({
  browser,
}) => {
  const dana = await drawingOpened(browser, "layered-title-block.dxf");
  const layers = dana.getByRole("group", { name: "Layer switches" });
  await expect(layers.getByRole("checkbox", { name: /^TITLE-BLOCK/ })).not.toBeChecked();
  await expect(layers.getByRole("checkbox", { name: /^DIMS/ })).not.toBeChecked();
  await expect(layers.getByRole("checkbox", { name: /^NOTES/ })).not.toBeChecked();
  await expect(layers.getByRole("checkbox", { name: /^HOLES/ })).toBeChecked();
  const summary = dana.getByTestId("import-summary");
  await expect(summary).toContainText("LWPOLYLINE on layer OUTLINE, 300 × 200 mm");
  await expect(summary).toContainText("6 × Ø 14 mm");
  const report = dana.getByRole("table", { name: "Reading report" });
  await expect(
    report.getByRole("row", { name: /skipped LWPOLYLINE TITLE-BLOCK 1 layer switched off/ }),
  ).toBeVisible();

  await layers.getByRole("checkbox", { name: /^HOLES/ }).uncheck();
  const alert = dana.getByTestId("import-refusal");
  await expect(alert).toContainText("No bolt holes found");
  await expect(alert).toContainText("LWPOLYLINE on layer OUTLINE, 300 × 200 mm (0 circle(s) inside)");
  await expect(dana.getByRole("button", { name: "Create design" })).toBeDisabled();
  // The title block switched on as well: the flange still wins over the border around it.
  await layers.getByRole("checkbox", { name: /^HOLES/ }).check();
  await layers.getByRole("checkbox", { name: /^TITLE-BLOCK/ }).check();
  await expect(summary).toContainText("LWPOLYLINE on layer OUTLINE, 300 × 200 mm");
  await expect(dana.getByText(/TITLE-BLOCK, 574 × 400 mm holds the same holes/)).toBeVisible();
});

test("a drawing that states no unit is confirmed in inches and created at its true size", async ({
  browser,
}) => {
  const dana = await drawingOpened(browser, "r12-inch-cover.dxf");
  const unit = dana.getByRole("group", { name: "Drawing unit switch" });
  await expect(unit.getByRole("radio", { name: "millimetres" })).toBeChecked();
  await expect(dana.getByTestId("size-read")).toHaveText(
    "Outline read as 14 × 9.3 drawing units: 14 × 9.3 mm if millimetres, 355.6 × 235 mm if inches.",
  );
  // As millimetres the cover is 14 × 9.25 mm: refused, naming the outline it read.
  await expect(dana.getByTestId("import-refusal")).toContainText(
    "closed chain of 4 ARC + 4 LINE on layer 0, 14 × 9.25 mm",
  );
  await expect(dana.getByRole("button", { name: "Create design" })).toBeDisabled();
  await unit.getByRole("radio", { name: "inches" }).check();
  const summary = dana.getByTestId("import-summary");
  await expect(summary).toContainText("355.6 × 235 mm");
  await expect(summary).toContainText("10 × Ø 20.64 mm");
  await dana.getByLabel("Design name").fill(`R12 inch cover ${suffix}`);
  await dana.getByRole("button", { name: "Create design" }).click();
  await expect(dana).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  const designId = dana.url().split("/").pop()!;
  const stored = (await (await dana.request.get(`/api/v1/designs/${designId}`)).json()) as {
    workingRevision: { document: { bolts: unknown[]; outline: { points: { x: number }[] } } };
  };
  const xs = stored.workingRevision.document.outline.points.map((p) => p.x);
  expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(355.6, 6);
  expect(stored.workingRevision.document.bolts).toHaveLength(10);
});

test("Stockroom CSV intake: a Windows-1252 file is previewed, confirmed, and re-imported as an update", async ({
  browser,
}) => {
  const name = `Graphite 23 °C µ-finish ${suffix}`;
  const csv = [
    "name,gasket_type,m,y_mpa,modulus_mpa,thickness_mm,source,edition",
    `${name},graphite-sheet,2,20,1000,1.5,Maker sheet – 2026,2026`,
  ].join("\r\n");
  const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-e2e-"));
  const file = path.join(dir, "gaskets-ansi.csv");
  writeFileSync(file, iconv.encode(csv + "\r\n", "win1252"));

  const ines = await signedInPage(browser, INES);
  await ines.goto("/library/gaskets");
  const intake = ines.getByRole("region", { name: "CSV intake" });
  await intake.getByLabel("CSV file").setInputFiles(file);
  await expect(intake.getByRole("status")).toHaveText(
    "1 line read (comma-separated, Windows-1252): 1 gasket to add, 0 to update.",
  );
  await expect(intake.getByRole("table", { name: "CSV preview" })).toContainText(name);
  // Nothing is stored before the confirm.
  const list = async () =>
    (
      (await (await ines.request.get("/api/v1/library/gaskets")).json()) as {
        rows: { name: string; source: string }[];
      }
    ).rows;
  expect((await list()).some((r) => r.name === name)).toBe(false);
  await intake.getByRole("button", { name: "Confirm import: 1 to add, 0 to update" }).click();
  await expect(intake.getByRole("status")).toContainText("1 added, 0 updated");
  expect((await list()).find((r) => r.name === name)?.source).toBe("Maker sheet – 2026");

  // The same file again: "add new" refuses and says how; "update rows with the same name" updates.
  await intake.getByLabel("CSV file").setInputFiles(file);
  await expect(intake.getByRole("status")).toContainText('choose "update rows with the same name"');
  await expect(intake.getByRole("button", { name: /Confirm import/ })).toHaveCount(0);
  await intake.getByRole("radio", { name: "Update rows with the same name" }).check();
  await expect(intake.getByRole("status")).toHaveText(
    "1 line read (comma-separated, Windows-1252): 0 gaskets to add, 1 to update.",
  );
  await intake.getByRole("button", { name: "Confirm import: 0 to add, 1 to update" }).click();
  await expect(intake.getByRole("status")).toContainText("0 added, 1 updated");
  // The spreadsheet export carries a BOM and CRLF line ends.
  const exported = await ines.request.get("/api/v1/library/gaskets/csv?variant=spreadsheet");
  const body = await exported.body();
  expect([...body.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  expect(body.toString("utf8")).toContain(`${name},graphite-sheet`);
  expect(body.toString("utf8")).toMatch(/\r\n/);
});
