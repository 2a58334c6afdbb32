import "server-only";
import type { SheetUnits } from "./format";

/**
 * Reads what the sheet shows out of the stored JointAnalysis. The sheet draws the stored result
 * as it is; this module only picks fields and formats them, it computes nothing.
 */
export type SheetStatus = "pass" | "warn" | "fail" | "na";

export interface SheetCheck {
  id: string;
  title: string;
  value: string;
  limit: string;
  status: SheetStatus;
  source: string;
}

export interface SheetProfile {
  sMm: number[];
  stressMpa: number[];
  pathLengthMm: number;
  seatingMpa: number | null;
  seatingLabel: string;
  crushMpa: number | null;
  crushLabel: string;
  /** Which preload case the curve shows, e.g. "minimum preload (target − scatter)". */
  caseLabel: string;
  /** Bolt positions projected onto the gasket path (the chart's s), mm; null if not stored. */
  boltSMm: number[] | null;
}

export interface SheetPass {
  label: string;
  /** Fraction of the final torque, 0…1 (null when the pass is a check pass at full torque). */
  fraction: number | null;
  torqueNmm: number;
  pattern: string;
}

export interface SheetEdition {
  what: string;
  source: string;
  edition: string;
  confidence: string;
}

export interface SheetResultView {
  checks: SheetCheck[];
  profile: SheetProfile | null;
  passes: SheetPass[];
  sequenceIds: string[];
  editions: SheetEdition[];
  keyValues: { label: string; value: string }[];
  warnings: string[];
  coreVersion: string | null;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);
// The embedded Plex "latin" subsets have no ≥ ≤ ⌀ →; the stored text is shown with plain stand-ins.
const GLYPH_STAND_INS: [RegExp, string][] = [[/≥/g, ">="], [/≤/g, "<="], [/⌀/g, "Ø"], [/→/g, "->"], [/≈/g, "~"], [/±/g, "±"]];
export function plainText(s: string): string {
  return GLYPH_STAND_INS.reduce((acc, [re, to]) => acc.replace(re, to), s);
}
const str = (v: unknown): string => (typeof v === "string" ? plainText(v) : typeof v === "number" ? String(v) : "");
const numOrNull = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

function pick(o: Obj, ...keys: string[]): unknown {
  for (const k of keys) if (o[k] !== undefined && o[k] !== null) return o[k];
  return undefined;
}

export function normaliseStatus(v: unknown): SheetStatus {
  const s = str(v).toLowerCase();
  if (s === "pass" || s === "ok") return "pass";
  if (s === "warn" || s === "warning") return "warn";
  if (s === "fail" || s === "error") return "fail";
  return "na";
}

/** A check value with its quantity kind ("length", "stress", "force", "torque", "ratio", …). */
function formatQuantity(v: unknown, quantity: string, u: SheetUnits): string {
  if (typeof v === "string") return v;
  const n = numOrNull(v);
  if (n === null) return "—";
  switch (quantity) {
    case "length":
      return `${u.len(n)} ${u.length}`;
    case "stress":
      return `${u.stress1(n)} ${u.stress}`;
    case "force":
      return `${u.force1(n)} ${u.force}`;
    case "torque":
      return `${u.torque1(n)} ${u.torque}`;
    case "percent":
      return `${(n * 100).toFixed(1)} %`;
    default:
      return Math.abs(n) >= 100 ? n.toFixed(0) : Math.abs(n) >= 1 ? n.toFixed(2) : n.toFixed(3);
  }
}

function readChecks(result: Obj, u: SheetUnits): SheetCheck[] {
  const list = pick(result, "checks");
  if (!Array.isArray(list)) return [];
  return list.filter(isObj).map((c, i) => {
    const quantity = str(pick(c, "quantity", "unitKind", "kind"));
    const limitObj = pick(c, "limit");
    let limit = "—";
    if (isObj(limitObj)) {
      const op = str(pick(limitObj, "op", "comparison"));
      limit = `${op ? `${op} ` : ""}${formatQuantity(pick(limitObj, "value"), quantity, u)}`;
    } else if (limitObj !== undefined) limit = formatQuantity(limitObj, quantity, u);
    const src = pick(c, "source");
    return {
      id: str(pick(c, "id")) || `check-${i + 1}`,
      title: str(pick(c, "title", "label", "name")) || str(pick(c, "id")),
      value: formatQuantity(pick(c, "value"), quantity, u),
      limit,
      status: normaliseStatus(pick(c, "status", "verdict")),
      source: isObj(src) ? [str(src.source), str(src.edition)].filter(Boolean).join(", ") : str(src),
    };
  });
}

function readProfile(result: Obj): SheetProfile | null {
  const p = pick(result, "gasketStressProfile", "gasketProfile", "profile", "gasketStress");
  if (!isObj(p)) return null;
  let sMm: number[] = [];
  let stressMpa: number[] = [];
  const samples = pick(p, "samples", "points");
  if (Array.isArray(samples)) {
    for (const q of samples) {
      if (!isObj(q)) continue;
      const s = numOrNull(pick(q, "sMm", "s"));
      const v = numOrNull(pick(q, "stressMpa", "minStressMpa", "value"));
      if (s !== null && v !== null) {
        sMm.push(s);
        stressMpa.push(v);
      }
    }
  } else {
    const s = pick(p, "sMm");
    const v = pick(p, "stressMpa", "minStressMpa");
    if (Array.isArray(s) && Array.isArray(v)) {
      sMm = s as number[];
      stressMpa = v as number[];
    }
  }
  if (sMm.length < 2) return null;
  return {
    sMm,
    stressMpa,
    pathLengthMm: numOrNull(pick(p, "pathLengthMm", "lengthMm")) ?? sMm[sMm.length - 1],
    seatingMpa: numOrNull(pick(p, "seatingMpa", "requiredSeatingMpa", "yMpa")),
    seatingLabel: str(pick(p, "seatingLabel")) || "seating stress",
    crushMpa: numOrNull(pick(p, "crushMpa", "maxAllowedMpa", "qsMaxMpa")),
    crushLabel: str(pick(p, "crushLabel")) || "crush limit",
    caseLabel: str(pick(p, "caseLabel", "case")) || "",
    boltSMm: Array.isArray(pick(p, "boltSOnPathMm", "boltSMm")) ? (pick(p, "boltSOnPathMm", "boltSMm") as number[]) : null,
  };
}

function readAssembly(result: Obj): { passes: SheetPass[]; sequenceIds: string[] } {
  const a = pick(result, "assemblyPlan", "assembly", "tightening");
  if (!isObj(a)) return { passes: [], sequenceIds: [] };
  const passesRaw = pick(a, "passes");
  const passes: SheetPass[] = Array.isArray(passesRaw)
    ? passesRaw.filter(isObj).map((p, i) => ({
        label: str(pick(p, "label", "name")) || `Pass ${i + 1}`,
        fraction: numOrNull(pick(p, "fraction", "fractionOfFinal")) ?? (numOrNull(pick(p, "percent")) !== null ? (pick(p, "percent") as number) / 100 : null),
        torqueNmm: numOrNull(pick(p, "torqueNmm")) ?? 0,
        pattern: str(pick(p, "pattern", "order", "note")),
      }))
    : [];
  const seq = pick(a, "sequence", "sequenceIds", "order");
  const sequenceIds = Array.isArray(seq) ? seq.map((x) => (isObj(x) ? str(pick(x, "id", "boltId")) : str(x))).filter(Boolean) : [];
  return { passes, sequenceIds };
}

function readEditions(result: Obj): SheetEdition[] {
  const e = pick(result, "editions", "sources", "provenance", "tablesUsed");
  if (!Array.isArray(e)) return [];
  return e.filter(isObj).map((r) => ({
    what: str(pick(r, "what", "table", "name", "id")),
    source: str(pick(r, "source")),
    edition: str(pick(r, "edition")),
    confidence: str(pick(r, "confidence")),
  }));
}

export function readResultView(result: unknown, u: SheetUnits): SheetResultView {
  const r = isObj(result) ? result : {};
  const { passes, sequenceIds } = readAssembly(r);
  const warnings = pick(r, "warnings");
  const kv = pick(r, "summary");
  return {
    checks: readChecks(r, u),
    profile: readProfile(r),
    passes,
    sequenceIds,
    editions: readEditions(r),
    keyValues: Array.isArray(kv) ? kv.filter(isObj).map((x) => ({ label: str(x.label), value: str(x.value) })) : [],
    warnings: Array.isArray(warnings) ? warnings.map((w) => (isObj(w) ? str(pick(w, "message", "text")) : str(w))).filter(Boolean) : [],
    coreVersion: str(pick(r, "coreVersion")) || null,
  };
}
