/**
 * The editions of every catalogue table a result used, so the sheet can print them.
 */
import type { JointModel } from "./joint-model";
import { getGasketTypeById } from "./catalogue/gaskets";
import { getFlangeTemplateById } from "./catalogue/flange-templates";
import { getTighteningMethodById } from "./catalogue/tightening-methods";
import { findWrenchClearance } from "./catalogue/wrench-clearance";
import type { Confidence } from "./catalogue/confidence";

export interface CatalogueEdition {
  table: string;
  rowId: string;
  source: string;
  edition: string;
  confidence: Confidence;
}

export function collectCatalogueEditions(model: JointModel): CatalogueEdition[] {
  const out: CatalogueEdition[] = [];
  const t = model.thread;
  out.push({ table: "threads", rowId: t.id, source: t.source, edition: t.edition, confidence: t.confidence });
  const m = model.material;
  out.push({
    table: "bolt-materials",
    rowId: m.id,
    source: m.source,
    edition: m.edition,
    confidence: model.strength.strengthConfidence,
  });
  if (model.strength.allowableMpa !== null && m.allowableSource) {
    out.push({
      table: "bolt-allowables",
      rowId: m.id,
      source: m.allowableSource,
      edition: m.edition,
      confidence: model.strength.allowableConfidence ?? "mem",
    });
  }
  if (model.nut)
    out.push({
      table: "nuts",
      rowId: model.nut.id,
      source: model.nut.source,
      edition: model.nut.edition,
      confidence: model.nut.confidence,
    });
  const gid = model.design.gasket.material.catalogueId;
  const g = gid ? getGasketTypeById(gid) : undefined;
  if (g)
    out.push({
      table: "gaskets",
      rowId: g.id,
      source: g.source,
      edition: g.edition,
      confidence: g.confidence,
    });
  const ft = model.design.templateId ? getFlangeTemplateById(model.design.templateId) : undefined;
  if (ft)
    out.push({
      table: "flange-templates",
      rowId: ft.id,
      source: ft.source,
      edition: ft.edition,
      confidence: ft.confidence,
    });
  const tm = getTighteningMethodById(model.design.assembly.method);
  if (tm)
    out.push({
      table: "tightening-methods",
      rowId: tm.id,
      source: tm.source,
      edition: tm.edition,
      confidence: tm.confidence,
    });
  const w = findWrenchClearance(t.designation);
  if (w)
    out.push({
      table: "wrench-clearance",
      rowId: w.id,
      source: w.source,
      edition: w.edition,
      confidence: w.confidence,
    });
  return out;
}
