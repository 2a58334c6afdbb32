// The core's built-in catalogues mapped to Stockroom DTOs (read-only rows).
import { BOLT_MATERIALS } from "@/features/analysis/core/catalogue/bolt-materials";
import { FLANGE_TEMPLATES } from "@/features/analysis/core/catalogue/flange-templates";
import { GASKET_TYPES } from "@/features/analysis/core/catalogue/gaskets";
import type { BoltingChoiceDto, FlangeTemplateChoiceDto, GasketChoiceDto } from "./dto";

export function builtinGaskets(): GasketChoiceDto[] {
  return GASKET_TYPES.map((g) => ({
    id: `builtin:${g.id}`,
    origin: "builtin",
    rowId: g.id,
    hidden: false,
    name: g.name,
    gasketType: g.family,
    m: g.m,
    yMpa: g.yMpa,
    tightness: {},
    qsMaxMpa: g.qsMaxMpa ?? null,
    pqr: null,
    egMpa: null,
    modulusMpa: g.typicalModulusMpa,
    thicknessMm: g.typicalThicknessMm,
    source: g.source,
    edition: g.edition,
    confidence: g.confidence,
  }));
}

export function builtinBolting(): BoltingChoiceDto[] {
  return BOLT_MATERIALS.map((b) => ({
    id: `builtin:${b.id}`,
    origin: "builtin",
    rowId: b.id,
    hidden: false,
    name: b.name,
    modulusMpa: b.modulusMpa,
    ranges: b.ranges.map((r) => ({
      maxDiameterMm: r.maxDiameterMm,
      proofMpa: r.proofMpa,
      yieldMpa: r.yieldMpa,
      tensileMpa: r.tensileMpa,
      allowableMpa: r.allowableMpa,
    })),
    allowableSource: b.allowableSource,
    source: b.source,
    edition: b.edition,
    confidence: b.confidence,
  }));
}

export function builtinFlangeTemplates(): FlangeTemplateChoiceDto[] {
  return FLANGE_TEMPLATES.map((t) => ({
    id: `builtin:${t.id}`,
    origin: "builtin",
    rowId: t.id,
    hidden: false,
    standard: t.standard,
    pressureClass: `Class ${t.pressureClass}`,
    size: `NPS ${t.nps}`,
    outsideDiameterMm: t.outsideDiameterMm,
    boreDiameterMm: null,
    boltCircleDiameterMm: t.boltCircleDiameterMm,
    boltCount: t.boltCount,
    boltDesignation: t.boltDesignation,
    boltDiameterMm: t.boltDiameterMm,
    holeDiameterMm: t.holeDiameterMm,
    source: t.source,
    edition: t.edition,
    confidence: t.confidence,
  }));
}
