/**
 * Unverified values: every value a stored result depends on whose source is tagged as remembered
 * and not checked against its table ("mem" confidence, "[mem]", "from memory"). The sign-off sheet
 * lists them and the approver acknowledges them; the approval records the list; the shop files say
 * "contains unverified table values" while any remain. Pure: no React, no server, no clock.
 *
 * Where the tags are read (the core's own provenance, never a guess from numbers):
 * - the result's catalogue editions with confidence "mem" (the row's values from the code catalogue);
 * - a catalogue gasket's typical modulus and thickness (`modulusConfidence`), while the design still
 *   holds them;
 * - the design's own source texts (gasket data, nut factor, entered allowables, entered cover C);
 * - applicable checks whose source or note carries the tag (one entry per rule);
 * - the result's assumptions that carry the tag (formula constants such as the cone fit).
 */
import type { UnverifiedValue } from "@/db/tables/reviews";
import type { JointDesign } from "./core/design";
import { boltMaterialOf, getBoltMaterialById, getStrengthForDiameter } from "./core/catalogue/bolt-materials";
import { getFlangeTemplateById } from "./core/catalogue/flange-templates";
import { getGasketTypeById } from "./core/catalogue/gaskets";
import { getNutById } from "./core/catalogue/nuts";
import { getThreadById } from "./core/catalogue/threads";
import { getTighteningMethodById } from "./core/catalogue/tightening-methods";
import { getWrenchClearanceById } from "./core/catalogue/wrench-clearance";

// Its home is the table that stores the acknowledged list (revision_decisions.acknowledged_unverified).
export type { UnverifiedValue } from "@/db/tables/reviews";

/** The words every shop file prints while a result holds unverified values. */
export const UNVERIFIED_MARK = "contains unverified table values";

const TAG = /\[mem\b[^\]]*\]|from memory|values remembered|remembered, verify/i;

/** True when a source text says it was taken from memory (the catalogues' and the core's tags). */
export function isTaggedFromMemory(text: unknown): boolean {
  return typeof text === "string" && TAG.test(text);
}

interface StoredEdition {
  table?: unknown;
  rowId?: unknown;
  source?: unknown;
  edition?: unknown;
  confidence?: unknown;
}
interface StoredCheck {
  id?: unknown;
  title?: unknown;
  status?: unknown;
  source?: unknown;
  note?: unknown;
  limit?: unknown;
  value?: unknown;
  unit?: unknown;
}
interface StoredResult {
  catalogueEditions?: StoredEdition[];
  checks?: StoredCheck[];
  assumptions?: unknown[];
}

const str = (v: unknown): string => (typeof v === "string" ? v : "");
const num = (v: number, digits = 2): string => {
  const s = v.toFixed(digits);
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
};
const mm = (v: number) => `${num(v, 2)} mm`;
const mpa = (v: number) => `${num(v, 1)} MPa`;
// A stored number is the catalogue's when it matches to 0.01 % (a value copied with 6 figures,
// or converted psi → MPa, is still the table's).
const same = (a: number, b: number) => Math.abs(a - b) <= 1e-4 * Math.max(Math.abs(a), Math.abs(b), 1e-9);
const sourceOf = (e: StoredEdition) => [str(e.source), str(e.edition)].filter(Boolean).join("; ");

/** The values a catalogue row supplied to this design, in words; null when the row is unknown. */
function catalogueValues(
  e: StoredEdition,
  document: JointDesign,
): { what: string; value: string; sub?: string }[] | null {
  const rowId = str(e.rowId);
  switch (str(e.table)) {
    case "nuts": {
      const n = getNutById(rowId);
      return n
        ? [
            {
              what: `Nut across flats (${n.designation})`,
              value: `${mm(n.acrossFlatsMm)} (across corners ${mm(n.acrossCornersMm)})`,
            },
          ]
        : null;
    }
    case "wrench-clearance": {
      const w = getWrenchClearanceById(rowId);
      return w
        ? [
            {
              what: `Bolting clearances for ${w.designation} in (minimum spacing, bolt to hub, bolt to edge)`,
              value: `${mm(w.minSpacingMm)}, ${mm(w.boltToHubMm)}, ${mm(w.boltToEdgeMm)}`,
            },
          ]
        : null;
    }
    case "gaskets": {
      const g = getGasketTypeById(rowId);
      if (!g) return null;
      const mat = document.gasket.material;
      const out: { what: string; value: string; sub?: string }[] = [];
      // A value the designer replaced (a test report, a data sheet) is theirs, no longer the table's.
      if (same(mat.m, g.m)) out.push({ what: `Gasket factor m (${g.name})`, value: num(g.m, 2), sub: "m" });
      if (same(mat.yMpa, g.yMpa))
        out.push({
          what: `Gasket seating stress y (${g.name})`,
          value: `${mpa(g.yMpa)} (${g.yPsi} psi)`,
          sub: "y",
        });
      return out;
    }
    case "bolt-allowables": {
      const m = materialRow(rowId, document);
      if (!m) return null;
      const values = [...new Set(m.ranges.map((r) => r.allowableMpa).filter((v): v is number => v !== null))];
      return [{ what: `Bolt allowable stress S (${m.name})`, value: values.map(mpa).join(" / ") || "—" }];
    }
    case "flange-templates": {
      const f = getFlangeTemplateById(rowId);
      return f
        ? [
            {
              what: `Flange dimensions (${f.standard} Class ${f.pressureClass} NPS ${f.nps}: outside diameter, bolt circle, bolts)`,
              value: `${mm(f.outsideDiameterMm)}, ${mm(f.boltCircleDiameterMm)}, ${f.boltCount} × ${f.boltDesignation} in`,
            },
          ]
        : null;
    }
    case "tightening-methods": {
      const t = getTighteningMethodById(rowId as JointDesign["assembly"]["method"]);
      return t
        ? [
            {
              what: `Preload scatter (${t.name})`,
              value: `±${num(t.rangeLow * 100, 0)}–${num(t.rangeHigh * 100, 0)} %`,
            },
          ]
        : null;
    }
    case "threads": {
      const t = getThreadById(rowId);
      return t
        ? [
            {
              what: `Thread areas (${t.designation})`,
              value: `As ${num(t.tensileStressAreaMm2, 1)} mm², root ${num(t.rootAreaMm2, 1)} mm²`,
            },
          ]
        : null;
    }
    default:
      return null;
  }
}

function fromCatalogue(document: JointDesign, result: StoredResult): UnverifiedValue[] {
  const out: UnverifiedValue[] = [];
  const editions = Array.isArray(result.catalogueEditions) ? result.catalogueEditions : [];
  const threadRow = editions.find((e) => str(e.table) === "threads");
  for (const e of editions) {
    if (str(e.confidence) !== "mem") continue;
    const key = `catalogue:${str(e.table)}:${str(e.rowId)}`;
    const values =
      str(e.table) === "bolt-materials" && threadRow
        ? boltStrengths(str(e.rowId), str(threadRow.rowId), document)
        : catalogueValues(e, document);
    if (values === null) {
      out.push({
        key,
        what: `Table row ${str(e.rowId)} (${str(e.table)})`,
        value: "as stored",
        source: sourceOf(e),
      });
      continue;
    }
    for (const v of values)
      out.push({ key: v.sub ? `${key}:${v.sub}` : key, what: v.what, value: v.value, source: sourceOf(e) });
  }
  return out;
}

/** A bolting row by id: the design's own Stockroom copy when it is the design's material, else the catalogue's. */
function materialRow(rowId: string, document: JointDesign) {
  return rowId === document.fastener.materialId
    ? boltMaterialOf(document.fastener)
    : getBoltMaterialById(rowId);
}

function boltStrengths(
  materialId: string,
  threadId: string,
  document: JointDesign,
): { what: string; value: string; sub?: string }[] | null {
  const m = materialRow(materialId, document);
  if (!m) return null;
  const s = getStrengthForDiameter(m, getThreadById(threadId)?.nominalDiameterMm ?? 0);
  const parts = [
    s.proofMpa !== null ? `proof ${mpa(s.proofMpa)}` : null,
    `yield ${mpa(s.yieldMpa)}`,
    `tensile ${mpa(s.tensileMpa)}`,
  ];
  return [{ what: `Bolt strengths (${m.name})`, value: parts.filter(Boolean).join(", ") }];
}

function fromGasketDefaults(document: JointDesign): UnverifiedValue[] {
  const mat = document.gasket.material;
  const g = mat.catalogueId ? getGasketTypeById(mat.catalogueId) : undefined;
  if (!g || g.modulusConfidence !== "mem") return [];
  const out: UnverifiedValue[] = [];
  const source =
    "Sealpitch gasket catalogue: order-of-magnitude default, not product data (enter the test report's value)";
  if (same(mat.modulusMpa, g.typicalModulusMpa))
    out.push({
      key: `catalogue:gaskets:${g.id}:modulus`,
      what: `Gasket unloading modulus (${g.name})`,
      value: mpa(g.typicalModulusMpa),
      source,
    });
  if (same(mat.thicknessMm, g.typicalThicknessMm))
    out.push({
      key: `catalogue:gaskets:${g.id}:thickness`,
      what: `Gasket installed thickness (${g.name})`,
      value: mm(g.typicalThicknessMm),
      source,
    });
  return out;
}

function fromDocumentSources(document: JointDesign): UnverifiedValue[] {
  const out: UnverifiedValue[] = [];
  const mat = document.gasket.material;
  // While m and y are still a catalogue row's, that row's own tag decides (above); once the
  // designer has replaced them, the design's source text is theirs and its tag decides.
  const row = mat.catalogueId ? getGasketTypeById(mat.catalogueId) : undefined;
  const ownValues = !row || !same(mat.m, row.m) || !same(mat.yMpa, row.yMpa);
  if (ownValues && isTaggedFromMemory(mat.source))
    out.push({
      key: "document:gasket.material",
      what: `Gasket factors m and y (${mat.name})`,
      value: `m ${num(mat.m, 2)}, y ${mpa(mat.yMpa)}`,
      source: mat.source,
    });
  const k = document.assembly.nutFactor;
  if (isTaggedFromMemory(k.source))
    out.push({
      key: "document:assembly.nutFactor",
      what: "Nut factor K",
      value: num(k.value, 3),
      source: k.source,
    });
  const ea = document.fastener.enteredAllowable;
  if (ea && isTaggedFromMemory(ea.source))
    out.push({
      key: "document:fastener.enteredAllowable",
      what: "Entered bolt allowable stress",
      value: mpa(ea.valueMpa),
      source: ea.source,
    });
  const fd = document.flangeDesign;
  for (const [name, a] of [
    ["flange", fd?.flangeAllowable],
    ["cover", fd?.coverAllowable],
  ] as const) {
    if (a && isTaggedFromMemory(a.source))
      out.push({
        key: `document:flangeDesign.${name}Allowable`,
        what: `Entered ${name} allowable stress (design, ambient)`,
        value: `${mpa(a.designMpa)}, ${mpa(a.ambientMpa)}`,
        source: a.source,
      });
  }
  const cs = fd?.coverSketch;
  if (cs && cs.kind === "entered" && isTaggedFromMemory(cs.source))
    out.push({
      key: "document:flangeDesign.coverSketch",
      what: "Entered cover factor C",
      value: num(cs.c, 3),
      source: cs.source,
    });
  return out;
}

// The sentences of a note that carry the tag: they state the remembered value itself.
function taggedSentences(note: string): string[] {
  return note
    .split(/(?<=[.;])\s+(?=[A-Z])/)
    .map((s) => s.trim())
    .filter((s) => isTaggedFromMemory(s));
}

function fromChecks(result: StoredResult): UnverifiedValue[] {
  const checks = Array.isArray(result.checks) ? result.checks : [];
  const seen = new Set<string>();
  const out: UnverifiedValue[] = [];
  for (const c of checks) {
    if (str(c.status) === "not-applicable" || !c) continue;
    const rule = str(c.id).split(":")[0]!;
    if (seen.has(rule)) continue;
    const inSource = isTaggedFromMemory(c.source);
    const sentences = taggedSentences(str(c.note));
    if (!inSource && sentences.length === 0) continue;
    seen.add(rule);
    const limit = typeof c.limit === "number" ? `limit ${num(c.limit, 2)} ${str(c.unit)}`.trim() : null;
    out.push({
      key: `check:${rule}`,
      what: str(c.title).replace(/\s*\(.*\)\s*$/, "") || rule,
      value: sentences.length > 0 ? sentences.join(" ") : (limit ?? "as stored"),
      source: str(c.source),
    });
  }
  return out;
}

function fromAssumptions(result: StoredResult): UnverifiedValue[] {
  const assumptions = Array.isArray(result.assumptions) ? result.assumptions : [];
  return assumptions.flatMap((a, i) => {
    const text = str(a);
    if (!isTaggedFromMemory(text)) return [];
    const [what, ...rest] = text.split(/:\s/);
    return [
      {
        key: `assumption:${what!.slice(0, 60)}`,
        what: rest.length > 0 ? what! : `Assumption ${i + 1}`,
        value: rest.length > 0 ? rest.join(": ") : text,
        source: "Sealpitch core assumption, tagged [mem] in the stored result",
      },
    ];
  });
}

/**
 * Every unverified value the stored result of `document` depends on, in a fixed order: catalogue
 * rows, catalogue defaults, the design's own sources, checks, assumptions. Empty for no result.
 * Example: a design with the compressed-fibre gasket row keeps m = 2 and y = 11.0 MPa from
 * "from memory; verify against Table 2-5.1" → two entries, keys "catalogue:gaskets:compressed-fibre-1-8:m" and ":y".
 */
export function listUnverifiedValues(document: JointDesign, result: unknown): UnverifiedValue[] {
  if (!result || typeof result !== "object") return [];
  const r = result as StoredResult;
  const out = [...fromCatalogue(document, r), ...fromGasketDefaults(document)];
  out.push(...fromDocumentSources(document));
  out.push(...fromChecks(r), ...fromAssumptions(r));
  const keys = new Set<string>();
  return out.filter((v) => (keys.has(v.key) ? false : (keys.add(v.key), true)));
}
