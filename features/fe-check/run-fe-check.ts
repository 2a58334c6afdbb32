/**
 * One FE cross-check of a design: validates it, runs the models in turn on CalculiX and sets
 * their results beside the estimate. Used by the job worker (fe-job.ts) and the command line
 * (`npm run fe-check`). Server-side (the models spawn the solver). A model that cannot run says
 * why in its error and the others still run; cancellation and the time limit end the whole run.
 */
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { formatIssue, validateJointDesign } from "@/features/analysis/core/validate";
import { sha256OfJson } from "@/features/analysis/content-hash";
import { CcxCancelled, CcxError } from "./ccx-runner";
import { FeInputError, runStackCheck } from "./joint-stack";
import { solveStack } from "./stack-study";
import { runGasketPathCheck, type GasketPathFeResult } from "./gasket-path-study";
import {
  compareWithEstimate,
  FE_CAUTIONS,
  type FeCheckResult,
  type FeModelKey,
  type FeProgress,
  type GasketPathSummary,
} from "./fe-check-result";

export interface FeRunHooks {
  /** Called when a model starts and after every solver run; may be async (progress writes). */
  onProgress?: (stage: string, progress: FeProgress) => void | Promise<void>;
  signal?: AbortSignal;
  /** Wall-time limit of the whole run, ms (default 10 minutes). */
  timeLimitMs?: number;
}

export class FeRunError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "FeRunError";
  }
}

export const FE_DEFAULT_TIME_LIMIT_MS = 10 * 60_000;

/** Runs every model; throws FeRunError (bad input, time limit) or CcxCancelled (cancelled). */
export async function runFeCheck(document: JointDesign, hooks: FeRunHooks = {}): Promise<FeCheckResult> {
  const issues = validateJointDesign(document);
  if (issues.length > 0)
    throw new FeRunError(
      `The design has problems to fix before it can be solved: ${issues.slice(0, 5).map(formatIssue).join("; ")}.`,
    );
  const limitMs = hooks.timeLimitMs ?? FE_DEFAULT_TIME_LIMIT_MS;
  const deadline = Date.now() + limitMs;
  const timeLimit = new AbortController();
  const timer = setTimeout(() => timeLimit.abort(), limitMs);
  const signal = hooks.signal ? AbortSignal.any([hooks.signal, timeLimit.signal]) : timeLimit.signal;
  const progress: FeProgress = { model: null, runs: 0, elements: 0, solverSeconds: 0 };
  const report = async (stage: string) => hooks.onProgress?.(stage, { ...progress });
  try {
    const analysis = analyzeJoint(document);
    const model = buildJointModel(document);

    progress.model = "stack" satisfies FeModelKey;
    await report("Bolt stack: meshing");
    let stack: FeCheckResult["stack"] = null;
    let stackError: string | null = null;
    try {
      stack = await runStackCheck(model, solveStack, {
        hooks: {
          signal,
          timeoutMs: Math.max(1000, deadline - Date.now()),
          onRun: async (run, elements, seconds) => {
            progress.runs += 1;
            progress.elements = elements;
            progress.solverSeconds += seconds;
            await report(`Bolt stack: linear run ${run}`);
          },
        },
      });
    } catch (error) {
      if (error instanceof CcxCancelled || signal.aborted) throw error;
      if (error instanceof FeInputError || error instanceof CcxError) stackError = error.message;
      else throw error;
    }

    progress.model = "gasket-path" satisfies FeModelKey;
    progress.elements = 0;
    await report("Gasket path: meshing");
    let gasketPath: GasketPathSummary | null = null;
    let gasketPathError: string | null = null;
    const stackSeconds = progress.solverSeconds;
    let pathRuns = 0;
    // The model reports synchronously; the progress writes are chained so they land in order.
    let pending: Promise<void> = Promise.resolve();
    try {
      const fe = await runGasketPathCheck(document, {
        signal,
        processTimeoutMs: Math.max(1000, deadline - Date.now()),
        onProgress: (stage, info) => {
          if (stage === "meshing") return; // reported above, before the model starts
          if (info.elements !== undefined) progress.elements = info.elements;
          if (info.solverSeconds !== undefined) progress.solverSeconds = stackSeconds + info.solverSeconds;
          let label = `Gasket path: ${stage}`;
          if (stage === "solving" && (info.solverSeconds ?? 0) > 0) {
            pathRuns += 1;
            progress.runs += 1;
            label = `Gasket path: contact run ${pathRuns}`;
          }
          pending = pending.then(() => report(label));
        },
      });
      gasketPath = summariseGasketPath(fe);
    } catch (error) {
      if (error instanceof CcxCancelled || signal.aborted) throw error;
      if (error instanceof FeInputError || error instanceof CcxError) gasketPathError = error.message;
      else if (error instanceof Error)
        gasketPathError = `The gasket path model could not be built: ${error.message}`;
      else throw error;
    } finally {
      await pending;
    }

    await report("Comparing with the estimate");
    return {
      documentHash: sha256OfJson(document),
      stack,
      stackError,
      gasketPath,
      gasketPathError,
      // Like for like: the gasket path rows compare with the estimate the model computed at the
      // same minimum preload; without the model, with the analysis's own summary.
      comparison: compareWithEstimate(
        gasketPath
          ? {
              minGasketStressMpa: gasketPath.estimate.minMpa,
              maxGasketStressMpa: gasketPath.estimate.maxMpa,
              liftedLengthMm: gasketPath.estimate.liftedLengthMm,
            }
          : {
              minGasketStressMpa: analysis.gasketStress.minMpa,
              maxGasketStressMpa: analysis.gasketStress.maxMpa,
              liftedLengthMm: analysis.gasketStress.beam.liftedLengthMm,
            },
        stack,
        gasketPath,
      ),
      cautions: [...FE_CAUTIONS, ...(stack?.assumptions ?? []), ...(gasketPath?.assumptions ?? [])],
      solverSeconds: progress.solverSeconds,
    };
  } catch (error) {
    if (timeLimit.signal.aborted && !(hooks.signal?.aborted ?? false))
      throw new FeRunError(`The FE cross-check ran past its time limit of ${Math.round(limitMs / 1000)} s.`);
    throw error;
  } finally {
    clearTimeout(timer);
  }
}

/** What the stored result keeps of the gasket path model: the profile beside the estimate, the extremes and the checks. */
function summariseGasketPath(fe: GasketPathFeResult): GasketPathSummary {
  return {
    modelKind: fe.modelKind,
    elements: fe.mesh.elements,
    linearRuns: fe.linearRuns,
    pathKind: fe.path.kind,
    sMm: fe.path.sMm,
    stressMpa: fe.path.stressMpa,
    estimateMpa: fe.path.estimateMpa,
    onGasket: fe.path.onGasket,
    minStressMpa: fe.fe.minMpa,
    maxStressMpa: fe.fe.maxMpa,
    liftedLengthMm: fe.fe.liftedLengthMm,
    closedAreaFraction: fe.fe.closedAreaFraction,
    peakCellMpa: fe.fe.peakCellMpa,
    estimate: { ...fe.estimate },
    forceBalanceError: fe.forceBalance.error,
    assumptions: fe.assumptions,
    warnings: fe.warnings,
  };
}
