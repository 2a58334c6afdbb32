/**
 * The flange itself: ASME VIII-1 Appendix 2 flange stresses and rigidity of the first "flange"
 * layer of a circular joint, UG-34 thickness of a bolted flat "cover" layer (circular or not), and
 * the UG-99 hydrostatic test pressure suggestion. Results are the core's standard check records
 * (rule ids `flange.app2.*`, `flange.ug34.*`, `flange.test.*`). Flange design rules are
 * code-specific: these are ASME VIII-1's, and a competent engineer signs the design off.
 */
import type { EnteredAllowable, FlangeDesignInputs, JointDesign } from "../design";
import type { JointModel } from "../joint-model";
import type { AsmeAppendix2Result } from "../checks/asme-appendix2";
import { makeCheck, type CheckRecord } from "../checks/check-record";
import { outlineToShape, shapeBounds } from "../shape";
import {
  AMBIENT_TEMPERATURE_C,
  getFlangeMaterialById,
  valueAtTemperature,
  type FlangeMaterialRow,
} from "../catalogue/flange-materials";
import {
  computeAppendix2Flange,
  stressLimits,
  type Appendix2FlangeInput,
  type Appendix2FlangeKind,
  type Appendix2FlangeResult,
} from "./appendix2-flange";
import { ratingChecks, standardFlangeRating, type StandardRating } from "./rating";
import { computeThermalCase, type ThermalCase } from "./thermal";
import { coverThicknessMm, getCoverSketch, nonCircularZ, type CoverGeometry } from "./flat-cover";
import { computeHydrotestCase, type HydrotestCase, type HydrotestContext } from "./hydrotest";

export interface ResolvedAllowable {
  designMpa: number | null;
  ambientMpa: number | null;
  source: string;
  materialId: string | null;
}

export interface FlangeDesignResult {
  inputsEntered: boolean;
  appendix2: (Appendix2FlangeResult & { allowable: ResolvedAllowable; modulusSource: string }) | null;
  appendix2Reason: string | null;
  cover: {
    shape: CoverGeometry["shape"];
    dMm: number;
    longSpanMm: number | null;
    z: number | null;
    hGMm: number;
    c: number;
    cSource: string;
    allowable: ResolvedAllowable;
    operatingThicknessMm: number | null;
    seatingThicknessMm: number | null;
    requiredThicknessMm: number | null;
    actualThicknessMm: number;
  } | null;
  coverReason: string | null;
  hydrotest: {
    suggestedMpa: number | null;
    enteredMpa: number | null;
    source: string;
    /** The test case at the entered pressure; absent from results stored before core 2.2.0. */
    testCase?: HydrotestCase | null;
    testCaseReason?: string | null;
  };
  /** Rating of a standard flange (template row), null for a custom flange. */
  rating: StandardRating | null;
  /** Operating case at design temperature (differential expansion, moduli by temperature). */
  thermal: ThermalCase | null;
  thermalReason: string | null;
}

const APP2 = "ASME VIII-1 Appendix 2";
const UG34 = "ASME VIII-1 UG-34";
const UG99 = "ASME VIII-1 UG-99(b): 1.3 × MAWP × (S at test temperature / S at design temperature)";

function resolveAllowable(
  entered: EnteredAllowable | null | undefined,
  materialId: string | null | undefined,
  designTempC: number,
): ResolvedAllowable & { row: FlangeMaterialRow | null } {
  const row = materialId ? (getFlangeMaterialById(materialId) ?? null) : null;
  if (entered)
    return {
      designMpa: entered.designMpa,
      ambientMpa: entered.ambientMpa,
      source: `entered by the designer: ${entered.source}`,
      materialId: materialId ?? null,
      row,
    };
  if (row)
    return {
      designMpa: valueAtTemperature(row.allowable, designTempC),
      ambientMpa: valueAtTemperature(row.allowable, AMBIENT_TEMPERATURE_C),
      source: `${row.name}: ${row.source}, ${row.edition} [${row.confidence}]`,
      materialId: row.id,
      row,
    };
  return {
    designMpa: null,
    ambientMpa: null,
    source: "no material or allowable entered",
    materialId: null,
    row,
  };
}

function flangeLayerThickness(design: JointDesign, role: "flange" | "cover"): number | null {
  for (const l of design.layers) if (l.role === role) return l.thicknessMm;
  return null;
}

const fmt = (v: number | null, digits = 1) => (v === null ? "—" : v.toFixed(digits));

function appendix2Checks(
  model: JointModel,
  asme: AsmeAppendix2Result,
  inputs: FlangeDesignInputs | undefined,
): {
  result: FlangeDesignResult["appendix2"];
  reason: string | null;
  checks: CheckRecord[];
  context?: HydrotestContext["appendix2"];
} {
  const d = model.design;
  const t = flangeLayerThickness(d, "flange");
  const scopeCheck = (status: CheckRecord["status"], note: string): CheckRecord =>
    makeCheck({
      id: "flange.app2.scope",
      title: "Appendix 2 flange design: scope",
      value: null,
      limit: null,
      unit: "",
      status,
      source: `${APP2} (2-1, 2-4)`,
      note,
    });
  let reason: string | null = null;
  if (t === null) reason = "No flange layer: the joint has no flange for Appendix 2 to size.";
  else if (d.outline.kind !== "circle" || d.bore?.kind !== "circle" || d.boltPath.kind !== "circle")
    reason =
      "Appendix 2 flange design covers circular flanges with a bore on a bolt circle; this joint is not one (a non-circular cover is sized by UG-34 below).";
  else if (!model.asmeGeometry || asme.scope !== "appendix-2")
    reason = "Appendix 2 flange design needs a ring gasket inside the bolt holes (G from Table 2-5.2).";
  else if (!inputs || inputs.kind === "not-entered")
    reason =
      "Flange type not entered (integral with hub, integral without hub, or loose ring): stresses not computed.";
  else if (inputs.kind !== "ring-loose" && !inputs.hub)
    reason = "Integral flange without hub or shell dimensions (g0, g1, h): stresses not computed.";
  if (reason !== null) return { result: null, reason, checks: [scopeCheck("not-applicable", reason)] };

  const kind = inputs!.kind as Appendix2FlangeKind;
  const allowable = resolveAllowable(
    inputs!.flangeAllowable,
    inputs!.flangeMaterialId,
    d.loads.designTemperatureC,
  );
  const layer = d.layers.find((l) => l.role === "flange");
  const layerE = layer && layer.role === "flange" ? layer.modulusMpa : 200_000;
  const eDesign = allowable.row
    ? valueAtTemperature(allowable.row.modulus, d.loads.designTemperatureC)
    : null;
  const eAmbient = allowable.row ? valueAtTemperature(allowable.row.modulus, AMBIENT_TEMPERATURE_C) : null;
  const modulusSource =
    eDesign !== null && eAmbient !== null && allowable.row
      ? `${allowable.row.name}: ASME II-D Table TM-1 [${allowable.row.confidence}]`
      : "flange layer modulus (no temperature dependence)";
  const hub = inputs!.hub ?? null;
  const a2Input: Appendix2FlangeInput = {
    kind,
    aMm: d.outline.kind === "circle" ? d.outline.diameterMm : 0,
    bMm: d.bore?.kind === "circle" ? d.bore.diameterMm : 0,
    cMm: d.boltPath.kind === "circle" ? d.boltPath.diameterMm : 0,
    tMm: t!,
    g0Mm: hub?.g0Mm,
    g1Mm: hub?.g1Mm,
    hMm: hub?.hMm,
    gMm: asme.geometry.gMm,
    pressureMpa: d.loads.designPressureMpa,
    hN: asme.hN,
    hpN: asme.hpN,
    wm1N: asme.wm1N,
    seatingBoltLoadN: asme.flangeDesignLoadN,
    sfDesignMpa: allowable.designMpa,
    sfAmbientMpa: allowable.ambientMpa,
    eDesignMpa: eDesign ?? layerE,
    eAmbientMpa: eAmbient ?? layerE,
  };
  const r = computeAppendix2Flange(a2Input);
  const kindLabel =
    kind === "integral-hub"
      ? "integral flange with hub"
      : kind === "integral-no-hub"
        ? "integral flange without hub taper (g1 = g0)"
        : "loose ring flange without hub";
  const checks: CheckRecord[] = [
    scopeCheck(
      "pass",
      `Circular ${kindLabel}; K = ${r.ring.K.toFixed(4)}, hD = ${r.armDMm.toFixed(1)} mm, hT = ${r.armTMm.toFixed(1)} mm, hG = ${r.armGMm.toFixed(1)} mm${r.hub ? `; F = ${r.hub.F.toFixed(5)}, V = ${r.hub.V.toFixed(5)}, f = ${r.hub.f.toFixed(3)}, L = ${r.hub.L.toFixed(4)}` : ""}.`,
    ),
  ];
  for (const c of r.conditions) {
    const condLabel =
      c.condition === "operating" ? "operating (design temperature)" : "gasket seating (ambient)";
    const limits = stressLimits(kind, c);
    if (limits.length === 0) {
      const why =
        c.momentNmm === null
          ? "no bolt allowable, so the seating design bolt load W = (Am + Ab)·Sa/2 is unknown"
          : `no allowable flange stress (${allowable.source}); pick a flange material or enter the allowable with its source`;
      checks.push(
        makeCheck({
          id: `flange.app2.stress:${c.condition}`,
          title: "Appendix 2 flange stresses within their allowables",
          value: null,
          limit: null,
          unit: "MPa",
          status: "not-applicable",
          source: `${APP2} (2-7, 2-8)`,
          note: `${condLabel}: not checked — ${why}.`,
        }),
      );
    }
    for (const l of limits)
      checks.push(
        makeCheck({
          id: `flange.app2.${l.key}:${c.condition}`,
          title: `Appendix 2 flange: ${l.label}`,
          value: l.value,
          limit: l.limit,
          unit: "MPa",
          status: l.value <= l.limit ? "pass" : "fail",
          source: `${APP2} (2-7, 2-8); Sf ${allowable.source}`,
          note: `${condLabel}: Mo = ${fmt(c.momentNmm === null ? null : c.momentNmm / 1e6, 2)} kN·m, SH = ${fmt(c.shMpa)}, SR = ${fmt(c.srMpa)}, ST = ${fmt(c.stMpa)} MPa, Sf = ${fmt(c.allowableMpa)} MPa.`,
        }),
      );
    checks.push(
      makeCheck({
        id: `flange.app2.rigidity:${c.condition}`,
        title: `Appendix 2 flange rigidity index J ≤ 1 (${r.rigidityFactor.name} = ${r.rigidityFactor.value})`,
        value: c.rigidity,
        limit: 1,
        unit: "",
        status: c.rigidity === null ? "not-applicable" : c.rigidity <= 1 ? "pass" : "fail",
        source: `${APP2} 2-14; E ${modulusSource}`,
        note:
          c.rigidity === null
            ? `${condLabel}: not computed — the moment for this condition is unknown.`
            : `${condLabel}: J = ${c.rigidity.toFixed(3)} (flange rotation check).`,
      }),
    );
  }
  return {
    result: { ...r, allowable, modulusSource },
    reason: null,
    checks,
    context: { input: a2Input, material: allowable.row },
  };
}

function coverChecks(
  model: JointModel,
  asme: AsmeAppendix2Result,
  inputs: FlangeDesignInputs | undefined,
): {
  result: FlangeDesignResult["cover"];
  reason: string | null;
  checks: CheckRecord[];
  context?: HydrotestContext["cover"];
} {
  const d = model.design;
  const t = flangeLayerThickness(d, "cover");
  const na = (reason: string) => ({
    result: null,
    reason,
    checks:
      t === null
        ? []
        : [
            makeCheck({
              id: "flange.ug34.thickness",
              title: "UG-34 bolted flat cover: thickness ≥ required",
              value: t,
              limit: null,
              unit: "mm",
              status: "not-applicable" as const,
              source: `${UG34} (c)(2), (c)(3)`,
              note: reason,
            }),
          ],
  });
  if (t === null) return na("No cover layer.");
  const sketchInput = inputs?.coverSketch ?? null;
  const sketch =
    sketchInput === null
      ? null
      : sketchInput.kind === "entered"
        ? { c: sketchInput.c, source: `entered by the designer: ${sketchInput.source}` }
        : (getCoverSketch(sketchInput.id) ?? null);
  if (!sketch) return na("Cover attachment sketch (C factor) not chosen: thickness not computed.");
  const allowable = resolveAllowable(
    inputs?.coverAllowable,
    inputs?.coverMaterialId,
    d.loads.designTemperatureC,
  );
  if (allowable.designMpa === null || allowable.ambientMpa === null)
    return na(
      `No allowable cover stress (${allowable.source}): pick a cover material or enter the allowable with its source.`,
    );
  const g = d.gasket;
  let geom: CoverGeometry;
  let fullFace = false;
  if (d.outline.kind === "circle" && d.boltPath.kind === "circle" && model.asmeGeometry) {
    const G = model.asmeGeometry.gMm;
    geom = {
      shape: "circular",
      dMm: G,
      hGMm: (d.boltPath.diameterMm - G) / 2,
      c: sketch.c,
      jointEfficiency: 1,
    };
  } else if (g.kind === "ring" && g.geometry.kind === "band" && d.boltPath.kind === "offset") {
    // Reaction line: contact outer edge offset inward by b when b0 exceeds the branch limit, else the band centre line.
    const limitMm = asme.geometry.branch === "inch" ? 6.35 : 6;
    const w = g.geometry.widthMm;
    const reactionOffset =
      asme.geometry.b0Mm > limitMm
        ? g.geometry.centreOffsetMm - w / 2 + asme.geometry.bMm
        : g.geometry.centreOffsetMm;
    const b = shapeBounds(outlineToShape(d.outline));
    const spanX = b.xMaxMm - b.xMinMm - 2 * reactionOffset;
    const spanY = b.yMaxMm - b.yMinMm - 2 * reactionOffset;
    geom = {
      shape: "non-circular",
      dMm: Math.min(spanX, spanY),
      longSpanMm: Math.max(spanX, spanY),
      perimeterMm: model.boltPath.lengthMm,
      hGMm: reactionOffset - d.boltPath.offsetMm,
      c: sketch.c,
      jointEfficiency: 1,
    };
  } else if (g.kind === "full-face") {
    // Full-face gasket: outside UG-34's ring-gasket sketches; the reaction is taken on the bolt path (hG = 0) [practice].
    fullFace = true;
    if (d.boltPath.kind === "circle") {
      geom = { shape: "circular", dMm: d.boltPath.diameterMm, hGMm: 0, c: sketch.c, jointEfficiency: 1 };
    } else {
      const b = shapeBounds(outlineToShape(d.outline));
      const off = d.boltPath.offsetMm;
      const spanX = b.xMaxMm - b.xMinMm - 2 * off;
      const spanY = b.yMaxMm - b.yMinMm - 2 * off;
      geom = {
        shape: d.outline.kind === "circle" ? "circular" : "non-circular",
        dMm: Math.min(spanX, spanY),
        longSpanMm: Math.max(spanX, spanY),
        perimeterMm: model.boltPath.lengthMm,
        hGMm: 0,
        c: sketch.c,
        jointEfficiency: 1,
      };
    }
  } else
    return na("UG-34 bolted-cover sizing needs a ring gasket inside the bolt path or a full-face gasket.");
  const op = coverThicknessMm(geom, {
    pressureMpa: d.loads.designPressureMpa,
    allowableMpa: allowable.designMpa,
    boltLoadN: asme.wm1N,
  });
  const seat =
    asme.flangeDesignLoadN === null
      ? null
      : coverThicknessMm(geom, {
          pressureMpa: 0,
          allowableMpa: allowable.ambientMpa,
          boltLoadN: asme.flangeDesignLoadN,
        });
  const required = Math.max(op, seat ?? 0);
  const z = geom.shape === "non-circular" ? nonCircularZ(geom.dMm, geom.longSpanMm!) : null;
  const result: FlangeDesignResult["cover"] = {
    shape: geom.shape,
    dMm: geom.dMm,
    longSpanMm: geom.longSpanMm ?? null,
    z,
    hGMm: geom.hGMm,
    c: geom.c,
    cSource: sketch.source,
    allowable,
    operatingThicknessMm: op,
    seatingThicknessMm: seat,
    requiredThicknessMm: required,
    actualThicknessMm: t,
  };
  const checks = [
    makeCheck({
      id: "flange.ug34.thickness",
      title: "UG-34 bolted flat cover: thickness ≥ required",
      value: t,
      limit: required,
      unit: "mm",
      status: t >= required ? "pass" : "fail",
      source: `${UG34} ${geom.shape === "circular" ? "(c)(2) formula (2)" : "(c)(3) formulas (4), (5)"}${fullFace ? " generalised to a full-face gasket (reaction on the bolt path, hG = 0) [practice]" : ""}; C ${sketch.source}; S ${allowable.source}`,
      note: `${geom.shape === "circular" ? `d = G = ${geom.dMm.toFixed(1)} mm` : `d = ${geom.dMm.toFixed(1)} mm, D = ${geom.longSpanMm!.toFixed(1)} mm, Z = ${z!.toFixed(3)}, L = ${geom.perimeterMm!.toFixed(0)} mm`}, hG = ${geom.hGMm.toFixed(1)} mm, C = ${geom.c}, E = 1 (one-piece cover [practice]); operating t = ${op.toFixed(1)} mm, gasket seating t = ${fmt(seat)} mm${seat === null ? " (no bolt allowable: seating not computed)" : ""}.`,
    }),
  ];
  return {
    result,
    reason: null,
    checks,
    context: { geometry: geom, material: allowable.row, actualThicknessMm: t },
  };
}

export function computeFlangeDesign(
  model: JointModel,
  asme: AsmeAppendix2Result,
): { result: FlangeDesignResult; checks: CheckRecord[] } {
  const d = model.design;
  const inputs = d.flangeDesign;
  const a2 = appendix2Checks(model, asme, inputs);
  const cover = coverChecks(model, asme, inputs);
  const flangeAllow = resolveAllowable(
    inputs?.flangeAllowable,
    inputs?.flangeMaterialId,
    d.loads.designTemperatureC,
  );
  const ratio =
    flangeAllow.designMpa !== null && flangeAllow.ambientMpa !== null && flangeAllow.designMpa > 0
      ? flangeAllow.ambientMpa / flangeAllow.designMpa
      : null;
  const suggested = ratio === null ? null : 1.3 * d.loads.designPressureMpa * ratio;
  const rating = standardFlangeRating(d);
  const thermal = computeThermalCase(model, asme);
  const test = computeHydrotestCase(model, asme, inputs?.testPressureMpa ?? null, {
    appendix2: a2.context ?? null,
    cover: cover.context ?? null,
  });
  return {
    result: {
      inputsEntered: !!inputs && inputs.kind !== "not-entered",
      appendix2: a2.result,
      appendix2Reason: a2.reason,
      cover: cover.result,
      coverReason: cover.reason,
      hydrotest: {
        suggestedMpa: suggested,
        enteredMpa: inputs?.testPressureMpa ?? null,
        source:
          suggested === null
            ? `${UG99}; needs the flange material's allowables (design pressure taken as MAWP)`
            : `${UG99}; design pressure taken as MAWP, stress ratio ${ratio!.toFixed(3)} from ${flangeAllow.source} — a suggestion, the test pressure is the designer's to enter`,
        testCase: test.result,
        testCaseReason: test.reason,
      },
      rating,
      thermal: thermal.result,
      thermalReason: thermal.reason,
    },
    checks: [
      ...ratingChecks(rating, d.loads.designPressureMpa),
      ...a2.checks,
      ...cover.checks,
      ...thermal.checks,
      ...test.checks,
    ],
  };
}
