// Turns imported geometry (outline, bolt holes, bore) into a complete JointDesign with the same
// starting defaults as the design templates (gasket, preload rule, loads). The designer confirms
// the preview and then edits the rest in the editor as usual.
import type { Gasket, JointDesign, Outline, UnitSystem } from "@/features/analysis/core/design";
import { THREADS } from "@/features/analysis/core/catalogue/threads";
import { bandWidthOnFaceMm } from "@/features/analysis/core/geometry";
import {
  DEFAULT_GASKET_TYPE_ID,
  STEEL_MODULUS_MPA,
  buildFastener,
  defaultJointSettings,
  gasketMaterialFromCatalogue,
} from "@/features/designs/model/template-defaults";
import { fitBoltPath, type FittedBolts } from "./fit-bolt-path";
import type { ImportedHole, ImportedOutline } from "./parse-dxf-flange";

/** Radial gap between the gasket edge and a hole or the bore, mm [practice] (as the templates). */
const GAP_MM = 3;
const DEFAULT_THICKNESS_MM = 25;
/** Width of the band gasket drawn inboard of the holes, and the narrowest one narrowed to fit the face, mm. */
const BAND_WIDTH_MM = 20;
const MIN_BAND_WIDTH_MM = 5;

export interface ImportedGeometry {
  outline: ImportedOutline;
  boltHoles: ImportedHole[];
  bore: { diameterMm: number } | null;
}

export interface BuiltImport {
  design: JointDesign;
  fit: FittedBolts;
  holeDiameterMm: number;
}

/** Largest thread (metric for SI, unified for US) that fits the hole with ≥ 1 mm clearance. */
export function pickBoltSize(holeDiameterMm: number, units: UnitSystem): string {
  const series = units === "US" ? ["unc", "unified-8un"] : ["metric-coarse"];
  const fitting = THREADS.filter(
    (t) => series.includes(t.series) && t.nominalDiameterMm <= holeDiameterMm - 1 + 1e-9,
  );
  const smallest = THREADS.filter((t) => series.includes(t.series)).sort(
    (a, b) => a.nominalDiameterMm - b.nominalDiameterMm,
  )[0];
  return (fitting.sort((a, b) => b.nominalDiameterMm - a.nominalDiameterMm)[0] ?? smallest).designation;
}

export function buildImportedDesign(
  meta: { name: string; units: UnitSystem; equipmentTag?: string },
  geo: ImportedGeometry,
): BuiltImport {
  const outline: Outline =
    geo.outline.kind === "circle"
      ? { kind: "circle", diameterMm: geo.outline.diameterMm }
      : { kind: "polygon", points: geo.outline.points };
  const centres = geo.boltHoles.map((h) => ({ x: h.xMm, y: h.yMm }));
  const fit = fitBoltPath(outline, centres);
  const holeDiameterMm = Math.max(...geo.boltHoles.map((h) => h.diameterMm));
  const designation = pickBoltSize(holeDiameterMm, meta.units);
  const material = gasketMaterialFromCatalogue(DEFAULT_GASKET_TYPE_ID);
  const bore: Outline | null = geo.bore ? { kind: "circle", diameterMm: geo.bore.diameterMm } : null;

  let gasket: Gasket;
  if (fit.boltPath.kind === "circle") {
    const outer = fit.boltPath.diameterMm - holeDiameterMm - 2 * GAP_MM;
    const inner = geo.bore ? geo.bore.diameterMm + 2 * GAP_MM : Math.max(outer - 80, outer / 2);
    gasket = {
      kind: "ring",
      geometry: { kind: "annulus", innerDiameterMm: Math.min(inner, outer - 2), outerDiameterMm: outer },
      material,
    };
  } else {
    // Narrow the band to the face between the holes and the bore; when even the narrowest does not
    // fit, keep the default and let the validator say that the band reaches over the bore.
    const edge = fit.boltPath.offsetMm + holeDiameterMm / 2 + GAP_MM;
    const width = bandWidthOnFaceMm(outline, bore, edge, {
      preferredMm: BAND_WIDTH_MM,
      minMm: MIN_BAND_WIDTH_MM,
      gapMm: GAP_MM,
    });
    gasket = {
      kind: "ring",
      geometry: {
        kind: "band",
        centreOffsetMm: edge + width / 2,
        widthMm: width,
      },
      material,
    };
  }

  const design: JointDesign = {
    schemaVersion: 1,
    name: meta.name,
    units: meta.units,
    outline,
    bore,
    gasket,
    boltPath: fit.boltPath,
    bolts: fit.bolts,
    fastener: buildFastener({
      designation,
      materialId: meta.units === "US" ? "astm-a193-b7" : "iso-898-1-8.8",
      holeDiameterMm,
      clampedMm: 2 * DEFAULT_THICKNESS_MM + material.thicknessMm,
      withWasher: false,
    }),
    layers: [
      {
        role: "flange",
        thicknessMm: DEFAULT_THICKNESS_MM,
        materialName: "Carbon steel",
        modulusMpa: STEEL_MODULUS_MPA,
      },
      { role: "gasket" },
      {
        role: "flange",
        thicknessMm: DEFAULT_THICKNESS_MM,
        materialName: "Carbon steel",
        modulusMpa: STEEL_MODULUS_MPA,
      },
    ],
    ...defaultJointSettings(),
  };
  return { design, fit, holeDiameterMm };
}
