import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { expect, test, type Page } from "./helpers/test";
import {
  buildCircularFlange,
  buildObroundManway,
  buildRectangularCover,
} from "@/features/designs/model/templates";
import { signIn } from "./helpers/sign-in";
import { SAMPLE_COVER_SPEC } from "@/tests/fixtures/sample-cover";

// The browser's core (in Chromium) must reproduce the server's stored result bit for bit, for every
// example and seeded design and for designs from the templates: the Layout desk compares them once
// the stored result is loaded (use-result-agreement.ts) and records the outcome on the window.
const DESIGNER = "dana.designer@kestrel-ridge.example";
const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";

async function agreementOf(
  page: Page,
  designId: string,
): Promise<{ agree: boolean; difference: string | null }> {
  await page.goto(`/designs/${designId}`);
  await expect
    .poll(() => page.evaluate(() => window.__sealpitchAgreement?.length ?? 0), { timeout: 30_000 })
    .toBeGreaterThan(0);
  return page.evaluate(() => window.__sealpitchAgreement!.at(-1)!);
}

test("the browser's analysis equals the stored server result for every example, seeded and template design", async ({
  page,
}) => {
  test.setTimeout(180_000);
  await signIn(page, DESIGNER);
  const examples = readdirSync(path.join(process.cwd(), "examples"))
    .filter((f) => f.endsWith(".json"))
    .map(
      (f) => JSON.parse(readFileSync(path.join(process.cwd(), "examples", f), "utf8")) as { name: string },
    );
  expect(examples.length).toBeGreaterThanOrEqual(3);

  const ids: { label: string; id: string }[] = [];
  // The seeded designs (the seed stores the examples through the same create path as a user).
  for (const ex of examples) {
    const listed = (await (
      await page.request.get(`/api/v1/designs?q=${encodeURIComponent(ex.name)}`)
    ).json()) as {
      items: { designId: string; name: string }[];
    };
    const seeded = listed.items.find((i) => i.name === ex.name);
    expect(seeded, `seeded design ${ex.name}`).toBeTruthy();
    ids.push({ label: `seeded ${ex.name}`, id: seeded!.designId });
  }
  // The examples again, stored now, and a design from each template kind.
  const stamp = Date.now();
  const meta = (name: string) => ({ name: `${name} ${stamp}`, equipmentTag: "E-2107", units: "SI" as const });
  const cover = {
    boltEdgeDistanceMm: 20,
    boltCount: 16,
    boltSize: "M16" as const,
    coverThicknessMm: 25,
    flangeThicknessMm: 25,
    gasketWidthMm: 20,
  };
  const documents = [
    ...examples.map((ex) => ({ ...ex, name: `${ex.name} ${stamp}` })),
    buildCircularFlange(meta("Agreement round flange"), { ...SAMPLE_COVER_SPEC }),
    buildRectangularCover(meta("Agreement cover"), {
      ...cover,
      widthMm: 600,
      heightMm: 400,
      cornerRadiusMm: 40,
    }),
    buildObroundManway(meta("Agreement manway"), { ...cover, lengthMm: 700, widthMm: 450 }),
  ];
  for (const document of documents) {
    const created = await page.request.post("/api/v1/designs", {
      data: { name: document.name, equipmentTag: "E-2107", document },
      headers: { origin: APP_URL },
    });
    expect(created.status(), await created.text()).toBe(201);
    ids.push({ label: document.name, id: ((await created.json()) as { designId: string }).designId });
  }
  const outcomes: string[] = [];
  for (const { label, id } of ids) {
    const a = await agreementOf(page, id);
    outcomes.push(`${label}: ${a.agree ? "agree" : `differs at ${a.difference}`}`);
  }
  expect(
    outcomes.filter((o) => !o.endsWith(": agree")),
    outcomes.join("\n"),
  ).toEqual([]);
  expect(outcomes).toHaveLength(examples.length * 2 + 3);
});
