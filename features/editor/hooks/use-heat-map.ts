"use client";
import { useEffect, useMemo, useState } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { buildHeatQuads } from "../model/heat-band";
import { buildHeatScale } from "../model/heat-scale";
import type { ReadoutView } from "../model/readout-view";
import { paintGrid } from "../components/heat-grid-image";
import type { HeatGridPicture } from "../components/heat-grid-node";

/** Settling time before the full-area grid is recomputed after the last change, ms. */
const GRID_DELAY_MS = 120;

/**
 * The heat map at minimum preload. Every frame: the strip along the gasket path from the
 * analysis profile (cheap). Once edits settle: the core's full-area grid, painted to an image.
 */
export function useHeatMap(design: JointDesign, view: ReadoutView | null, dragging: boolean) {
  const scale = useMemo(() => {
    if (!view) return null;
    return buildHeatScale(view.profile.maxMpa * view.profile.minFactor, view.seatingMpa, view.crushMpa);
  }, [view]);
  const quads = useMemo(
    () =>
      view ? buildHeatQuads(design, view.profile.sMm, view.profile.stressMpa, view.profile.minFactor) : null,
    [design, view],
  );
  const [grid, setGrid] = useState<{ design: JointDesign; picture: HeatGridPicture } | null>(null);
  useEffect(() => {
    if (dragging || !view || !scale) return;
    const id = window.setTimeout(() => {
      try {
        const g = computeGasketStressGrid(design, design.estimator.grid.nx, design.estimator.grid.ny);
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
    }, GRID_DELAY_MS);
    return () => window.clearTimeout(id);
  }, [design, view, scale, dragging]);
  const current = grid && grid.design === design && !dragging ? grid.picture : null;
  return { scale, stage: scale ? { quads, grid: current, colour: scale.colour } : null };
}
