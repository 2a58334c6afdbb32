/**
 * Gasket stress over the whole gasket area on a regular grid, for the heat map. Cone estimate:
 * the superposed footprints evaluated at each cell centre. Beam estimate: the along-path profile
 * mapped across the gasket width (each cell takes the value at its nearest path position).
 * Units: mm, MPa; forces in N.
 */
import type { JointDesign } from "./design";
import { buildJointModel, type JointModel } from "./joint-model";
import { computeGasketStressProfiles, type GasketStressProfiles } from "./gasket-stress";
import { conePressureAtMpa } from "./cone-superposition";
import { isOnGasket } from "./gasket-region";
import { projectOntoPath } from "./path";
import type { EstimatorName } from "./estimator-choice";
import { DesignRefusedError, validateJointDesign } from "./validate";
import * as fm from "./fixed-math";
import { OUTSIDE_GASKET } from "./grid-cell";

export interface GasketStressGrid {
  nx: number;
  ny: number;
  /** Cell centres span these bounds; row 0 is the top row (y = yMaxMm side), column 0 the left. */
  xMinMm: number;
  xMaxMm: number;
  yMinMm: number;
  yMaxMm: number;
  /** Row-major nx·ny stresses at the target preload, MPa; OUTSIDE_GASKET off the gasket. */
  values: Float32Array;
  estimator: EstimatorName;
  maxMpa: number;
  /** Σ stress × cell area over gasket cells, N, against the sum of the bolt forces. */
  integratedForceN: number;
  totalBoltForceN: number;
}

/**
 * Example: `computeGasketStressGrid(design, 256, 256)` → 65 536 cells, with `estimator` the
 * governing one unless `options.estimator` forces the other.
 */
export function computeGasketStressGrid(
  design: JointDesign,
  nx: number,
  ny: number,
  options: { estimator?: EstimatorName } = {},
): GasketStressGrid {
  const issues = validateJointDesign(design);
  if (issues.length > 0) throw new DesignRefusedError(issues);
  const model = buildJointModel(design);
  return computeGridFromProfiles(model, computeGasketStressProfiles(model), nx, ny, options.estimator);
}

/** Grid from an already computed model and profiles (used by analyzeJoint's callers to avoid recomputation). */
export function computeGridFromProfiles(
  model: JointModel,
  profiles: GasketStressProfiles,
  nx: number,
  ny: number,
  estimator?: EstimatorName,
): GasketStressGrid {
  const region = model.region;
  const est = estimator ?? profiles.choice.estimator;
  const b = region.bounds;
  const dx = (b.xMaxMm - b.xMinMm) / nx;
  const dy = (b.yMaxMm - b.yMinMm) / ny;
  const values = new Float32Array(nx * ny);
  const path = region.path;
  const L = path.lengthMm;
  const N = profiles.sampleCount;
  const beam = profiles.beamMpa;
  const circular = path.segments.every(
    (s) => s.kind === "arc" && Math.abs(s.cx) < 1e-9 && Math.abs(s.cy) < 1e-9,
  );
  const rPath = L / (2 * Math.PI);
  let max = 0;
  let force = 0;
  for (let j = 0; j < ny; j++) {
    const y = b.yMaxMm - (j + 0.5) * dy;
    for (let i = 0; i < nx; i++) {
      const x = b.xMinMm + (i + 0.5) * dx;
      const idx = j * nx + i;
      if (!isOnGasket(region, x, y)) {
        values[idx] = OUTSIDE_GASKET;
        continue;
      }
      let v: number;
      if (est === "cone") v = conePressureAtMpa(profiles.coneField, x, y);
      else {
        let s: number;
        if (circular) {
          const t = fm.atan2(x, y);
          s = (t < 0 ? t + 2 * Math.PI : t) * rPath;
        } else s = projectOntoPath(path, { x, y }).sMm;
        const u = (s / L) * N;
        const k0 = Math.floor(u) % N;
        const fr = u - Math.floor(u);
        v = beam[k0] * (1 - fr) + beam[(k0 + 1) % N] * fr;
      }
      values[idx] = v;
      if (v > max) max = v;
      force += v * dx * dy;
    }
  }
  return {
    nx,
    ny,
    xMinMm: b.xMinMm,
    xMaxMm: b.xMaxMm,
    yMinMm: b.yMinMm,
    yMaxMm: b.yMaxMm,
    values,
    estimator: est,
    maxMpa: max,
    integratedForceN: force,
    totalBoltForceN: profiles.totalForceN,
  };
}
