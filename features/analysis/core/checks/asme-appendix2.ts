/**
 * ASME VIII-1 Appendix 2 bolt loads and areas: H = π/4·G²·P, Hp = 2b·π·G·m·P, Wm1 = H + Hp,
 * Wm2 = π·b·G·y, Am = max(Wm1/Sb, Wm2/Sa), Ab = n × ROOT area ≥ Am, W = (Am + Ab)·Sa/2.
 * Scope: circular flanges with a ring gasket inside the bolt holes. Non-circular and full-face
 * joints use the usual generalisation (πG → gasket reaction line length, π/4·G² → enclosed area),
 * which is [practice] and labelled so. Units: N, mm², MPa.
 */
import type { JointModel } from "../joint-model";
import { asmeGasketGeometry, type AsmeGasketGeometry } from "../asme-gasket-width";
import { makeCheck, type CheckRecord } from "./check-record";

export interface AsmeAppendix2Result {
  scope: "appendix-2" | "generalised-practice";
  geometry: AsmeGasketGeometry;
  reactionLengthMm: number;
  enclosedAreaMm2: number;
  hN: number;
  hpN: number;
  wm1N: number;
  wm2N: number;
  allowableMpa: number | null;
  requiredAreaMm2: number | null;
  /** n × root area. */
  actualRootAreaMm2: number;
  flangeDesignLoadN: number | null;
  notes: string[];
}

export function computeAsmeAppendix2(model: JointModel): {
  result: AsmeAppendix2Result;
  checks: CheckRecord[];
} {
  const d = model.design;
  const P = d.loads.designPressureMpa;
  const gm = d.gasket.material;
  const branch = d.units === "US" ? "inch" : "metric";
  const notes: string[] = [];
  let scope: AsmeAppendix2Result["scope"] = "appendix-2";
  let geometry: AsmeGasketGeometry;
  let reactionLengthMm: number;
  let enclosedAreaMm2: number;
  if (model.asmeGeometry) {
    geometry = model.asmeGeometry;
    reactionLengthMm = Math.PI * geometry.gMm;
    enclosedAreaMm2 = (Math.PI / 4) * geometry.gMm ** 2;
  } else {
    scope = "generalised-practice";
    const width = model.region.foundationWidthMm;
    // b0 = N/2 from the band (or land) width, by the same branch rule; reaction line = gasket path.
    geometry = asmeGasketGeometry(2 * width, 0, branch);
    reactionLengthMm = model.region.path.lengthMm;
    enclosedAreaMm2 = model.pressureAreaMm2;
    notes.push(
      "Outside Appendix 2 scope (non-circular or full-face gasket): πG replaced by the reaction line length and π/4·G² by the enclosed area [practice].",
    );
  }
  const b = geometry.bMm;
  const hN = enclosedAreaMm2 * P;
  const hpN = 2 * b * reactionLengthMm * gm.m * P;
  const wm1N = hN + hpN;
  const wm2N = b * reactionLengthMm * gm.yMpa;
  const entered = d.fastener.enteredAllowable ?? null;
  const S = entered ? entered.valueMpa : model.strength.allowableMpa;
  const stocked = d.fastener.stockedMaterial ?? null;
  const allowableLabel = entered
    ? `entered by the designer: ${entered.source}`
    : stocked
      ? `Stockroom row ${stocked.name}: ${stocked.source}`
      : (model.strength.allowableConfidence ?? "mem");
  notes.push(
    `Effective width b by the ${branch} branch (${geometry.unit}): b0 = ${geometry.b0.toFixed(4)}, b = ${geometry.b.toFixed(4)}, G = ${geometry.g.toFixed(4)} ${geometry.unit}.`,
  );
  if (entered)
    notes.push(
      `Sa = Sb = ${entered.valueMpa} MPa, the bolt allowable entered by the designer (${entered.source}).`,
    );
  else if (S !== null)
    notes.push(
      "Sa = Sb = room-temperature allowable (no temperature-dependent allowables in the catalogue).",
    );
  const noAllowable = `ASME VIII-1 lists no allowable bolt stress for ${model.material.name} (it is not a Section II-D bolting material), so Am cannot be computed. Enter an allowable bolt stress with its source (Bolting section) to run this check.`;
  const actualRootAreaMm2 = model.boltPoints.length * model.thread.rootAreaMm2;
  const requiredAreaMm2 = S !== null ? Math.max(wm1N / S, wm2N / S) : null;
  const flangeDesignLoadN =
    S !== null && requiredAreaMm2 !== null ? ((requiredAreaMm2 + actualRootAreaMm2) * S) / 2 : null;
  const src =
    scope === "appendix-2"
      ? "ASME VIII-1 Appendix 2 (2-5)"
      : "ASME VIII-1 Appendix 2 generalised to non-circular/full-face joints [practice]";
  const checks: CheckRecord[] = [
    makeCheck({
      id: "asme.app2.bolt-area",
      title: "ASME Appendix 2: total bolt root area Ab ≥ required Am",
      value: actualRootAreaMm2,
      limit: requiredAreaMm2,
      unit: "mm²",
      status:
        requiredAreaMm2 === null ? "not-applicable" : actualRootAreaMm2 >= requiredAreaMm2 ? "pass" : "fail",
      source: src,
      note:
        requiredAreaMm2 === null
          ? noAllowable
          : `Wm1 = ${(wm1N / 1000).toFixed(1)} kN, Wm2 = ${(wm2N / 1000).toFixed(1)} kN, S = ${S!.toFixed(1)} MPa (${allowableLabel}); Ab uses the ROOT area.`,
    }),
    makeCheck({
      id: "asme.app2.scope",
      title: "ASME Appendix 2 scope",
      value: null,
      limit: null,
      unit: "",
      status: scope === "appendix-2" ? "pass" : "warn",
      source: src,
      note:
        (scope === "appendix-2" ? "Circular flange with a ring gasket inside the bolt circle." : notes[0]) +
        (S === null
          ? ` The bolt loads are computed, but ${model.material.name} has no ASME allowable bolt stress: the bolt-area check waits for an entered allowable.`
          : ""),
    }),
  ];
  return {
    result: {
      scope,
      geometry,
      reactionLengthMm,
      enclosedAreaMm2,
      hN,
      hpN,
      wm1N,
      wm2N,
      allowableMpa: S,
      requiredAreaMm2,
      actualRootAreaMm2,
      flangeDesignLoadN,
      notes,
    },
    checks,
  };
}
