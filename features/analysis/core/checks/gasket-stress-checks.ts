/**
 * Gasket stress checks on the governing estimate: seating (minimum at minimum preload ≥ Qmin if
 * given, else y), crush (maximum at maximum preload ≤ Qsmax where given), operating (residual at
 * minimum preload after the pressure end load ≥ m·P, and ≥ QSmin where given).
 */
import type { JointModel } from "../joint-model";
import type { ProfileSummary } from "../gasket-stress";
import { makeCheck, type CheckRecord } from "./check-record";

export function checkGasketStress(
  model: JointModel,
  governing: ProfileSummary,
  estimator: string,
): CheckRecord[] {
  const g = model.design.gasket.material;
  const p = model.preload;
  const minFactor = p.minN / p.targetN;
  const maxFactor = p.maxN / p.targetN;
  const seatMin = governing.minMpa * minFactor;
  const crushMax = governing.maxMpa * maxFactor;
  const out: CheckRecord[] = [];
  const useQ = g.qMinMpa !== undefined;
  const seatLimit = useQ ? g.qMinMpa! : g.yMpa;
  out.push(
    makeCheck({
      id: "gasket.seating",
      title: "Gasket seating: minimum stress along the path at minimum preload",
      value: seatMin,
      limit: seatLimit,
      unit: "MPa",
      status: seatMin >= seatLimit ? "pass" : "fail",
      source: useQ
        ? "EN 13555 Qmin from the gasket test report (design input)"
        : "ASME VIII-1 Table 2-5.1 gasket factor y",
      note: `${estimator} estimate, minimum at s = ${governing.minAt.sMm.toFixed(1)} mm; preload −${(p.scatter * 100).toFixed(0)} % for the tightening method.`,
    }),
  );
  out.push(
    makeCheck({
      id: "gasket.crush",
      title: "Gasket crush: maximum stress at maximum preload",
      value: crushMax,
      limit: g.qsMaxMpa ?? null,
      unit: "MPa",
      status: g.qsMaxMpa === undefined ? "not-applicable" : crushMax <= g.qsMaxMpa ? "pass" : "fail",
      source: "EN 13555 Qsmax from the gasket test report (design input)",
      note:
        g.qsMaxMpa === undefined
          ? "No Qsmax given for this gasket: enter the manufacturer's value to check crushing."
          : `${estimator} estimate, maximum at s = ${governing.maxAt.sMm.toFixed(1)} mm; preload +${(p.scatter * 100).toFixed(0)} %.`,
    }),
  );
  const totalPreload = p.minN * model.boltPoints.length;
  const totalExternal = model.externalLoadPerBoltN.reduce((a, v) => a + Math.max(v, 0), 0);
  const residualFactor = Math.max(
    0,
    (totalPreload - (1 - model.jointConstant) * totalExternal) / totalPreload,
  );
  const residual = seatMin * residualFactor;
  const mP = g.m * model.design.loads.designPressureMpa;
  const pressurised = model.design.loads.designPressureMpa > 0;
  out.push(
    makeCheck({
      id: "gasket.operating-m-p",
      title: "Operating: residual gasket stress ≥ m·P",
      value: residual,
      limit: mP,
      unit: "MPa",
      status: !pressurised ? "not-applicable" : residual >= mP ? "pass" : "fail",
      source: "ASME VIII-1 Appendix 2 (Hp = 2b·π·G·m·P: residual contact stress m·P)",
      note: `Minimum stress at minimum preload reduced by the member unloading (1 − C)·P: factor ${residualFactor.toFixed(3)}.`,
    }),
  );
  out.push(
    makeCheck({
      id: "gasket.operating-qs-min",
      title: "Operating: residual gasket stress ≥ QSmin",
      value: residual,
      limit: g.qsMinMpa ?? null,
      unit: "MPa",
      status: g.qsMinMpa === undefined ? "not-applicable" : residual >= g.qsMinMpa ? "pass" : "fail",
      source: "EN 13555 QSmin(L) from the gasket test report (design input)",
      note:
        g.qsMinMpa === undefined
          ? "No QSmin given for this gasket."
          : "Residual after pressurisation at minimum preload.",
    }),
  );
  return out;
}
