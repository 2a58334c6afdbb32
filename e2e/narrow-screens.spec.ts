import { expect, test, type Page } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

// Every page at 390 px (a phone held upright): no horizontal scroll. A page that fails names the
// widest elements that stick out, so the fault is easy to find.
const ADMIN = "ines.admin@kestrel-ridge.example";

async function overflowOf(page: Page): Promise<{ scroll: number; client: number; culprits: string[] }> {
  return page.evaluate(() => {
    const doc = document.documentElement;
    const w = doc.clientWidth;
    const culprits: string[] = [];
    for (const el of Array.from(document.body.querySelectorAll<HTMLElement>("*"))) {
      const r = el.getBoundingClientRect();
      if (r.right > w + 1 && r.width > 0) {
        const kids = Array.from(el.children).some((c) => c.getBoundingClientRect().right > w + 1);
        if (!kids)
          culprits.push(
            `${el.tagName.toLowerCase()}.${el.className.toString().slice(0, 60)} → ${Math.round(r.right)}`,
          );
      }
    }
    return { scroll: doc.scrollWidth, client: w, culprits: culprits.slice(0, 8) };
  });
}

test.use({ viewport: { width: 390, height: 844 } });

test("every page fits 390 px with no horizontal scroll", async ({ page, browser }) => {
  test.setTimeout(240_000);
  const visitor = await browser.newPage({ viewport: { width: 390, height: 844 } });
  const faults: string[] = [];
  const check = async (p: Page, path: string, ready?: (p: Page) => Promise<void>) => {
    await p.goto(path);
    await p.waitForLoadState("networkidle");
    if (ready) await ready(p);
    const o = await overflowOf(p);
    if (o.scroll > o.client) faults.push(`${path}: ${o.scroll} > ${o.client} (${o.culprits.join("; ")})`);
  };
  for (const path of ["/", "/sign-in", "/sign-up", "/forgot-password"]) await check(visitor, path);
  await visitor.close();

  await signIn(page, ADMIN);
  const listed = (await (await page.request.get("/api/v1/designs")).json()) as {
    items: { designId: string }[];
  };
  const id = listed.items[0]!.designId;
  for (const path of [
    "/desk",
    "/designs",
    "/designs/new",
    "/designs/import",
    "/library/gaskets",
    "/library/bolting",
    "/library/flanges",
    "/team",
    `/designs/${id}/revisions/1`,
    `/designs/${id}/compare?from=1&to=1`,
  ])
    await check(page, path);
  await check(page, `/designs/${id}`, async (p) => {
    await p.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) > 0);
    // The Layout desk stacks at this width, the drawing first.
    const drawing = await p.getByRole("toolbar", { name: "Pattern bench" }).boundingBox();
    const form = await p.getByRole("complementary", { name: "Joint data" }).boundingBox();
    expect(drawing!.y).toBeLessThan(form!.y);
  });
  expect(faults, faults.join("\n")).toEqual([]);
});
