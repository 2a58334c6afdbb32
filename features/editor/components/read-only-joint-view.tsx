"use client";
import { useMemo, useState } from "react";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import { highlightedBolts, toReadoutView } from "../model/readout-view";
import { useHeatMap } from "../hooks/use-heat-map";
import { JointCanvas } from "./joint-canvas";
import { ReadoutPanel } from "./readout-panel";
import { StressLegend } from "./stress-legend";

export interface ReadOnlyJointViewProps {
  document: JointDesign;
  result: JointAnalysis | null;
  unitSystem: UnitSystem;
  highlight?: { boltIds?: string[]; checkId?: string };
}

/**
 * The drawing and the readout without editing, for the review screen: pan, zoom and fit work,
 * clicking a check highlights its bolts. Shows the stored result as given (never recomputed).
 */
export function ReadOnlyJointView({ document, result, unitSystem, highlight }: ReadOnlyJointViewProps) {
  const view = useMemo(() => (result ? toReadoutView(result) : null), [result]);
  const [picked, setPicked] = useState<string | null>(highlight?.checkId ?? null);
  const [fitToken, setFitToken] = useState(0);
  const [selected, setSelected] = useState<string | null>(null);
  const heat = useHeatMap(document, view, false);
  const bolts = highlightedBolts(view, { boltIds: highlight?.boltIds, checkId: picked ?? undefined });
  return (
    <div className="grid gap-3 lg:grid-cols-[minmax(0,1fr)_26rem]">
      <div className="min-w-0">
        <div className="relative h-[560px] rounded-plate shadow-plate">
          <JointCanvas
            design={document}
            checks={view?.checks ?? []}
            heat={heat.stage}
            units={unitSystem}
            selectedId={selected}
            highlightBoltIds={bolts}
            readOnly
            fitToken={fitToken}
            onSelect={setSelected}
          />
          <button
            type="button"
            className="absolute right-2 top-2 rounded bg-white/90 px-2 py-1 text-micro shadow-plate"
            onClick={() => setFitToken((t) => t + 1)}
          >
            Fit
          </button>
        </div>
        {heat.scale && <StressLegend scale={heat.scale} units={unitSystem} basis="minimum preload" />}
      </div>
      <ReadoutPanel
        view={view}
        issues={[]}
        units={unitSystem}
        activeCheckId={picked}
        onPickCheck={setPicked}
        onPickBolt={setSelected}
        basis="stored"
      />
    </div>
  );
}
