/**
 * Model (mm, y up) ↔ screen (px, y down) mapping of the canvas: screen = origin + k·(x, −y).
 * Zoom and pan are view state only; they never enter the document or its history.
 */
import type { PointMm } from "@/features/analysis/core/design";

export interface ViewTransform {
  /** Pixels per mm. */
  k: number;
  /** Screen position of the model origin, px. */
  ox: number;
  oy: number;
}

export interface Bounds {
  xMinMm: number;
  xMaxMm: number;
  yMinMm: number;
  yMaxMm: number;
}

export const MIN_ZOOM = 0.02;
export const MAX_ZOOM = 200;

export function fitView(b: Bounds, widthPx: number, heightPx: number, paddingPx = 28): ViewTransform {
  const w = Math.max(b.xMaxMm - b.xMinMm, 1e-3);
  const h = Math.max(b.yMaxMm - b.yMinMm, 1e-3);
  const k = Math.max(MIN_ZOOM, Math.min((widthPx - 2 * paddingPx) / w, (heightPx - 2 * paddingPx) / h));
  const cx = (b.xMinMm + b.xMaxMm) / 2;
  const cy = (b.yMinMm + b.yMaxMm) / 2;
  return { k, ox: widthPx / 2 - k * cx, oy: heightPx / 2 + k * cy };
}

export function toScreen(v: ViewTransform, p: PointMm): { x: number; y: number } {
  return { x: v.ox + v.k * p.x, y: v.oy - v.k * p.y };
}

export function toModel(v: ViewTransform, x: number, y: number): PointMm {
  return { x: (x - v.ox) / v.k, y: (v.oy - y) / v.k };
}

/** Zooms by `factor` keeping the model point under the screen point (x, y) fixed. */
export function zoomAt(v: ViewTransform, x: number, y: number, factor: number): ViewTransform {
  const k = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, v.k * factor));
  const m = toModel(v, x, y);
  return { k, ox: x - k * m.x, oy: y + k * m.y };
}

export function panBy(v: ViewTransform, dx: number, dy: number): ViewTransform {
  return { k: v.k, ox: v.ox + dx, oy: v.oy + dy };
}
