import { readFileSync } from "node:fs";
import { expect, test, type Page } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

// Suggest pattern on the Layout desk: the Pattern finder runs the search in a worker, shows the
// Candidate cards with the cautions, applies one as one undoable step, and a save records where
// the pattern came from in the design activity.
const DESIGNER = "dana.designer@kestrel-ridge.example";
const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";

const boltCount = (page: Page) => page.evaluate(() => window.__sealpitchStage?.ids("bolt-").length ?? 0);

async function findPatterns(page: Page) {
  await page.getByRole("button", { name: "Suggest pattern" }).click();
  const finder = page.getByRole("dialog", { name: "Pattern finder" });
  await expect(finder).toBeVisible();
  // The cautions stay in view beside the search.
  await expect(finder.getByRole("complementary", { name: "Cautions" })).toContainText(
    "Design the joint to the governing code",
  );
  await finder.getByLabel(/Accept layout warnings/).check();
  await finder.getByRole("button", { name: "Find patterns" }).click();
  const cards = finder.getByRole("region", { name: "Candidate cards" });
  await expect(cards.getByRole("listitem").first()).toBeVisible({ timeout: 60_000 });
  return { finder, cards };
}

test("Suggest pattern: run, see candidates, apply, undo, apply again, save, see the activity line", async ({
  page,
}) => {
  test.setTimeout(180_000);
  await signIn(page, DESIGNER);
  // A design of our demo scenario: the full-face rectangular cover example, 20 bolts M16.
  const document = JSON.parse(readFileSync("examples/rectangular-cover-full-face.json", "utf8"));
  const created = await page.request.post("/api/v1/designs", {
    data: { name: `Suggest e2e ${Date.now()}`, equipmentTag: "HC-E-214", document },
    headers: { origin: APP_URL },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { designId } = (await created.json()) as { designId: string };
  await page.goto(`/designs/${designId}`);
  await page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
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
  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expect(page.getByTestId("save-state")).toHaveText("Saved", { timeout: 15_000 });

  const stored = (await (await page.request.get(`/api/v1/designs/${designId}`)).json()) as {
    workingRevision: { document: { bolts: unknown[] } };
  };
  expect(stored.workingRevision.document.bolts).toHaveLength(bolts);
  await page.reload();
  await expect(page.getByRole("list", { name: "Activity entries" })).toContainText(
    `pattern applied from suggestion ${pick} of ${total}`,
  );
});
