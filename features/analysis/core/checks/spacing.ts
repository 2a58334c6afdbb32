/**
 * Spacing rules of the bolt pattern, one record per adjacent pair (ids such as
 * "spacing.max-pitch:b3-b4", with the two bolt ids in `subject`):
 * - maximum pitch for gasket tightness, Bs,max = 2a + 6t/(m + 0.5) [pub, ASME VIII-2 4.16.11];
 *   above 2a + t the flange moment is multiplied by √(Bs/(2a + t));
 * - minimum pitch for wrench clearance, from the nut's across-corners size and the tool [practice];
 * - pitch between 3 and 6 bolt diameters [practice] (a warning band, not a code limit);
 * - sealing by footprint overlap for full-face and metal-to-metal joints: chord ≤ 2·rc, the
 *   calibrated loaded-zone diameter (or D + 2h·tanα with a fixed angle) [calc/practice].
 * Pitch is measured along the bolt path, clearance as the chord. Units: mm.
 * On a standard flange (a design from a catalogue flange template) the maximum-pitch note says
 * that such a flange is accepted by its pressure–temperature rating; the status is still the rule's.
 */
import type { JointModel } from "../joint-model";
import { getNeighbourSpacings } from "../geometry";
import { standardFlangeRating } from "../flange-design/rating";
import { getTighteningMethodById } from "../catalogue/tightening-methods";
import { findWrenchClearance } from "../catalogue/wrench-clearance";
import { makeCheck, type CheckRecord } from "./check-record";
import * as fm from "../fixed-math";

/** Tool outside diameter around a nut of across-corners AC: socket wall ≈ 0.1·AC + 2 mm; tensioner ≈ 2.6·d [practice]. */
export function toolOutsideDiameterMm(
  tool: "socket" | "tensioner",
  acrossCornersMm: number,
  nominalDiameterMm: number,
): number {
  return tool === "socket"
    ? acrossCornersMm + 2 * (0.1 * acrossCornersMm + 2)
    : Math.max(2.6 * nominalDiameterMm, acrossCornersMm + 10);
}

/** Bs,max = 2a + 6t/(m + 0.5). Example: a = 19.05, t = 25.4, m = 3 → 81.6 mm. */
export function maxBoltPitchMm(boltDiameterMm: number, flangeThicknessMm: number, m: number): number {
  return 2 * boltDiameterMm + (6 * flangeThicknessMm) / (m + 0.5);
}

/** The limits the spacing rules apply to one joint model (mm); the pattern search prunes with them. */
export interface SpacingLimits {
  /** Bs,max = 2a + 6t/(m + 0.5): above it the pitch fails. */
  maxPitchMm: number;
  /** 2a + t: above it the pitch warns (flange moment multiplied). */
  momentPitchMm: number;
  /** Smallest chord the tool needs: half the nut across corners plus half the tool OD. */
  minChordMm: number;
  acrossCornersMm: number;
  toolOutsideDiameterMm: number;
  tool: "socket" | "tensioner";
  thinnestPlateMm: number;
}

export function spacingLimits(model: JointModel): SpacingLimits {
  const design = model.design;
  const d = model.nominalDiameterMm;
  const plates = design.layers.filter((l) => l.role !== "gasket") as { thicknessMm: number }[];
  const t = Math.min(...plates.map((l) => l.thicknessMm));
  const ac = model.nut?.acrossCornersMm ?? (1.5 * d) / fm.cos(Math.PI / 6);
  const tool = getTighteningMethodById(design.assembly.method)?.tool ?? "socket";
  const toolOd = toolOutsideDiameterMm(tool, ac, d);
  return {
    maxPitchMm: maxBoltPitchMm(d, t, design.gasket.material.m),
    momentPitchMm: 2 * d + t,
    minChordMm: ac / 2 + toolOd / 2,
    acrossCornersMm: ac,
    toolOutsideDiameterMm: toolOd,
    tool,
    thinnestPlateMm: t,
  };
}

export function checkSpacing(model: JointModel, coneGoverns: boolean): CheckRecord[] {
  const design = model.design;
  const spacings = getNeighbourSpacings(design);
  const d = model.nominalDiameterMm;
  const m = design.gasket.material.m;
  const limits = spacingLimits(model);
  const t = limits.thinnestPlateMm;
  const bsMax = limits.maxPitchMm;
  const bsMoment = limits.momentPitchMm;
  const ac = limits.acrossCornersMm;
  const tool = limits.tool;
  const toolOd = limits.toolOutsideDiameterMm;
  const minChord = limits.minChordMm;
  const tema = findWrenchClearance(model.thread.designation);
  const overlapApplies = design.gasket.kind === "full-face" || coneGoverns;
  const coneDiameter = 2 * model.coneRadiusMm;
  const rating = standardFlangeRating(design);
  const ratedNote = rating
    ? ` ${rating.reason}${rating.withinRating ? " This rule is for flanges designed by rule." : ""}`
    : "";
  const out: CheckRecord[] = [];
  for (const s of spacings) {
    const pair = `${s.fromId}-${s.toId}`;
    const subject = [s.fromId, s.toId];
    const factor = s.pitchMm > bsMoment ? Math.sqrt(s.pitchMm / bsMoment) : 1;
    out.push(
      makeCheck({
        id: `spacing.max-pitch:${pair}`,
        title: "Maximum bolt pitch for gasket tightness",
        value: s.pitchMm,
        limit: bsMax,
        unit: "mm",
        status:
          s.pitchMm > bsMoment && rating?.withinRating
            ? "accepted-by-rating"
            : s.pitchMm > bsMax
              ? "fail"
              : s.pitchMm > bsMoment
                ? "warn"
                : "pass",
        subject,
        source: "ASME VIII-2 4.16.11 (Bs,max = 2a + 6t/(m + 0.5)) [pub]",
        note:
          (factor > 1
            ? `Pitch above 2a + t = ${bsMoment.toFixed(1)} mm: flange moment multiplied by √(Bs/(2a + t)) = ${factor.toFixed(3)}.`
            : `t = ${t.toFixed(1)} mm (thinnest plate), m = ${m}.`) + ratedNote,
      }),
    );
    out.push(
      makeCheck({
        id: `spacing.min-pitch:${pair}`,
        title: "Minimum bolt spacing for wrench clearance",
        value: s.chordMm,
        limit: minChord,
        unit: "mm",
        status: s.chordMm >= minChord ? "pass" : "fail",
        subject,
        source: "nut across-corners + tool clearance (derived) [practice]",
        note: `${tool === "socket" ? "Socket" : "Tensioner"} OD ≈ ${toolOd.toFixed(1)} mm around a nut of ${ac.toFixed(1)} mm across corners.${tema ? ` TEMA D-5 minimum spacing for ${tema.designation} in: ${tema.minSpacingMm.toFixed(1)} mm [${tema.confidence}].` : ""}`,
      }),
    );
    const ratio = s.pitchMm / d;
    out.push(
      makeCheck({
        id: `spacing.pitch-band:${pair}`,
        title: "Bolt pitch between 3 and 6 bolt diameters",
        value: ratio,
        limit: null,
        unit: "d",
        status: ratio >= 3 && ratio <= 6 ? "pass" : "warn",
        subject,
        source: "common practice [practice]; ASME B16.5 Class 150 flanges span about 3.7–7.5 d [calc]",
        note: "A warning band, not a code limit.",
      }),
    );
    out.push(
      makeCheck({
        id: `spacing.cone-overlap:${pair}`,
        title: "Neighbouring pressure cones overlap at the gasket plane",
        value: s.chordMm,
        limit: coneDiameter,
        unit: "mm",
        status: !overlapApplies ? "not-applicable" : s.chordMm <= coneDiameter ? "pass" : "fail",
        subject,
        source:
          "footprint diameter 2·rc at the gasket plane: calibrated on FE (thickness-dependent setting) or D + 2h·tanα (fixed angle) [calc/practice]",
        note: overlapApplies
          ? `Footprint radius ${model.coneRadiusMm.toFixed(1)} mm at depth ${model.coneDepthMm.toFixed(1)} mm (${design.estimator.coneAngle.mode === "fixed" ? `fixed cone ${model.coneAngleDeg.toFixed(1)}°` : "calibrated on FE"}). Where footprints do not overlap the gasket between the bolts is unloaded.`
          : "Ring gasket loaded through flange bending; cone overlap does not govern sealing.",
      }),
    );
  }
  return out;
}
