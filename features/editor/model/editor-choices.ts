/**
 * The Layout desk's "editor choices": the option lists of the Joint data form (bolt sizes, bolt,
 * flange and cover materials, cover sketches, tightening methods), the bolt materials' allowable
 * stress by size, and the built-in gasket rows the gasket picker shows until the Stockroom list
 * arrives. Built on the server from the core's catalogue (the design and revision pages) and sent
 * as plain data, so the form's client code loads no catalogue table on first load. Pure.
 * Only `import type` from client components: the builder itself pulls the tables in.
 */
import { BOLT_MATERIALS } from "@/features/analysis/core/catalogue/bolt-materials";
import { FLANGE_MATERIALS } from "@/features/analysis/core/catalogue/flange-materials";
import type { ThreadKey } from "@/features/analysis/core/catalogue/lookups";
import { THREADS } from "@/features/analysis/core/catalogue/threads";
import { TIGHTENING_METHODS } from "@/features/analysis/core/catalogue/tightening-methods";
import type { TighteningMethod } from "@/features/analysis/core/design";
import { COVER_SKETCHES } from "@/features/analysis/core/flange-design/flat-cover";
import { builtinGaskets } from "@/features/library/model/builtin-rows";
import type { GasketChoiceDto } from "@/features/library/model/dto";

export interface ChoiceOption {
  value: string;
  label: string;
}

/** A thread of the catalogue: what the bolting section shows and what a new size brings with it. */
export interface ThreadChoice extends ThreadKey, ChoiceOption {
  nominalDiameterMm: number;
}

/** A catalogue bolt material with its allowable bolt stress (ASME II-D, null: none) by size range. */
export interface BoltMaterialChoice extends ChoiceOption {
  allowables: { maxDiameterMm: number; allowableMpa: number | null }[];
}

export interface TighteningChoice extends ChoiceOption {
  value: TighteningMethod;
  /** The preload scatter of the method with its source, shown under the select. */
  hint: string;
}

export interface EditorChoices {
  threads: ThreadChoice[];
  boltMaterials: BoltMaterialChoice[];
  flangeMaterials: ChoiceOption[];
  coverSketches: ChoiceOption[];
  tighteningMethods: TighteningChoice[];
  /** The built-in gasket rows (all of them), standing in until the Stockroom list is loaded. */
  builtinGaskets: GasketChoiceDto[];
}

const SERIES_LABEL = { "metric-coarse": "metric coarse", unc: "UNC", "unified-8un": "8UN" } as const;

/** The choices from the catalogue, in the catalogue's order. */
export function buildEditorChoices(): EditorChoices {
  return {
    threads: THREADS.map((t) => ({
      value: t.id,
      label: `${t.designation} (${SERIES_LABEL[t.series]})`,
      designation: t.designation,
      series: t.series,
      threadsPerInch: t.threadsPerInch,
      nominalDiameterMm: t.nominalDiameterMm,
    })),
    boltMaterials: BOLT_MATERIALS.map((m) => ({
      value: m.id,
      label: m.name,
      allowables: m.ranges.map((r) => ({ maxDiameterMm: r.maxDiameterMm, allowableMpa: r.allowableMpa })),
    })),
    flangeMaterials: FLANGE_MATERIALS.map((m) => ({ value: m.id, label: m.name })),
    coverSketches: COVER_SKETCHES.map((s) => ({ value: s.id, label: `${s.label} — C = ${s.c}` })),
    tighteningMethods: TIGHTENING_METHODS.map((m) => ({
      value: m.id,
      label: m.name,
      hint: `Preload scatter ±${Math.round(m.scatter * 100)} % (${m.source}; ${m.edition})`,
    })),
    builtinGaskets: builtinGaskets(),
  };
}
