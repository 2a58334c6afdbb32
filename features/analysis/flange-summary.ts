/**
 * The "Flange" section's lines, read from a stored or live JointAnalysis: shared by the Readout,
 * the sign-off sheet and the bolt-spacing PDF so the three never disagree. Reads only; a result from
 * a core before 1.2.0 has no flange design and gets one line saying so.
 */
import type { JointAnalysis } from "./core/analyze";
import type { UnitSystem } from "./core/design";
import { formatForce, formatLength, formatStress, nmmToNm, nmmToFtLb } from "./core/units";

export interface FlangeSummaryLine {
  label: string;
  value: string;
}

const KIND_TEXT = {
  "integral-hub": "integral, with tapered hub",
  "integral-no-hub": "integral, no hub taper",
  "ring-loose": "loose ring, no hub",
} as const;

function moment(nmm: number | null, units: UnitSystem): string {
  if (nmm === null) return "—";
  return units === "US"
    ? `${Number((nmmToFtLb(nmm) * 12).toPrecision(4))} lbf·in`
    : `${Number((nmmToNm(nmm) / 1000).toPrecision(4))} kN·m`;
}

/** One label/value per line; an empty list never (the section always says something). */
export function flangeSummaryLines(
  analysis: Pick<JointAnalysis, "flangeDesign"> | null,
  units: UnitSystem,
): FlangeSummaryLine[] {
  const f = (analysis as Partial<Pick<JointAnalysis, "flangeDesign">> | null)?.flangeDesign;
  if (!f) return [{ label: "Flange design", value: "not in this result (computed by core 1.2.0 and later)" }];
  const s = (v: number | null) => (v === null ? "—" : formatStress(v, units));
  const L = (v: number | null) => (v === null ? "—" : formatLength(v, units));
  const out: FlangeSummaryLine[] = [];
  const a = f.appendix2;
  if (a) {
    out.push({ label: "Appendix 2 flange", value: KIND_TEXT[a.kind] });
    out.push({
      label: "Moment arms hD, hT, hG",
      value: `${L(a.armDMm)}, ${L(a.armTMm)}, ${L(a.armGMm)}`,
    });
    out.push({
      label: "Shape factors",
      value: `K ${a.ring.K.toFixed(4)}, T ${a.ring.T.toFixed(4)}, U ${a.ring.U.toFixed(4)}, Y ${a.ring.Y.toFixed(4)}, Z ${a.ring.Z.toFixed(4)}${a.hub ? `; F ${a.hub.F.toFixed(5)}, V ${a.hub.V.toFixed(5)}, f ${a.hub.f.toFixed(3)}, L ${a.hub.L.toFixed(4)}` : ""}`,
    });
    for (const c of a.conditions) {
      const name = c.condition === "operating" ? "Operating" : "Gasket seating";
      out.push({
        label: `${name}: Mo; SH, SR, ST (Sf)`,
        value: `${moment(c.momentNmm, units)}; ${s(c.shMpa)}, ${s(c.srMpa)}, ${s(c.stMpa)} (${s(c.allowableMpa)})`,
      });
      out.push({
        label: `${name}: rigidity J (${a.rigidityFactor.name} ${a.rigidityFactor.value})`,
        value: c.rigidity === null ? "—" : c.rigidity.toFixed(3),
      });
    }
    out.push({ label: "Flange allowable Sf", value: a.allowable.source });
  } else if (f.appendix2Reason) out.push({ label: "Appendix 2 flange", value: f.appendix2Reason });
  const c = f.cover;
  if (c) {
    out.push({
      label: `UG-34 ${c.shape} cover: t required / actual`,
      value: `${L(c.requiredThicknessMm)} / ${L(c.actualThicknessMm)} (operating ${L(c.operatingThicknessMm)}, seating ${L(c.seatingThicknessMm)})`,
    });
    out.push({
      label: "Cover d, hG, C",
      value: `${L(c.dMm)}${c.z !== null ? ` (D ${L(c.longSpanMm)}, Z ${c.z.toFixed(3)})` : ""}, ${L(c.hGMm)}, C ${c.c} — ${c.cSource}`,
    });
  } else if (f.coverReason && f.coverReason !== "No cover layer.")
    out.push({ label: "UG-34 cover", value: f.coverReason });
  const t = f.thermal;
  if (t)
    out.push({
      label: `Bolt load at ${t.temperatureC} °C (min preload)`,
      value: `${formatForce(t.minPreloadN, units)} → ${formatForce(t.minAtTemperatureN, units)} per bolt (differential expansion ${L(t.interferenceChangeMm)}, stiffness × ${t.stiffnessRatio.toFixed(3)}; ${t.source})`,
    });
  else if (f.thermalReason)
    out.push({ label: "Operating case at design temperature", value: f.thermalReason });
  const h = f.hydrotest;
  out.push({
    label: "Hydrostatic test pressure",
    value: `${h.enteredMpa === null ? "not entered" : `${formatStress(h.enteredMpa, units)} entered`}; suggestion ${h.suggestedMpa === null ? "—" : formatStress(h.suggestedMpa, units)} (${h.source})`,
  });
  const tc = h.testCase;
  if (tc) {
    out.push({
      label: "Test case: Wm1 at Pt / bolts at min preload",
      value: `${formatForce(tc.wm1N, units)} / ${formatForce(tc.minPreloadTotalN, units)} (Ht ${formatForce(tc.hN, units)}, Hpt ${formatForce(tc.hpN, units)})`,
    });
    out.push({
      label: "Test case: bolt stress at max preload (limit)",
      value: `${s(tc.boltStressMpa)} (${s(tc.boltLimitMpa)})`,
    });
    if (tc.flange)
      out.push({
        label: "Test case: flange SH, SR, ST (0.9·Sy)",
        value: `${s(tc.flange.shMpa)}, ${s(tc.flange.srMpa)}, ${s(tc.flange.stMpa)} (${s(tc.flange.limitMpa)}); Sy ${tc.flange.yieldSource}`,
      });
    else if (tc.flangeReason && f.appendix2)
      out.push({ label: "Test case: flange stresses", value: tc.flangeReason });
    if (tc.cover)
      out.push({
        label: "Test case: cover t required / actual",
        value: `${L(tc.cover.requiredThicknessMm)} / ${L(tc.cover.actualThicknessMm)} (S ${s(tc.cover.allowableMpa)}; Sy ${tc.cover.yieldSource})`,
      });
    else if (tc.coverReason && f.cover) out.push({ label: "Test case: cover", value: tc.coverReason });
  } else if (h.testCase === undefined && h.enteredMpa !== null)
    out.push({ label: "Test case", value: "not in this result (computed by core 2.2.0 and later)" });
  return out;
}
