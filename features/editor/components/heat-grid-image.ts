// Paints the core's gasket-stress grid into an offscreen canvas for a Konva Image. Browser only.
import type { GasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { OUTSIDE_GASKET } from "@/features/analysis/core/grid-cell";

function rgb(colour: string): [number, number, number] {
  const m = /^rgb\((\d+),\s*(\d+),\s*(\d+)\)$/.exec(colour);
  if (m) return [Number(m[1]), Number(m[2]), Number(m[3])];
  const h = colour.replace("#", "");
  return [parseInt(h.slice(0, 2), 16), parseInt(h.slice(2, 4), 16), parseInt(h.slice(4, 6), 16)];
}

export function paintGrid(grid: GasketStressGrid, colour: (mpa: number) => string): HTMLCanvasElement {
  const canvas = document.createElement("canvas");
  canvas.width = grid.nx;
  canvas.height = grid.ny;
  const ctx = canvas.getContext("2d")!;
  const img = ctx.createImageData(grid.nx, grid.ny);
  const cache = new Map<number, [number, number, number]>();
  for (let i = 0; i < grid.values.length; i++) {
    const v = grid.values[i];
    if (v === OUTSIDE_GASKET) continue;
    // Quantise to 0.1 % of the maximum so the colour scale runs a few hundred times, not 65 536.
    const key = Math.round((v / (grid.maxMpa || 1)) * 1000);
    let c = cache.get(key);
    if (!c) {
      c = rgb(colour((key / 1000) * (grid.maxMpa || 1)));
      cache.set(key, c);
    }
    img.data[i * 4] = c[0];
    img.data[i * 4 + 1] = c[1];
    img.data[i * 4 + 2] = c[2];
    img.data[i * 4 + 3] = 235;
  }
  ctx.putImageData(img, 0, 0);
  return canvas;
}
