/**
 * What the readout (results panel) and the canvas overlays need from the core's JointAnalysis,
 * in one flat shape. Internal units (mm, N, MPa, N·mm). The profile is stored at target preload;
 * the readout shows it at minimum preload too (the solution is linear in the bolt forces, see
 * core/gasket-stress.ts), because seating is judged at minimum preload.
 */
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { CheckRecord } from "@/features/analysis/core/checks/check-record";
import { groupByRule } from "@/features/analysis/rule-groups";

/** A core check record with the bolts it concerns: one (a ring on the canvas), two (a bracket) or none (whole joint). */
export interface CheckView extends Omit<CheckRecord, "subject"> {
  boltIds: string[];
}

export interface ProfileView {
  pathLengthMm: number;
  sMm: number[];
  /** At target preload, MPa (NaN-free; samples off the gasket are dropped). */
  stressMpa: number[];
  /** Factor that turns target-preload stress into minimum-preload stress. */
  minFactor: number;
  minMpa: number;
  maxMpa: number;
  meanMpa: number;
  boltSOnPathMm: number[];
}

export interface ReadoutView {
  checks: CheckView[];
  profile: ProfileView;
  seatingMpa: number;
  crushMpa: number | null;
  analysis: JointAnalysis;
}

export function toReadoutView(result: JointAnalysis): ReadoutView {
  const gs = result.gasketStress;
  const s: number[] = [];
  const v: number[] = [];
  const { sMm, stressMpa, onGasket } = gs.profile;
  for (let i = 0; i < sMm.length; i++) {
    if (onGasket[i]) {
      s.push(sMm[i]);
      v.push(stressMpa[i]);
    }
  }
  const minFactor = result.preload.targetN > 0 ? result.preload.minN / result.preload.targetN : 1;
  return {
    // Results carry boltIds already (the core adds them); older stored ones get them from subject.
    checks: result.checks.map((c) => (c.boltIds ? c : { ...c, boltIds: c.subject ?? [] })),
    profile: {
      pathLengthMm: gs.pathLengthMm,
      sMm: s,
      stressMpa: v,
      minFactor,
      minMpa: gs.minMpa,
      maxMpa: gs.maxMpa,
      meanMpa: gs.meanMpa,
      boltSOnPathMm: gs.boltSOnPathMm,
    },
    seatingMpa: gs.seatingMpa,
    crushMpa: gs.crushMpa,
    analysis: result,
  };
}

/** Bolt ids a check concerns, or those given directly (highlight from the review screen). */
export function highlightedBolts(
  view: ReadoutView | null,
  highlight?: { boltIds?: string[]; checkId?: string },
): string[] {
  if (!highlight) return [];
  const fromCheck = highlight.checkId && view ? boltsOfPick(view.checks, highlight.checkId) : [];
  return [...new Set([...(highlight.boltIds ?? []), ...fromCheck])];
}

/** Bolts of a picked check id, or of a picked rule id (its warning and failing pairs, else all). */
export function boltsOfPick(checks: CheckView[], id: string): string[] {
  const one = checks.find((c) => c.id === id);
  if (one) return one.boltIds;
  return groupByRule(checks).find((r) => r.rule === id)?.boltIds ?? [];
}
