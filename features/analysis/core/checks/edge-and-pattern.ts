/**
 * Edge distances per bolt (nut and washer must bear fully on the flange; wrench must clear the
 * bore/hub) and, for circular pipe flanges, the pattern rules: bolt count a multiple of 4 and holes
 * straddling the centre lines [pub2/practice]. Units: mm.
 */
import type { JointModel } from "../joint-model";
import { signedDistanceToShape } from "../shape";
import { findWrenchClearance } from "../catalogue/wrench-clearance";
import { makeCheck, type CheckRecord } from "./check-record";
import * as fm from "../fixed-math";

export function checkEdgesAndPattern(model: JointModel): CheckRecord[] {
  const design = model.design;
  const out: CheckRecord[] = [];
  const d = model.nominalDiameterMm;
  const ac = model.nut?.acrossCornersMm ?? (1.5 * d) / fm.cos(Math.PI / 6);
  const bearingRadius = Math.max(ac, design.fastener.washer?.outerDiameterMm ?? 0) / 2;
  const tema = findWrenchClearance(model.thread.designation);
  model.boltPoints.forEach((p, i) => {
    const id = design.bolts[i].id;
    const edge = -signedDistanceToShape(model.region.outline, p.x, p.y);
    const temaNote = tema
      ? ` TEMA D-5 bolt-to-edge for ${tema.designation} in: ${tema.boltToEdgeMm.toFixed(1)} mm [${tema.confidence}].`
      : "";
    const temaFail = tema && tema.confidence !== "mem" && edge < tema.boltToEdgeMm;
    out.push(
      makeCheck({
        id: `edge.outline:${id}`,
        title: "Bolt to flange edge: nut or washer bears fully on the flange",
        value: edge,
        limit: bearingRadius,
        unit: "mm",
        status: edge < bearingRadius ? "warn" : temaFail ? "warn" : "pass",
        subject: [id],
        source: "half the nut across-corners (or washer OD) [practice]; TEMA Table D-5 where published",
        note: `Nut across corners ${ac.toFixed(1)} mm.${temaNote}`,
      }),
    );
    if (model.region.bore) {
      const toBore = signedDistanceToShape(model.region.bore, p.x, p.y);
      out.push(
        makeCheck({
          id: `edge.bore:${id}`,
          title: "Bolt to bore: wrench clears the bore edge",
          value: toBore,
          limit: ac / 2,
          unit: "mm",
          status: toBore >= ac / 2 ? "pass" : "warn",
          subject: [id],
          source: "half the nut across-corners [practice]",
          note: `A hub, if any, is not modelled: compare with the hub radius (TEMA 'bolt to hub' R${tema ? ` = ${tema.boltToHubMm.toFixed(1)} mm [${tema.confidence}]` : ""}).`,
        }),
      );
    }
  });
  const pipeFlange =
    design.outline.kind === "circle" && design.boltPath.kind === "circle" && design.bore !== null;
  const n = design.bolts.length;
  out.push(
    makeCheck({
      id: "pattern.bolt-count-multiple-of-4",
      title: "Bolt count is a multiple of 4 (circular pipe flange)",
      value: n,
      limit: null,
      unit: "bolts",
      status: !pipeFlange ? "not-applicable" : n % 4 === 0 ? "pass" : "warn",
      source: "pipe-flange practice (ASME B16.5, EN 1092-1 patterns) [pub2/practice]",
      note: pipeFlange
        ? "Lets the flange mate with standard patterns and straddle both centre lines."
        : "Applies to circular pipe flanges only.",
    }),
  );
  let worst = 0.5;
  if (pipeFlange && n > 0) {
    const L = model.boltPath.lengthMm;
    const pitch = L / n;
    for (let c = 0; c < 4; c++) {
      const sc = (c * L) / 4;
      let nearest = Infinity;
      for (const b of design.bolts) {
        const ds = Math.abs(((((b.sMm - sc) % L) + L * 1.5) % L) - L / 2);
        nearest = Math.min(nearest, ds);
      }
      worst = Math.min(worst, nearest / pitch);
    }
  }
  out.push(
    makeCheck({
      id: "pattern.centre-line-straddle",
      title: "Bolt holes straddle the centre lines",
      value: pipeFlange ? worst : null,
      limit: 0.45,
      unit: "pitch",
      status: !pipeFlange ? "not-applicable" : worst >= 0.45 ? "pass" : "warn",
      source: "pipe-flange practice [pub2/practice]",
      note: "Smallest distance from a centre line to the nearest bolt, as a fraction of the pitch (0.5 = straddling exactly).",
    }),
  );
  return out;
}
