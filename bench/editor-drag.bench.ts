/**
 * Editor drag benchmark: recompute (the core on the whole joint) plus React and Konva redraw per
 * drag frame, for a 96-bolt circular flange in headless Debian chromium. The editor records each
 * frame on `window.__sealpitchPerf.frames` (features/editor/hooks/use-drag-loop.ts): the time of
 * the synchronous update (snap, analyzeJoint, heat strip, scene) plus Konva's layer draw, measured
 * with performance.now(). Prints the median and 95th percentile. Target: under 16 ms a frame.
 */
import { chromium } from "@playwright/test";

const CHROMIUM_ARGS = ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];
const DESIGNER = "dana.designer@kestrel-ridge.example";
const PASSWORD = "halden-creek-2026";

function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
}

async function reachable(url: string): Promise<boolean> {
  try {
    const r = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(3000) });
    return r.ok;
  } catch {
    return false;
  }
}

export async function run(): Promise<void> {
  // A script outside the app: it reads its one setting directly (the app's env.ts is server code).
  const appUrl = process.env.APP_URL ?? "http://127.0.0.1:3100";
  if (!(await reachable(appUrl))) {
    console.log(`editor-drag: no app at ${appUrl}; run it via \`npm run bench\`, which starts the app, or set APP_URL`);
    return;
  }
  const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: CHROMIUM_ARGS });
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await page.goto(`${appUrl}/sign-in`);
    await page.getByLabel("E-mail").fill(DESIGNER);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(/\/desk/);
    await page.goto(`${appUrl}/designs/new`);
    await page.getByLabel(/Round flange by dimensions/).check();
    await page.getByLabel("Name", { exact: true }).fill(`Drag bench 96 bolts ${Date.now()}`);
    await page.getByLabel("Outside diameter (mm)").fill("1500");
    await page.getByLabel("Bore diameter (mm)").fill("1200");
    await page.getByLabel("Bolt circle diameter (mm)").fill("1400");
    await page.getByLabel("Number of bolts").fill("96");
    await page.getByLabel("Flange thickness (mm)").fill("40");
    await page.getByRole("button", { name: "Create design" }).click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
    await page.waitForFunction(() => (window.__sealpitchStage?.ids("bolt-").length ?? 0) === 96, undefined, { timeout: 30_000 });
    const boltCount = await page.evaluate(() => window.__sealpitchStage!.ids("bolt-").length);

    const frames: number[] = [];
    const react: number[] = [];
    const draw: number[] = [];
    for (const id of ["b1", "b25", "b49", "b73"]) {
      await page.evaluate(() => { window.__sealpitchPerf = { frames: [] }; });
      const p = (await page.evaluate((b) => window.__sealpitchStage!.boltClientPoint(b), id))!;
      await page.mouse.move(p.x, p.y);
      await page.mouse.down();
      // Small steps along the circle, one pointer event per ~frame: about 60 frames per drag.
      for (let i = 1; i <= 60; i++) {
        await page.mouse.move(p.x + Math.sin(i / 9) * 20, p.y + Math.cos(i / 9) * 6 - 3);
        await page.waitForTimeout(16);
      }
      await page.mouse.up();
      await page.waitForTimeout(300);
      const got = await page.evaluate(() => window.__sealpitchPerf?.frames ?? []);
      for (const f of got) { frames.push(f.totalMs); react.push(f.reactMs); draw.push(f.drawMs); }
    }
    for (const a of [frames, react, draw]) a.sort((x, y) => x - y);
    const line = (label: string, a: number[]) =>
      console.log(`editor-drag: ${label.padEnd(52)} median ${quantile(a, 0.5).toFixed(2)} ms  p95 ${quantile(a, 0.95).toFixed(2)} ms  (n=${a.length})`);
    line(`${boltCount}-bolt flange: recompute + redraw per frame`, frames);
    line(`${boltCount}-bolt flange: recompute + React update`, react);
    line(`${boltCount}-bolt flange: Konva layer draw`, draw);
  } finally {
    await browser.close();
  }
}
