/**
 * Validity of the flange-design inputs (design.flangeDesign, fastener.enteredAllowable): catalogue
 * ids that exist, hub dimensions that make sense, allowables and C factors with a source.
 */
import type { JointDesign } from "../design";
import { getFlangeMaterialById } from "../catalogue/flange-materials";
import { getCoverSketch } from "./flat-cover";

export function validateFlangeInputs(design: JointDesign): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  const add = (path: string, message: string) => out.push({ path, message });
  const pos = (v: unknown) => typeof v === "number" && Number.isFinite(v) && v > 0;
  const ea = design.fastener.enteredAllowable;
  if (ea) {
    if (!pos(ea.valueMpa)) add("fastener.enteredAllowable.valueMpa", "must be greater than zero");
    if (!ea.source?.trim()) add("fastener.enteredAllowable.source", "name the source of the allowable");
  }
  const f = design.flangeDesign;
  if (!f) return out;
  if (f.hub) {
    if (!pos(f.hub.g0Mm)) add("flangeDesign.hub.g0Mm", "must be greater than zero");
    if (!pos(f.hub.g1Mm)) add("flangeDesign.hub.g1Mm", "must be greater than zero");
    if (!(f.hub.hMm >= 0)) add("flangeDesign.hub.hMm", "must be zero or positive");
    if (f.kind === "integral-hub" && f.hub.g1Mm < f.hub.g0Mm)
      add(
        "flangeDesign.hub.g1Mm",
        "hub thickness at the flange (g1) must not be less than at the small end (g0)",
      );
    if (f.kind === "integral-hub" && !(f.hub.hMm > 0))
      add("flangeDesign.hub.hMm", "a hubbed flange needs a hub length");
  }
  if (f.flangeMaterialId && !getFlangeMaterialById(f.flangeMaterialId))
    add("flangeDesign.flangeMaterialId", `unknown flange material "${f.flangeMaterialId}"`);
  if (f.coverMaterialId && !getFlangeMaterialById(f.coverMaterialId))
    add("flangeDesign.coverMaterialId", `unknown cover material "${f.coverMaterialId}"`);
  for (const k of ["flangeAllowable", "coverAllowable"] as const) {
    const a = f[k];
    if (!a) continue;
    if (!pos(a.designMpa)) add(`flangeDesign.${k}.designMpa`, "must be greater than zero");
    if (!pos(a.ambientMpa)) add(`flangeDesign.${k}.ambientMpa`, "must be greater than zero");
    if (!a.source?.trim()) add(`flangeDesign.${k}.source`, "name the source of the allowable");
  }
  const s = f.coverSketch;
  if (s?.kind === "catalogue" && !getCoverSketch(s.id))
    add("flangeDesign.coverSketch", `unknown cover sketch "${s.id}"`);
  if (s?.kind === "entered") {
    if (!(s.c > 0 && s.c <= 1)) add("flangeDesign.coverSketch.c", "C must be between 0 and 1");
    if (!s.source?.trim()) add("flangeDesign.coverSketch.source", "name the source of C");
  }
  if (f.testPressureMpa !== undefined && f.testPressureMpa !== null && !pos(f.testPressureMpa))
    add("flangeDesign.testPressureMpa", "must be greater than zero");
  return out;
}
