/**
 * First-load JavaScript per route, as the production build records it: Next's build writes
 * `<distDir>/diagnostics/route-bundle-stats.json` (uncompressed bytes and the chunk list of each
 * app route) but prints no sizes. Here the editor route and its neighbours are listed with the
 * uncompressed and the gzip size of their first-load chunks. The Konva stage is not part of the
 * first load: it is fetched after the page shows (features/editor/components/joint-canvas.tsx).
 */
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { figure } from "./report";

interface RouteStats {
  route: string;
  firstLoadUncompressedJsBytes: number;
  firstLoadChunkPaths: string[];
}

const ROUTES = [
  "/designs/[designId]",
  "/designs/[designId]/revisions/[number]",
  "/designs",
  "/desk",
  "/library/gaskets",
  "/sign-in",
];

const kb = (b: number) => `${(b / 1024).toFixed(1)} kB`;

export async function run(): Promise<void> {
  const dist = process.env.SEALPITCH_DIST_DIR || ".next";
  const file = join(dist, "diagnostics", "route-bundle-stats.json");
  if (!existsSync(file)) {
    console.log(`route-size: no ${file}; run \`npm run bench\` (it builds the app) or \`next build\` first`);
    return;
  }
  const stats = JSON.parse(readFileSync(file, "utf8")) as RouteStats[];
  const gz = new Map<string, number>();
  const gzipOf = (p: string) => {
    // Chunk paths are recorded relative to the project with the default folder name.
    const path = p.replace(/^\.next\//, `${dist}/`);
    if (!gz.has(path)) gz.set(path, existsSync(path) ? gzipSync(readFileSync(path)).length : NaN);
    return gz.get(path)!;
  };
  for (const route of ROUTES) {
    const s = stats.find((x) => x.route === route);
    if (!s) continue;
    const gzip = s.firstLoadChunkPaths.reduce((a, p) => a + gzipOf(p), 0);
    if (route === "/designs/[designId]")
      figure(
        "First-load JavaScript of the Layout desk (`/designs/[designId]`)",
        `${kb(s.firstLoadUncompressedJsBytes)} uncompressed, ${kb(gzip)} gzip (${s.firstLoadChunkPaths.length} chunks)`,
        { goal: "≤ 180 kB gzip" },
      );
    console.log(
      `route-size: ${route.padEnd(44)} first-load JS ${kb(s.firstLoadUncompressedJsBytes).padStart(9)}  gzip ${kb(gzip).padStart(8)}  (${s.firstLoadChunkPaths.length} chunks)`,
    );
  }
}
