/**
 * Colour scale of the gasket-stress heat map and the profile chart. Anchored on the
 * required seating stress: everything below it reads as a warning colour, so an unseated span is
 * visible at a glance whatever the maximum is. Stresses in MPa.
 */
import { colourRamp } from "@/features/ui/linear-scale";

export interface HeatScale {
  colour: (stressMpa: number) => string;
  /** Stops for the legend, low to high. */
  stops: { stressMpa: number; colour: string; label: string }[];
  maxMpa: number;
}

const UNLOADED = "#b3261e";
const BELOW = "#e7bd6e";
const SEATED = "#2f7d4f";
const HIGH = "#1d2739";

export function buildHeatScale(
  maxStressMpa: number,
  seatingMpa: number | null,
  crushMpa: number | null,
): HeatScale {
  const y = seatingMpa && seatingMpa > 0 ? seatingMpa : null;
  const top = Math.max(maxStressMpa, (y ?? 0) * 1.5, crushMpa ?? 0, 1e-3);
  const stops: HeatScale["stops"] = [{ stressMpa: 0, colour: UNLOADED, label: "0" }];
  if (y) {
    stops.push({ stressMpa: y * 0.999, colour: BELOW, label: "" });
    stops.push({ stressMpa: y, colour: "#8fbf8f", label: "seating" });
  }
  if (crushMpa && crushMpa > (y ?? 0)) {
    stops.push({ stressMpa: crushMpa * 0.999, colour: SEATED, label: "" });
    stops.push({ stressMpa: crushMpa, colour: HIGH, label: "crush" });
    if (top > crushMpa) stops.push({ stressMpa: top, colour: HIGH, label: "max" });
  } else {
    stops.push({ stressMpa: top, colour: SEATED, label: "max" });
  }
  const s = colourRamp(stops.map((x) => ({ value: x.stressMpa, colour: x.colour })));
  return { colour: (v) => s(Math.max(0, v)), stops, maxMpa: top };
}
