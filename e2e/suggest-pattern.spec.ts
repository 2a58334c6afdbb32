import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import type { Locator } from "@playwright/test";
import { expect, test, type Page } from "./helpers/test";
import { signIn, signedInPage } from "./helpers/sign-in";

// Suggest pattern on the Layout desk: the Pattern finder runs the search in a worker, shows the
// Candidate cards with the cautions, applies one as one undoable step, and a save records where
// the pattern came from in the design activity. Its lengths follow the desk's units, and a search
// limited to one of our own Stockroom bolting rows applies that row's values.
const DESIGNER = "dana.designer@kestrel-ridge.example";
const ADMIN = "ines.admin@kestrel-ridge.example";
const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";

const boltCount = (page: Page) => page.evaluate(() => window.__sealpitchStage?.ids("bolt-").length ?? 0);

interface StoredDesign {
  workingRevision: {
    document: {
      bolts: { id: string; sMm: number }[];
      fastener: { materialId: string; holeDiameterMm: number; stockedMaterial?: { name: string } | null };
    };
    result: { fastener: { materialName: string; yieldMpa: number; tensileMpa: number } } | null;
  };
}

/** A design of our demo scenario: the full-face rectangular cover example, 20 bolts M16, on its Layout desk. */
async function openCoverDesign(page: Page, title: string) {
  const document = JSON.parse(readFileSync("examples/rectangular-cover-full-face.json", "utf8"));
  const created = await page.request.post("/api/v1/designs", {
    data: { name: `${title} ${Date.now()}`, equipmentTag: "HC-E-214", document },
    headers: { origin: APP_URL },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { designId } = (await created.json()) as { designId: string };
  await page.goto(`/designs/${designId}`);
  await page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
  return { designId, document };
}

async function openFinder(page: Page) {
  await page.getByRole("button", { name: "Suggest pattern" }).click();
  const finder = page.getByRole("dialog", { name: "Pattern finder" });
  await expect(finder).toBeVisible();
  // The cautions stay in view beside the search.
  await expect(finder.getByRole("complementary", { name: "Cautions" })).toContainText(
    "Design the joint to the governing code",
  );
  return finder;
}

async function runSearch(finder: Locator) {
  await finder.getByLabel(/Accept layout warnings/).check();
  await finder.getByRole("button", { name: "Find patterns" }).click();
  const cards = finder.getByRole("region", { name: "Candidate cards" });
  await expect(cards.getByRole("listitem").first()).toBeVisible({ timeout: 60_000 });
  return cards;
}

async function findPatterns(page: Page) {
  const finder = await openFinder(page);
  return { finder, cards: await runSearch(finder) };
}

async function saveAndRead(page: Page, designId: string): Promise<StoredDesign> {
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });
  return (await (await page.request.get(`/api/v1/designs/${designId}`)).json()) as StoredDesign;
}

test("Suggest pattern: run, see candidates, apply, undo, apply again, save, see the activity line", async ({
  page,
}) => {
  test.setTimeout(180_000);
  await signIn(page, DESIGNER);
  const { designId, document } = await openCoverDesign(page, "Suggest e2e");
  const before = await boltCount(page);
  expect(before).toBe(document.bolts.length);

  const first = await findPatterns(page);
  const cards = first.cards.getByRole("listitem");
  const total = await cards.count();
  expect(total).toBeGreaterThan(0);
  await expect(cards.first()).toHaveAccessibleName(`Suggestion 1 of ${total}`);
  await expect(cards.first()).toContainText("Lowest seating");
  await expect(cards.first()).toContainText("Governing");
  const pick = total >= 2 ? 2 : 1;
  const card = first.cards.getByRole("listitem", { name: `Suggestion ${pick} of ${total}` });
  const bolts = Number((await card.getByRole("img").getAttribute("aria-label"))!.split(" ")[0]);
  await card.getByRole("button", { name: "Use this pattern" }).click();
  await expect(first.finder).toBeHidden();
  await expect.poll(() => boltCount(page)).toBe(bolts);

  // One undoable step: Undo brings the old pattern back whole.
  await page.getByRole("toolbar", { name: "Pattern bench" }).getByRole("button", { name: "Undo" }).click();
  await expect.poll(() => boltCount(page)).toBe(before);

  const again = await findPatterns(page);
  await again.cards
    .getByRole("listitem", { name: `Suggestion ${pick} of ${total}` })
    .getByRole("button", { name: "Use this pattern" })
    .click();
  await expect.poll(() => boltCount(page)).toBe(bolts);
  const stored = await saveAndRead(page, designId);
  expect(stored.workingRevision.document.bolts).toHaveLength(bolts);
  await page.reload();
  await expect(page.getByRole("list", { name: "Activity entries" })).toContainText(
    `pattern applied from suggestion ${pick} of ${total}`,
  );
});

test("Suggest pattern in US units: the dialog shows inches and a keep-out typed in inches stays free of bolts", async ({
  page,
}) => {
  test.setTimeout(180_000);
  await signIn(page, DESIGNER);
  const { designId } = await openCoverDesign(page, "Suggest in inches e2e");
  const units = page.getByRole("radiogroup", { name: "Units" });
  await units.getByRole("radio", { name: /^US/ }).click();
  await expect(units.getByRole("radio", { name: /^US/ })).toHaveAttribute("aria-checked", "true");
  try {
    const finder = await openFinder(page);
    // Path length of the cover's bolt path (600 × 400, corner radius 30, 25 in from the edge):
    // about 1791 mm = 70.5 in.
    await expect(finder).toContainText(/lengths in in, along the bolt\s+path .*\(path length 70\.\d{3} in\)/);
    await expect(finder.getByText("Try bolt-path offsets (now 0.984 in)")).toBeVisible();
    await expect(finder.getByLabel("Extra tool clearance, in")).toHaveValue("0");
    await expect(finder.getByLabel("Offset step, in")).toHaveValue("0.25");
    // A nozzle from 10 in to 12 in along the path (254 mm to 304.8 mm, over the first corner), typed in inches.
    await finder.getByRole("button", { name: "Add keep-out" }).click();
    await finder.getByLabel("Keep-out 1 from, in").fill("10");
    await finder.getByLabel("Keep-out 1 to, in").fill("12");
    await finder.getByLabel("Keep-out 1 label").fill("nozzle N2");
    const cards = await runSearch(finder);
    const first = cards.getByRole("listitem").first();
    await expect(first).toContainText(/Pitch\d+\.\d{3}–\d+\.\d{3} in/);
    await expect(first).toContainText("psi");
    const bolts = Number((await first.getByRole("img").getAttribute("aria-label"))!.split(" ")[0]);
    await first.getByRole("button", { name: "Use this pattern" }).click();
    await expect(finder).toBeHidden();
    await expect.poll(() => boltCount(page)).toBe(bolts);

    const stored = await saveAndRead(page, designId);
    const doc = stored.workingRevision.document;
    expect(doc.bolts).toHaveLength(bolts);
    // No hole of the applied pattern reaches into 254–304.8 mm (centre at least half a hole outside).
    const r = doc.fastener.holeDiameterMm / 2;
    const inside = doc.bolts.filter((b) => b.sMm > 254 - r + 1e-3 && b.sMm < 304.8 + r - 1e-3);
    expect(inside).toEqual([]);
    // The search bridges the zone with a bolt just clear of each end.
    const s = doc.bolts.map((b) => b.sMm);
    expect(s.some((v) => Math.abs(v - (254 - r)) < 0.5)).toBe(true);
    expect(s.some((v) => Math.abs(v - (304.8 + r)) < 0.5)).toBe(true);
  } finally {
    // The unit system is remembered for the designer; put it back for the other specs.
    const finder = page.getByRole("dialog", { name: "Pattern finder" });
    if (await finder.isVisible()) await finder.getByRole("button", { name: "Close" }).click();
    await units.getByRole("radio", { name: /^SI/ }).click();
    await expect(units.getByRole("radio", { name: /^US/ })).toBeEnabled();
    await expect(units.getByRole("radio", { name: /^SI/ })).toHaveAttribute("aria-checked", "true");
  }
});

test("Suggest pattern on our own Stockroom bolting row: candidates name it and the saved design carries its values", async ({
  browser,
  page,
}) => {
  test.setTimeout(180_000);
  // Ines (admin) adds a bolting row to the Stockroom: stud stock of our own scenario with its
  // test certificate's strengths (invented demo data, close to ISO 898-1 class 8.8).
  const name = `Halden Creek stud stock ${randomUUID().slice(0, 6)}`;
  const ines = await signedInPage(browser, ADMIN);
  await ines.goto("/library/bolting");
  await ines.getByRole("button", { name: "New bolting material" }).click();
  const form = ines.getByRole("form", { name: "Add a bolting material" });
  await form.getByLabel("Name").fill(name);
  await form.getByLabel("Source").fill("Kestrel Ridge stores certificate KR-B-19");
  await form.getByLabel("Up to diameter (mm) 1").fill("72");
  await form.getByLabel("Proof (MPa) 1").fill("590");
  await form.getByLabel("Yield (MPa) 1").fill("650");
  await form.getByLabel("Tensile (MPa) 1").fill("815");
  await form.getByRole("button", { name: "Add bolting material" }).click();
  await expect(form.getByRole("status")).toHaveText("Added to the Stockroom.");
  await ines.context().close();

  await signIn(page, DESIGNER);
  const { designId } = await openCoverDesign(page, "Suggest own stock e2e");
  const finder = await openFinder(page);
  await expect(finder.getByRole("radio", { name: "Our Stockroom's bolting rows" })).toBeChecked();
  const materials = finder.getByRole("group", { name: "Bolt materials" });
  const ownRow = materials.getByRole("checkbox", { name: new RegExp(name) });
  await expect(materials.getByText(name)).toBeVisible();
  await expect(materials.locator("label", { hasText: name })).toContainText("(Ours)");
  await expect(materials.locator("label", { hasText: name })).toContainText("Sy 650 · Su 815 MPa");
  // Only our row: the design's own ISO 898-1 8.8 row starts ticked, so untick it.
  for (const box of await materials.getByRole("checkbox", { checked: true }).all()) await box.uncheck();
  await ownRow.check();
  await expect(materials.getByRole("checkbox", { checked: true })).toHaveCount(1);
  const cards = await runSearch(finder);
  const items = cards.getByRole("listitem");
  const total = await items.count();
  for (let i = 0; i < total; i++) await expect(items.nth(i)).toContainText(`${name} (our Stockroom row)`);
  await items.first().getByRole("button", { name: "Use this pattern" }).click();
  await expect(finder).toBeHidden();
  await expect(page.getByLabel("Bolt material", { exact: true })).toHaveValue(/^org:/);
  await expect(page.getByLabel("Bolt material", { exact: true }).locator("option:checked")).toHaveText(
    `${name} (copied from our Stockroom)`,
  );

  const stored = await saveAndRead(page, designId);
  const { document: doc, result } = stored.workingRevision;
  expect(doc.fastener.materialId).toMatch(/^org:[0-9a-f-]{36}$/);
  expect(doc.fastener.stockedMaterial?.name).toBe(name);
  // The analysis after applying reads the row's strengths (650 / 815 MPa), not the catalogue 8.8's
  // (ISO 898-1 Table 3, M16: Rp0.2 640, Rm 800 MPa).
  expect(result?.fastener).toMatchObject({ materialName: name, yieldMpa: 650, tensileMpa: 815 });
  await page.reload();
  await expect(page.getByRole("list", { name: "Activity entries" })).toContainText(
    `pattern applied from suggestion 1 of ${total}`,
  );
});
