import { sampleCover } from "@/tests/fixtures/sample-cover";
import { expect, type Page } from "./test";

const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";

/** Creates this spec's own sample cover through POST /api/v1/designs as the page's user; its id. */
export async function createSampleCover(page: Page, name: string, equipmentTag: string): Promise<string> {
  const created = await page.request.post("/api/v1/designs", {
    data: { name, equipmentTag, document: sampleCover(name, equipmentTag) },
    headers: { origin: APP_URL },
  });
  expect(created.status(), await created.text()).toBe(201);
  return ((await created.json()) as { designId: string }).designId;
}
