"use client";
import { useEffect, useMemo, useState } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import type { GasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { buildHeatQuads } from "../model/heat-band";
import { buildHeatScale } from "../model/heat-scale";
import type { ReadoutView } from "../model/readout-view";
import { paintGrid } from "../components/heat-grid-image";
import type { HeatGridPicture } from "../components/heat-grid-node";
import { loadEditorCore } from "./use-editor-core";
import { gridInWorker } from "./grid-in-worker";

/** Settling time before the full-area grid is recomputed after the last change, ms. */
const GRID_DELAY_MS = 120;

/** An FE cross-check's gasket stress along the path at minimum preload, to colour the strip with. */
export interface FeField {
  sMm: number[];
  stressMpa: number[];
  maxStressMpa: number;
}

/**
 * The heat map at minimum preload. Every frame: the strip along the gasket path from the
 * analysis profile (cheap). Once edits settle: the core's full-area grid, painted to an image.
 * With `fe` (the FE field is switched on) the strip is coloured by the FE cross-check's gasket
 * stress instead, on a scale that covers both, and the estimate's full-area grid is not drawn.
 * The grid comes from a core worker (grid-in-worker.ts), or from the browser's core on the page,
 * fetched after the page shows (use-editor-core.ts), when there is no worker.
 */
export function useHeatMap(
  design: JointDesign,
  view: ReadoutView | null,
  dragging: boolean,
  fe: FeField | null = null,
) {
  const scale = useMemo(() => {
    if (!view) return null;
    const top = Math.max(view.profile.maxMpa * view.profile.minFactor, fe?.maxStressMpa ?? 0);
    return buildHeatScale(top, view.seatingMpa, view.crushMpa);
  }, [view, fe]);
  const quads = useMemo(() => {
    if (fe) return buildHeatQuads(design, fe.sMm, fe.stressMpa);
    return view
      ? buildHeatQuads(design, view.profile.sMm, view.profile.stressMpa, view.profile.minFactor)
      : null;
  }, [design, view, fe]);
  const [grid, setGrid] = useState<{ design: JointDesign; picture: HeatGridPicture } | null>(null);
  useEffect(() => {
    if (dragging || !view || !scale || fe) return;
    let live = true;
    const id = window.setTimeout(() => {
      const { nx, ny } = design.estimator.grid;
      const show = (g: GasketStressGrid) => {
        if (!live) return;
        try {
          const f = view.profile.minFactor;
          const scaled = { ...g, values: g.values.map((v) => (v < 0 ? v : v * f)), maxMpa: g.maxMpa * f };
          setGrid({
            design,
            picture: {
              canvas: paintGrid(scaled, scale.colour),
              xMinMm: g.xMinMm,
              xMaxMm: g.xMaxMm,
              yMinMm: g.yMinMm,
              yMaxMm: g.yMaxMm,
            },
          });
        } catch {
          setGrid(null);
        }
      };
      // In a core worker (the page's thread only paints it); on the page when there is none.
      const grid =
        gridInWorker(design, nx, ny) ??
        loadEditorCore().then(({ computeGasketStressGrid }) => computeGasketStressGrid(design, nx, ny));
      grid.then(show, () => live && setGrid(null));
    }, GRID_DELAY_MS);
    return () => {
      live = false;
      window.clearTimeout(id);
    };
  }, [design, view, scale, dragging, fe]);
  const current = grid && grid.design === design && !dragging && !fe ? grid.picture : null;
  return { scale, stage: scale ? { quads, grid: current, colour: scale.colour } : null };
}
