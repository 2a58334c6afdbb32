import "server-only";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import { mm2ToIn2 } from "@/features/analysis/core/units";
import { printable } from "./fonts";
import type { SheetUnits } from "./format";

/**
 * Reads what the sheet shows out of the stored JointAnalysis. The sheet draws the stored result
 * as it is; this module only picks fields and formats them, it computes nothing (the one scaling,
 * the minimum-preload curve, is the one the result itself prescribes: stress × minN/targetN).
 */
export type SheetStatus = "pass" | "warn" | "fail" | "na" | "rated";

export interface SheetCheck {
  id: string;
  title: string;
  /** Bolts the check is about (pair and per-bolt checks), as stored. */
  boltIds: string[];
  /** As stored, in the core's unit (the Margin column reads these). */
  value: number | null;
  limit: number | null;
  /** Formatted in the sheet's units. */
  valueText: string;
  limitText: string;
  status: SheetStatus;
  source: string;
}

export interface SheetProfile {
  sMm: number[];
  /** At target preload, as stored. */
  stressMpa: number[];
  /** minN / targetN of the stored preload window (1 when unknown). */
  minFactor: number;
  pathLengthMm: number;
  pathLabel: string;
  seatingMpa: number | null;
  crushMpa: number | null;
  estimator: string;
  boltSMm: number[] | null;
}

export interface SheetPass {
  label: string;
  fraction: number;
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
  sequenceNote: string;
  planSource: string;
  editions: SheetEdition[];
  keyValues: { label: string; value: string }[];
  warnings: string[];
  coreVersion: string | null;
  /** Bolt centres as stored in the result (mm), by bolt id. */
  boltPoints: Map<string, { xMm: number; yMm: number }>;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);
const text = (v: unknown): string =>
  typeof v === "string" ? printable(v) : typeof v === "number" ? String(v) : "";

export function normaliseStatus(v: unknown): SheetStatus {
  if (v === "accepted-by-rating" || v === "rated") return "rated";
  return v === "pass" || v === "warn" || v === "fail" ? v : "na";
}

function plainNumber(n: number): string {
  const a = Math.abs(n);
  return a >= 1000 ? n.toFixed(0) : a >= 10 ? n.toFixed(1) : a >= 1 ? n.toFixed(2) : n.toFixed(3);
}

/** A check value in its core unit ("MPa", "mm", "N", "mm²", or a plain count/ratio unit). */
export function formatCheckValue(v: number | null, unit: string, u: SheetUnits): string {
  if (v === null) return "—";
  switch (unit) {
    case "MPa":
      return `${u.stress1(v)} ${u.stress}`;
    case "mm":
      return `${u.len(v)} ${u.length}`;
    case "N":
      return `${u.force1(v)} ${u.force}`;
    case "mm²":
      return u.system === "US" ? `${mm2ToIn2(v).toFixed(4)} in²` : `${v.toFixed(0)} mm²`;
    default:
      return `${plainNumber(v)}${unit ? ` ${printable(unit)}` : ""}`;
  }
}

export function readResultView(stored: unknown, u: SheetUnits): SheetResultView {
  const r = (isObj(stored) ? stored : {}) as Partial<JointAnalysis>;
  const checks: SheetCheck[] = (r.checks ?? []).map((c) => ({
    id: c.id,
    title: text(c.title),
    boltIds: c.boltIds ?? [],
    value: c.value,
    limit: c.limit,
    valueText: formatCheckValue(c.value, c.unit, u),
    limitText: formatCheckValue(c.limit, c.unit, u),
    status: normaliseStatus(c.status),
    source: text(c.source),
  }));
  const gs = r.gasketStress;
  const pre = r.preload;
  const profile: SheetProfile | null =
    gs && gs.profile && gs.profile.sMm.length > 1
      ? {
          sMm: gs.profile.sMm,
          stressMpa: gs.profile.stressMpa,
          minFactor: pre && pre.targetN > 0 ? pre.minN / pre.targetN : 1,
          pathLengthMm: gs.pathLengthMm,
          pathLabel:
            gs.pathKind === "bolt-path"
              ? "along the bolt path (full-face gasket)"
              : "along the gasket centre line",
          seatingMpa: gs.seatingMpa ?? null,
          crushMpa: gs.crushMpa ?? null,
          estimator:
            gs.governing === "beam" ? "flange as a beam on an elastic foundation" : "cone superposition",
          boltSMm: gs.boltSOnPathMm ?? null,
        }
      : null;
  const plan = r.assemblyPlan;
  const passes: SheetPass[] = (plan?.passes ?? []).map((p) => ({
    label: `${p.pass}. ${p.name}`,
    fraction: p.fractionOfTarget,
    torqueNmm: p.torqueNm * 1000,
    pattern: `${p.pattern === "cross" ? "Cross pattern" : "Circular"}: ${text(p.note)}`,
  }));
  const editions: SheetEdition[] = (r.catalogueEditions ?? []).map((e) => ({
    what: `${text(e.table)}: ${text(e.rowId)}`,
    source: text(e.source),
    edition: text(e.edition),
    confidence: text(e.confidence),
  }));
  const keyValues: { label: string; value: string }[] = [];
  if (pre) {
    keyValues.push(
      {
        label: "Target preload",
        value: `${u.force1(pre.targetN)} ${u.force} (${u.stress1(pre.targetStressMpa)} ${u.stress})`,
      },
      {
        label: "Preload window",
        value: `${u.force1(pre.minN)} … ${u.force1(pre.maxN)} ${u.force} (±${Math.round(pre.scatter * 100)} %)`,
      },
      { label: "Target torque", value: `${u.torque1(pre.targetTorqueNmm)} ${u.torque} (K ${pre.nutFactor})` },
    );
  }
  if (gs)
    keyValues.push({
      label: "Gasket stress (target)",
      value: `${u.stress1(gs.minMpa)} … ${u.stress1(gs.maxMpa)} ${u.stress}`,
    });
  if (r.summary)
    keyValues.push({
      label: "Checks",
      value: `${r.summary.passCount} pass · ${r.summary.warnCount} warn · ${r.summary.failCount} fail`,
    });
  const boltPoints = new Map((r.bolts ?? []).map((b) => [b.id, { xMm: b.xMm, yMm: b.yMm }]));
  return {
    checks,
    profile,
    passes,
    sequenceIds: plan?.sequence ?? [],
    sequenceNote: plan
      ? (plan.sequenceNote ??
        (plan.sequenceRule === "bit-reversal"
          ? "cross pattern (bit reversal)"
          : "cross pattern (farthest first)"))
      : "",
    planSource: text(plan?.source ?? ""),
    editions,
    keyValues,
    warnings: (r.warnings ?? []).map(text),
    coreVersion: r.coreVersion ?? null,
    boltPoints,
  };
}
