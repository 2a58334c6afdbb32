import { randomUUID } from "node:crypto";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Drawing from "dxf-writer";
import { expect, test } from "./helpers/test";
import { signedInPage } from "./helpers/sign-in";
import { createSampleCover } from "./helpers/designs";

// The Stockroom and attachment flows with the demo crew of Kestrel Ridge: Ines (admin) adds a
// gasket, Dana (designer) finds it, attaches a datasheet to a design and gets the same bytes
// back, and starts a design from a DXF drawing. Every name carries a random suffix.
const INES = "ines.admin@kestrel-ridge.example";
const DANA = "dana.designer@kestrel-ridge.example";
const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";
const suffix = randomUUID().slice(0, 6);

test("an admin adds a gasket to the Stockroom and a designer picks it in a design", async ({ browser }) => {
  const name = `Halden Creek graphite sheet ${suffix}`;
  const ines = await signedInPage(browser, INES);
  await ines.goto("/library/gaskets");
  await ines.getByRole("button", { name: "New gasket" }).click();
  const form = ines.getByRole("form", { name: "Add a gasket" });
  await form.getByLabel("Name").fill(name);
  await form.getByLabel("Gasket type").fill("Flexible graphite sheet");
  await form.getByLabel("Gasket factor m").fill("2.0");
  await form.getByLabel("Seating stress y (MPa)").fill("abc");
  await form.getByLabel("Modulus (MPa)").fill("1100");
  await form.getByLabel("Thickness (mm)").fill("2");
  await form.getByLabel("Source").fill("Supplier test report KR-G-2026");
  await form.getByLabel("Qmin L0.1").fill("12");
  await form.getByRole("button", { name: "Add gasket" }).click();
  // A bad number is named at its field, and nothing is added.
  await expect(form.getByText("must be a number")).toBeVisible();
  await form.getByLabel("Seating stress y (MPa)").fill("15");
  await form.getByRole("button", { name: "Add gasket" }).click();
  await expect(form.getByRole("status")).toHaveText("Added to the Stockroom.");
  await ines.getByLabel("Filter Gaskets").fill(suffix);
  await expect(ines.getByRole("table", { name: "Gaskets" }).getByRole("row")).toHaveCount(2);

  const dana = await signedInPage(browser, DANA);
  await dana.goto("/library/gaskets");
  await expect(dana.getByRole("button", { name: "New gasket" })).toHaveCount(0);
  await dana.getByLabel("Filter Gaskets").fill(suffix);
  const row = dana.getByRole("table", { name: "Gaskets" }).getByRole("row", { name: new RegExp(name) });
  await expect(row).toContainText("Ours");
  await expect(row).toContainText("L0.1: 12/—");
  // Sorting and paging work on the built-in rows too.
  await dana.getByLabel("Filter Gaskets").fill("");
  await expect(dana.getByText(/Page 1 of \d+/)).toBeVisible();
  await dana.getByRole("button", { name: /^m/ }).click();
  await expect(dana.getByRole("columnheader", { name: /^m/ })).toHaveAttribute("aria-sort", "ascending");

  const choices = await dana.request.get("/api/v1/library/gaskets");
  expect(choices.status()).toBe(200);
  const { rows } = (await choices.json()) as { rows: { name: string; origin: string; yMpa: number }[] };
  expect(rows.find((r) => r.name === name)).toMatchObject({ origin: "organization", yMpa: 15 });

  // In the Layout desk the gasket picker offers the organisation's row; picking it copies its
  // values (with the Qmin of the chosen tightness class) into the design, which saves them.
  const title = `Stockroom gasket pick E-2107 ${suffix}`;
  const designId = await createSampleCover(dana, title, "E-2107");
  await dana.goto(`/designs/${designId}`);
  const picker = dana.getByLabel("Gasket material");
  await expect(picker.locator("optgroup[label='Our Stockroom'] option", { hasText: name })).toHaveCount(1);
  await picker.selectOption({ label: name });
  const factors = dana.getByTestId("gasket-factors");
  await expect(factors).toContainText("m = 2, y = 15 MPa, Qmin = 12 MPa");
  await expect(factors).toContainText("Supplier test report KR-G-2026");
  await expect(dana.getByLabel("Tightness class for Qmin and QSmin")).toHaveValue("L0.1");
  await dana.getByRole("button", { name: "Save", exact: true }).click();
  await expect(dana.getByTestId("save-state")).toHaveText("Saved");
  const stored = (await (await dana.request.get(`/api/v1/designs/${designId}`)).json()) as {
    workingRevision: { document: { gasket: { material: Record<string, unknown> } } };
  };
  expect(stored.workingRevision.document.gasket.material).toMatchObject({
    name,
    m: 2,
    yMpa: 15,
    qMinMpa: 12,
    catalogueId: expect.stringMatching(/^org:/),
  });
  // The seating check now judges against the copied Qmin, as the Readout says.
  await expect(dana.locator('li[data-rule="gasket.seating"]').first()).toContainText(/Qmin|12/);
});

test("a designer attaches a datasheet PDF and downloads it byte-identical; a renamed program is refused", async ({
  browser,
}) => {
  const dana = await signedInPage(browser, DANA);
  const name = `Datasheet carrier E-2107 ${suffix}`;
  const designId = await createSampleCover(dana, name, "E-2107");

  const pdf = Buffer.concat([
    Buffer.from(`%PDF-1.4\n% Kestrel Ridge gasket datasheet ${suffix}\n`),
    Buffer.from(Array.from({ length: 4096 }, (_, i) => i % 256)),
    Buffer.from("\n%%EOF\n"),
  ]);
  const base = `/api/v1/designs/${designId}/attachments`;

  // Without our Origin the upload is refused before anything is read.
  const foreign = await dana.request.post(base, {
    data: pdf,
    headers: {
      "x-file-name": "datasheet.pdf",
      "content-type": "application/octet-stream",
      origin: "http://evil.example",
    },
  });
  expect(foreign.status()).toBe(403);

  const exe = await dana.request.post(base, {
    data: Buffer.from("MZ\x90\x00\x03\x00\x00\x00"),
    headers: { "x-file-name": "datasheet.pdf", "content-type": "application/pdf", origin: APP_URL },
  });
  expect(exe.status()).toBe(415);
  expect(((await exe.json()) as { error: { message: string } }).error.message).toMatch(
    /Only PDF, PNG, JPEG or DXF/,
  );

  const page = await dana.context().newPage();
  await page.goto(`/designs/${designId}`);
  const drawer = page.getByRole("region", { name: "Drawing drawer" });
  await expect(drawer).toBeVisible();
  const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-e2e-"));

  // Chosen through the file input: the upload is held at the server door for a moment, so the
  // progress bar is seen, then the file is listed and downloads byte-identical.
  let release: () => void = () => {};
  const held = new Promise<void>((r) => {
    release = r;
  });
  await page.route(`**${base}`, async (route) => {
    if (route.request().method() !== "POST") return route.continue();
    await held;
    await route.continue();
  });
  const file = path.join(dir, "gasket-datasheet.pdf");
  writeFileSync(file, pdf);
  await drawer.getByLabel("Attach files").setInputFiles(file);
  await expect(drawer.getByRole("progressbar", { name: "Uploading gasket-datasheet.pdf" })).toBeVisible();
  release();
  await expect(drawer.getByRole("status")).toHaveText("Attached gasket-datasheet.pdf.");
  await expect(drawer.getByRole("progressbar")).toHaveCount(0);
  await page.unroute(`**${base}`);
  const download = page.waitForEvent("download");
  await drawer.getByRole("link", { name: "gasket-datasheet.pdf" }).click();
  const saved = await (await download).path();
  expect(Buffer.compare(readFileSync(saved!), pdf)).toBe(0);
  await expect(drawer.getByRole("row", { name: /gasket-datasheet\.pdf/ })).toContainText("Dana");

  // Dropped onto the drawer: a PNG photo goes in; a file over the limit is refused before sending.
  const png = Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    Buffer.from(Array.from({ length: 2048 }, (_, i) => (i * 7) % 256)),
  ]);
  const drop = async (files: { name: string; type: string; bytes: number[] | null; size?: number }[]) => {
    const transfer = await page.evaluateHandle((list) => {
      const dt = new DataTransfer();
      for (const f of list) {
        const body = f.bytes ? new Uint8Array(f.bytes) : new Uint8Array(f.size ?? 0);
        dt.items.add(new File([body], f.name, { type: f.type }));
      }
      return dt;
    }, files);
    const zone = drawer.getByTestId("attachment-drop-zone");
    await zone.dispatchEvent("dragover", { dataTransfer: transfer });
    await zone.dispatchEvent("drop", { dataTransfer: transfer });
  };
  await drop([{ name: "flange-face-photo.png", type: "image/png", bytes: [...png] }]);
  await expect(drawer.getByRole("status")).toHaveText("Attached flange-face-photo.png.");
  await expect(drawer.getByRole("link", { name: "flange-face-photo.png" })).toBeVisible();
  await drop([{ name: "scan-too-big.pdf", type: "application/pdf", bytes: null, size: 21 * 1024 * 1024 }]);
  await expect(drawer.getByText("larger than 20 MB")).toBeVisible();
  await expect(drawer.getByRole("link", { name: "scan-too-big.pdf" })).toHaveCount(0);

  const list = (await (await dana.request.get(base)).json()) as {
    attachments: { id: string; fileName: string; kind: string; uploadedByName: string }[];
  };
  const item = list.attachments.find((a) => a.fileName === "gasket-datasheet.pdf");
  expect(item).toMatchObject({ kind: "pdf" });
  const downloaded = await dana.request.get(`${base}/${item!.id}`);
  expect(downloaded.status()).toBe(200);
  expect(downloaded.headers()["content-type"]).toBe("application/pdf");
  expect(Buffer.compare(await downloaded.body(), pdf)).toBe(0);

  // Someone from another organisation, holding both ids, gets a 404 and not a byte.
  const outsider = await (await browser.newContext()).newPage();
  await outsider.goto("/sign-up");
  await outsider.getByLabel("Your name").fill("Olu Outsider");
  await outsider.getByLabel("E-mail").fill(`olu.${suffix}@other-works.example`);
  await outsider.getByLabel("Organisation").fill(`Other Works ${suffix}`);
  await outsider.getByLabel("Password", { exact: true }).fill("another-plant-2026");
  await outsider.getByLabel("Repeat the password").fill("another-plant-2026");
  await outsider.getByRole("button", { name: "Start the organisation" }).click();
  await expect(outsider).toHaveURL(/\/desk$/);
  const stolen = await outsider.request.get(`${base}/${item!.id}`);
  expect(stolen.status()).toBe(404);
  expect(await stolen.text()).not.toContain("Kestrel Ridge gasket datasheet");
  expect((await outsider.request.get(base)).status()).toBe(404);
  const wiped = await outsider.request.delete(`${base}/${item!.id}`, { headers: { origin: APP_URL } });
  expect(wiped.status()).toBe(404);
});

test("a DXF outline with bolt holes imports into a new design after a preview", async ({ browser }) => {
  const d = new Drawing();
  d.setUnits("Millimeters");
  d.drawCircle(500, 500, 170); // OD 340, drawn off the origin on purpose
  d.drawCircle(500, 500, 85); // bore 170
  for (let i = 0; i < 12; i++) {
    const a = ((i + 0.5) * 2 * Math.PI) / 12;
    d.drawCircle(500 + 145 * Math.sin(a), 500 + 145 * Math.cos(a), 11);
  }
  const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-e2e-"));
  const file = path.join(dir, "e-2107-channel.dxf");
  writeFileSync(file, d.toDxfString());

  const dana = await signedInPage(browser, DANA);
  await dana.goto("/designs/import");
  await dana.getByLabel("DXF drawing (outline and holes)").setInputFiles(file);
  const summary = dana.getByTestId("import-summary");
  await expect(summary).toContainText("circle Ø 340 mm");
  await expect(summary).toContainText("12 × Ø 22 mm");
  await expect(summary).toContainText("bolt circle Ø 290 mm");
  await expect(summary).toContainText("Ø 170 mm");
  await expect(dana.getByTestId("import-hole")).toHaveCount(12);
  const name = `Imported channel E-2107 ${suffix}`;
  await dana.getByLabel("Design name").fill(name);
  await dana.getByLabel("Equipment tag").fill("E-2107");
  await dana.getByRole("button", { name: "Create design" }).click();
  await expect(dana).toHaveURL(/\/designs\/[0-9a-f-]{36}$/);
  const designId = dana.url().split("/").pop()!;
  const stored = (await (await dana.request.get(`/api/v1/designs/${designId}`)).json()) as {
    name: string;
    workingRevision: {
      document: {
        bolts: unknown[];
        boltPath: { kind: string; diameterMm: number };
        outline: { diameterMm: number };
      };
    };
  };
  expect(stored.name).toBe(name);
  expect(stored.workingRevision.document.bolts).toHaveLength(12);
  expect(stored.workingRevision.document.boltPath.kind).toBe("circle");
  expect(stored.workingRevision.document.boltPath.diameterMm).toBeCloseTo(290, 3);
  expect(stored.workingRevision.document.outline.diameterMm).toBeCloseTo(340, 6);
});
