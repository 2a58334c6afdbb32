import type { Gasket, JointDesign } from "@/features/analysis/core/design";
import { bandWidthOnFaceMm } from "@/features/analysis/core/geometry";

/** Radial gap kept between a new ring gasket's edge and a bolt hole or the bore, mm [practice]. */
const GAP_MM = 3;
/** Width of a new band gasket along a cover's outline, mm [practice]. */
const BAND_WIDTH_MM = 20;
/** The narrowest band a new ring is narrowed to so that it stays on the face, mm. */
const MIN_BAND_WIDTH_MM = 5;

/**
 * The gasket with the other form (ring ↔ full face), keeping its material. A new ring sits inside
 * the bolt holes: an annulus from the bore to the holes on a bolt circle, a band just inside the
 * holes on a bolt path that follows the outline. The core validates the result as for any edit.
 */
export function withGasketForm(design: JointDesign, form: "ring" | "full-face"): Gasket {
  const g = design.gasket;
  if (g.kind === form) return g;
  if (form === "full-face") return { kind: "full-face", material: g.material };
  const hole = design.fastener.holeDiameterMm;
  if (design.boltPath.kind === "circle") {
    const bore = design.bore?.kind === "circle" ? design.bore.diameterMm : 0;
    return {
      kind: "ring",
      geometry: {
        kind: "annulus",
        innerDiameterMm: bore + 2 * GAP_MM,
        outerDiameterMm: design.boltPath.diameterMm - hole - 2 * GAP_MM,
      },
      material: g.material,
    };
  }
  const edge = design.boltPath.offsetMm + hole / 2 + GAP_MM;
  const width = bandWidthOnFaceMm(design.outline, design.bore, edge, {
    preferredMm: BAND_WIDTH_MM,
    minMm: MIN_BAND_WIDTH_MM,
    gapMm: GAP_MM,
  });
  return {
    kind: "ring",
    geometry: { kind: "band", centreOffsetMm: edge + width / 2, widthMm: width },
    material: g.material,
  };
}
