/**
 * Preload scatter (±, as a fraction of the target) by tightening method. Ranges as reproduced
 * from Machinery's Handbook and NASA fastener design tables [pub2]; the core uses each range's
 * midpoint (the `scatter` field, [calc]) unless the design overrides it.
 */
import type { TighteningMethod } from "../design";
import type { Provenance } from "./confidence";

export interface TighteningMethodRow extends Provenance {
  id: TighteningMethod;
  name: string;
  rangeLow: number;
  rangeHigh: number;
  /** Midpoint of the range, used as ± scatter. */
  scatter: number;
  /** Tool that must fit around the nut, for the wrench clearance check. */
  tool: "socket" | "tensioner";
}

const RAW: [TighteningMethod, string, number, number, TighteningMethodRow["tool"]][] = [
  ["torque-wrench", "Torque wrench", 0.25, 0.35, "socket"],
  ["turn-of-nut", "Turn of nut", 0.15, 0.15, "socket"],
  ["hydraulic-tensioner", "Hydraulic bolt tensioner", 0.15, 0.15, "tensioner"],
  ["load-indicating-washer", "Load-indicating washer", 0.1, 0.1, "socket"],
  ["bolt-elongation", "Bolt elongation measured", 0.03, 0.05, "socket"],
  ["ultrasonic", "Ultrasonic elongation", 0.01, 0.1, "socket"],
];

export const TIGHTENING_METHODS: readonly TighteningMethodRow[] = RAW.map(([id, name, lo, hi, tool]) => ({
  id,
  name,
  rangeLow: lo,
  rangeHigh: hi,
  scatter: (lo + hi) / 2,
  tool,
  source: "Machinery's Handbook; NASA fastener design tables (preload scatter by method)",
  edition: "as reproduced (editions not verified); midpoint of the range used",
  confidence: "pub2",
}));

export function getTighteningMethodById(id: string): TighteningMethodRow | undefined {
  return TIGHTENING_METHODS.find((m) => m.id === id);
}
