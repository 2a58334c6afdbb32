/**
 * "Suggest pattern": `suggestPatterns(request)` searches bolt count, size, material and bolt-path
 * offset for layouts that pass every rule of `analyzeJoint`, spaced equally along the path
 * between fixed bolts and keep-out zones (see layout.ts), and returns the Pareto front of
 * (fewest bolts, smallest size, largest seating margin), ranked. Pure and deterministic.
 *
 * For each size, material and offset it first bounds the count with cheap necessary conditions:
 * the pitch may not exceed 2a + t (ASME VIII-2 4.16.11, above it the pitch warns), Bs,max or
 * 6·d, nor fall below the tool's chord (spacing.min-pitch, plus the requested clearance) or 3·d
 * [practice]; Ab = n·root area ≥ Am (ASME VIII-1 Appendix 2); and the mean gasket stress at
 * minimum preload, n·Fmin/A, must reach the seating stress (the minimum never exceeds the mean).
 * It then scans the count upwards from that bound, running the full analysis on each layout, and
 * keeps the first that qualifies (verdict.ts says how warnings count). At each count it tries
 * every keep-out edge-anchor variant the bounds leave open (layout.ts `edgeVariants`, the one
 * with a bolt at both ends of every zone first) before the next count. A layout that fails only
 * rules more bolts help moves the scan on; the seating rule also lifts the bound from the stress
 * just computed. So within the search space no qualifying layout of that size, material and
 * offset has fewer bolts than the one returned.
 *
 * Example: a 600 × 400 mm full-face cover with M16 → M12…M36 candidates, the first with the fewest bolts.
 */
import type { JointDesign, StockedBoltMaterial, UnitSystem } from "../design";
import { analyzeJoint, type JointAnalysis } from "../analyze";
import { buildJointModel } from "../joint-model";
import { spacingLimits } from "../checks/spacing";
import { requiredBoltLengthMm } from "../checks/bolt-checks";
import { computeAsmeAppendix2 } from "../checks/asme-appendix2";
import { getBoltMaterialById } from "../catalogue/bolt-materials";
import { mmToIn, mpaToPsi } from "../units";
import type { ThreadRow } from "../catalogue/threads";
import { DesignRefusedError, formatIssue } from "../validate";
import { countBounds, edgeVariants, layoutBolts, type EdgeAnchors, type LayoutFrame } from "./layout";
import {
  checkSuggestionRequest,
  fastenerFor,
  frameFor,
  isPipeFlange,
  keepOutsMm,
  materialsOf,
  offsetsOf,
  sizesOf,
  stockedMaterialFor,
  SUGGESTION_LIMITS,
  type OffsetFrame,
  type SuggestionRequest,
} from "./request";
import { judge, moreBoltsHelp, ruleAsk, ruleMargins, ruleOf, type RuleMargin } from "./verdict";
import { paretoFront } from "./pareto";
import { WORK_LIMITS } from "../bounds";

export const SUGGESTION_POLICY =
  "A candidate passes every check: a failure of any rule rules it out, and so does a warning on a rule the layout decides (spacing, edge distances, gasket stresses) unless layout warnings are allowed, and a warning of the pipe-flange pattern rules when straddling is asked for. Warnings on rules no layout changes (Appendix 2 scope, the assembly stress window, bolt length, flange design) and acceptance by a flange's rating are carried and listed. Not applicable counts as passing.";

export interface PatternCandidate {
  /** 1 = first in the ranking. */
  rank: number;
  boltCount: number;
  designation: string;
  threadSeries: JointDesign["fastener"]["threadSeries"];
  nominalDiameterMm: number;
  materialId: string;
  materialName: string;
  /** Offset of the bolt path inward from the outline, mm (null: a bolt circle on a non-circular outline). */
  offsetMm: number | null;
  boltPath: JointDesign["boltPath"];
  pitchMm: { min: number; max: number };
  /** Lowest gasket stress along the path at minimum preload, MPa, its limit and margin (0.1 = 10 % above). */
  seating: { minMpa: number; limitMpa: number; margin: number };
  /** The holding rule with the smallest margin. */
  governing: RuleMargin | null;
  margins: RuleMargin[];
  /** Rules that warn or are accepted by rating on this candidate (see SUGGESTION_POLICY). */
  carried: string[];
  /** FE cross-check status: a fresh pattern has none until the FE cross-check runs on it. */
  feCheck: null;
  /** The design with this pattern (fastener, bolt path and bolts replaced), ready to analyse or apply. */
  design: JointDesign;
}

export interface BlockedCombination {
  designation: string;
  materialId: string;
  offsetMm: number | null;
  /** The rule that rules this combination out. */
  rule: string;
  /** The densest pitch considered when it did (mm), or null. */
  pitchMm: number | null;
  reason: string;
}

export interface SuggestionResult {
  candidates: PatternCandidate[];
  blocked: BlockedCombination[];
  /** Why nothing qualifies, in one sentence ("no size up to M36 seats the gasket at 72 mm pitch"); null when something does. */
  message: string | null;
  combinations: number;
  analyses: number;
  /** The work cap stopped the search before every combination was settled. */
  truncated: boolean;
  cancelled: boolean;
  policy: string;
}

export interface SuggestionProgress {
  done: number;
  total: number;
  analyses: number;
}

export interface SuggestionHooks {
  onProgress?: (p: SuggestionProgress) => void;
  /** Checked before every analysis; true ends the search with what it has (`cancelled`). */
  shouldStop?: () => boolean;
}

export class SuggestionRefusedError extends DesignRefusedError {}

const round = (v: number, k = 1) => Math.round(v * 10 ** k) / 10 ** k;

/** A length for the result's sentences: "72 mm", or in the US system "2.83 in". */
function lengthText(mm: number, units: UnitSystem): string {
  return units === "US" ? `${round(mmToIn(mm), 2)} in` : `${round(mm)} mm`;
}

/** A check's value or limit (number, then unit), lengths and stresses in the request's unit system. */
function quantityParts(v: number, unit: string, units: UnitSystem): [string, string] {
  if (units === "US" && unit === "mm") return [String(round(mmToIn(v), 3)), "in"];
  if (units === "US" && unit === "MPa") return [String(Math.round(mpaToPsi(v))), "psi"];
  return [String(round(v, 2)), unit];
}

interface Combo {
  thread: ThreadRow;
  materialId: string;
  /** The Stockroom row behind `materialId`, or null for a catalogue material. */
  stocked: StockedBoltMaterial | null;
  frame: OffsetFrame;
}

/** The design of one layout: fastener for the size (length from the grip), path and bolts. */
function designFor(
  base: JointDesign,
  c: Combo,
  layout: LayoutFrame,
  n: number,
  edges?: EdgeAnchors,
): JointDesign | null {
  const bolts = layoutBolts(layout, n, edges);
  if (!bolts) return null;
  const fastener = fastenerFor(base.fastener, c.thread, c.materialId, c.stocked);
  const d: JointDesign = { ...base, fastener, boltPath: c.frame.boltPath, bolts };
  const needed = requiredBoltLengthMm(buildJointModel(d));
  const own =
    fastener.designation === base.fastener.designation &&
    fastener.threadSeries === base.fastener.threadSeries;
  const lengthMm =
    own && base.fastener.lengthMm >= needed ? base.fastener.lengthMm : Math.ceil(needed / 5) * 5;
  return { ...d, fastener: { ...fastener, lengthMm } };
}

function pitchRange(a: JointAnalysis): { min: number; max: number } {
  const p = a.bolts.map((b) => b.pitchToNextMm ?? 0);
  return { min: Math.min(...p), max: Math.max(...p) };
}

function candidateOf(c: Combo, design: JointDesign, a: JointAnalysis, carried: string[]): PatternCandidate {
  const seatCheck = a.checks.find((x) => x.id === "gasket.seating")!;
  const margins = ruleMargins(a.checks);
  // The bolt length is sized by the search itself, so it never governs the choice.
  const holding = margins.filter(
    (m) =>
      m.margin !== null &&
      m.rule !== "bolt.length" &&
      (m.status === "pass" || m.status === "accepted-by-rating"),
  );
  const governing = holding.reduce<RuleMargin | null>((w, m) => (!w || m.margin! < w.margin! ? m : w), null);
  return {
    rank: 0,
    boltCount: design.bolts.length,
    designation: c.thread.designation,
    threadSeries: c.thread.series,
    nominalDiameterMm: c.thread.nominalDiameterMm,
    materialId: c.materialId,
    materialName: c.stocked?.name ?? getBoltMaterialById(c.materialId)?.name ?? c.materialId,
    offsetMm: c.frame.offsetMm,
    boltPath: c.frame.boltPath,
    pitchMm: pitchRange(a),
    seating: {
      minMpa: seatCheck.value ?? 0,
      limitMpa: seatCheck.limit ?? 0,
      margin: (seatCheck.value ?? 0) / (seatCheck.limit || 1) - 1,
    },
    governing,
    margins,
    carried,
    feCheck: null,
    design,
  };
}

/** Runs the search. Throws SuggestionRefusedError (with every issue) for a request that cannot run. */
export function suggestPatterns(req: SuggestionRequest, hooks: SuggestionHooks = {}): SuggestionResult {
  const issues = checkSuggestionRequest(req);
  if (issues.length > 0) throw new SuggestionRefusedError(issues, "request refused");
  const base = req.design;
  const pipePattern = isPipeFlange(base) && req.straddleCentreLines !== false;
  const judging = { pipePattern, allowLayoutWarnings: req.allowLayoutWarnings === true };
  const clearance = req.minToolClearanceMm ?? 0;
  const units = req.units ?? "SI";
  const len = (mm: number) => lengthText(mm, units);
  const maxAnalyses = req.maxAnalyses ?? SUGGESTION_LIMITS.defaultAnalyses;
  const nCap = Math.min(512, Math.floor(WORK_LIMITS.pathSamples.max / base.estimator.samplesPerPitch));
  const combos: Combo[] = [];
  for (const offsetMm of offsetsOf(req)) {
    const frame = frameFor(req, offsetMm);
    for (const materialId of materialsOf(req)) {
      const stocked = stockedMaterialFor(req, materialId) ?? null;
      for (const thread of sizesOf(req)) combos.push({ thread, materialId, stocked, frame });
    }
  }
  const found: PatternCandidate[] = [];
  const blocked: BlockedCombination[] = [];
  let analyses = 0;
  let truncated = false;
  let cancelled = false;
  // Effective gasket area per offset (n·F/mean stress), from the first analysis there; bounds later sizes.
  const areaByOffset = new Map<number | null, number>();
  const gasket = base.gasket.material;
  const seatLimit = gasket.qMinMpa ?? gasket.yMpa;

  const searchCombo = (c: Combo): void => {
    const block = (rule: string, pitchMm: number | null, reason: string): void => {
      blocked.push({
        designation: c.thread.designation,
        materialId: c.materialId,
        offsetMm: c.frame.offsetMm,
        rule,
        pitchMm: pitchMm === null ? null : round(pitchMm),
        reason,
      });
    };
    const layout: LayoutFrame = {
      pathLengthMm: c.frame.pathLengthMm,
      fixed: c.frame.fixed,
      keepOuts: keepOutsMm(
        c.frame,
        fastenerFor(base.fastener, c.thread, c.materialId, c.stocked).holeDiameterMm,
      ),
    };
    const L = layout.pathLengthMm;
    const probe = designFor(base, c, layout, Math.max(4, layout.fixed.length + 2 * layout.keepOuts.length));
    if (!probe) return block("layout", null, "no layout fits the fixed bolts and keep-outs");
    let model;
    try {
      model = buildJointModel(probe);
    } catch {
      return block("layout", null, "the core cannot model this size on this path");
    }
    const d = c.thread.nominalDiameterMm;
    const lim = spacingLimits(model);
    // With layout warnings allowed only the failing limits bound the pitch.
    const strict = !judging.allowLayoutWarnings;
    const maxPitch = strict ? Math.min(lim.momentPitchMm, lim.maxPitchMm, 6 * d) : lim.maxPitchMm;
    const maxRule = strict && maxPitch === 6 * d ? "spacing.pitch-band" : "spacing.max-pitch";
    const minPitch = Math.max(lim.minChordMm + clearance, strict ? 3 * d : 0);
    const minRule = strict && minPitch === 3 * d ? "spacing.pitch-band" : "spacing.min-pitch";
    // Every edge-anchor variant (the first keeps a bolt at both ends of every keep-out) with its
    // count bounds; the ones no count can lay out are left out before any analysis.
    const variants = edgeVariants(layout)
      .map((edges) => ({ edges, b: countBounds(layout, maxPitch, minPitch, edges), dead: false }))
      .filter((v, i) => i === 0 || v.b.short || (v.b.lo <= v.b.hi && v.b.gapMm <= maxPitch + 1e-9));
    // When none can, name the default's reason, or, when every variant has anchors closer than
    // the smallest pitch, the widest such span (the one no choice of edges widens).
    const shorts = variants.every((v) => v.b.short)
      ? variants.reduce((w, v) => (v.b.short!.lengthMm > w.b.short!.lengthMm ? v : w))
      : variants[0];
    const b0 = shorts.b;
    const open = variants.filter((v) => v.b.lo <= v.b.hi && v.b.gapMm <= maxPitch + 1e-9 && !v.b.short);
    const b =
      open.length === 0
        ? b0
        : {
            lo: Math.min(...open.map((v) => v.b.lo)),
            hi: Math.max(...open.map((v) => v.b.hi)),
            gapMm: 0,
            short: null,
          };
    const step = pipePattern ? 4 : 1;
    const up = (n: number) => Math.ceil(n / step) * step;
    let lo = up(Math.max(b.lo, 2, layout.fixed.length));
    let loRule = maxRule;
    const hi = Math.min(b.hi, nCap);
    if (b.gapMm > maxPitch + 1e-9)
      return block(
        maxRule,
        b.gapMm,
        `a keep-out leaves a ${len(b.gapMm)} gap, over the ${len(maxPitch)} largest pitch for ${c.thread.designation}`,
      );
    // Two anchors (the bolts at a keep-out's ends, fixed bolts) closer than the smallest pitch: no
    // count spreads them, so the smallest-pitch rule blocks, not the largest.
    if (b.short)
      return block(
        minRule,
        b.short.lengthMm,
        b.short.acrossKeepOut
          ? `the bolts at the ends of a keep-out stand ${len(b.short.lengthMm)} apart, under the ${len(minPitch)} smallest pitch for ${c.thread.designation} (${minRule})`
          : `fixed bolts and keep-out ends leave a ${len(b.short.lengthMm)} span, under the ${len(minPitch)} smallest pitch for ${c.thread.designation} (${minRule})`,
      );
    const asme = computeAsmeAppendix2(model).result;
    if (asme.requiredAreaMm2 !== null) {
      const nArea = up(Math.ceil(asme.requiredAreaMm2 / model.thread.rootAreaMm2 - 1e-9));
      if (nArea > lo) [lo, loRule] = [nArea, "asme.app2.bolt-area"];
    }
    const area = areaByOffset.get(c.frame.offsetMm);
    if (area !== undefined) {
      const nSeat = up(Math.ceil((0.8 * area * seatLimit) / model.preload.minN));
      if (nSeat > lo) [lo, loRule] = [nSeat, "gasket.seating"];
    }
    const densest = hi >= 1 ? L / Math.max(hi, 1) : null;
    if (lo > hi) {
      const needs =
        loRule === "gasket.seating" || loRule === "asme.app2.bolt-area"
          ? `needs at least ${lo} bolts`
          : `needs a pitch of at most ${len(maxPitch)} (${lo} bolts)`;
      const allows = hi < 1 ? "no count" : `at most ${hi} (pitch ≥ ${len(minPitch)}, ${minRule})`;
      return block(loRule, densest, `${c.thread.designation} ${needs}; the spacing allows ${allows}`);
    }
    let n = lo;
    let last: { rule: string; pitch: number; reason: string } | null = null;
    while (n <= hi) {
      let next = n + step;
      let anyLaid = false;
      const tried = new Set<string>();
      for (const v of open) {
        if (v.dead || n < v.b.lo || n > v.b.hi) continue;
        if (hooks.shouldStop?.()) {
          cancelled = true;
          return;
        }
        if (analyses >= maxAnalyses) {
          truncated = true;
          return;
        }
        const design = designFor(base, c, layout, n, v.edges);
        if (!design) continue;
        // Two variants may lay out the same bolts; analyse each layout once.
        const key = design.bolts.map((x) => x.sMm.toFixed(6)).join(",");
        if (tried.has(key)) continue;
        tried.add(key);
        anyLaid = true;
        let a: JointAnalysis;
        analyses++;
        try {
          a = analyzeJoint(design);
        } catch (e) {
          const why = e instanceof DesignRefusedError ? e.issues.map(formatIssue).join("; ") : String(e);
          return block("core", L / n, `the core refuses ${n} × ${c.thread.designation}: ${why}`);
        }
        if (!areaByOffset.has(c.frame.offsetMm) && a.summary.meanGasketStressMpa > 0)
          areaByOffset.set(c.frame.offsetMm, (n * a.preload.targetN) / a.summary.meanGasketStressMpa);
        const verdict = judge(a.checks, judging);
        if (verdict.ok) {
          found.push(candidateOf(c, design, a, verdict.carried));
          return;
        }
        // The check that ends the scan is the one to name: one more bolts do not help, when there is one.
        const first =
          (!verdict.moreBoltsMayHelp && verdict.blocking.find((x) => !moreBoltsHelp(x))) ||
          verdict.blocking[0];
        const pitch = pitchRange(a).max;
        last = {
          rule: ruleOf(first.id),
          pitch,
          reason: `${n} × ${c.thread.designation}: ${first.title} (${first.status}${first.value !== null ? `, ${quantityParts(first.value, first.unit, units).join(" ")}` : ""}${first.limit !== null ? ` against ${quantityParts(first.limit, first.unit, units)[0]}` : ""})`,
        };
        if (!verdict.moreBoltsMayHelp) v.dead = true;
        // The mean gasket stress does not depend on where the bolts stand: the lift holds for every variant.
        else if (verdict.blocking.some((x) => x.id === "gasket.seating")) {
          const meanAtMin = (a.summary.meanGasketStressMpa * a.preload.minN) / a.preload.targetN;
          if (meanAtMin > 0) next = Math.max(next, up(Math.ceil((0.98 * n * seatLimit) / meanAtMin)));
        }
      }
      if (open.every((v) => v.dead || (!anyLaid && n >= v.b.hi))) break;
      n = next;
    }
    if (last) block(last.rule, last.pitch, last.reason);
    else block(loRule, densest, `${c.thread.designation}: no count from ${lo} to ${hi} could be laid out`);
  };
  combos.forEach((c, ci) => {
    if (cancelled || truncated) return;
    searchCombo(c);
    hooks.onProgress?.({ done: ci + 1, total: combos.length, analyses });
  });
  const candidates = paretoFront(found).map((x, i) => ({ ...x, rank: i + 1 }));
  return {
    candidates,
    blocked,
    message: candidates.length > 0 ? null : explainNothing(blocked, cancelled, truncated, units),
    combinations: combos.length,
    analyses,
    truncated,
    cancelled,
    policy: SUGGESTION_POLICY,
  };
}

/** "no size up to M36 seats the gasket at 72 mm pitch", or the blocks per size when they differ. */
export function explainNothing(
  blocked: BlockedCombination[],
  cancelled: boolean,
  truncated: boolean,
  units: UnitSystem = "SI",
): string {
  if (cancelled) return "The search was cancelled before any pattern qualified.";
  if (blocked.length === 0)
    return truncated ? "The work cap ended the search before any pattern qualified." : "Nothing to search.";
  const rules = new Set(blocked.map((x) => x.rule));
  const largest = blocked[blocked.length - 1];
  if (rules.size === 1) {
    const rule = largest.rule;
    const at = largest.pitchMm !== null ? ` at ${lengthText(largest.pitchMm, units)} pitch` : "";
    return `No size up to ${largest.designation} ${ruleAsk(rule)}${at}: ${largest.reason}.${truncated ? " (The work cap ended the search early.)" : ""}`;
  }
  const bySize = new Map<string, BlockedCombination>();
  for (const x of blocked) bySize.set(x.designation, x);
  return `No size qualifies. ${[...bySize.values()].map((x) => x.reason).join("; ")}.${truncated ? " (The work cap ended the search early.)" : ""}`;
}
