/**
 * TEMA Table D-5 style bolting data (inch): minimum bolt spacing, radial distance bolt to hub, and
 * bolt to flange edge. The 1/2 in row is [pub2]; the other rows are [mem] and are shown only as
 * plausibility information, never as the pass/fail limit. The pass/fail wrench clearance is
 * derived from the nut's across-corners size and the tool (see checks/spacing.ts).
 */
import { inToMm } from "../units";
import type { Provenance } from "./confidence";

export interface WrenchClearanceRow extends Provenance {
  id: string;
  designation: string;
  minSpacingMm: number;
  boltToHubMm: number;
  boltToEdgeMm: number;
}

const RAW: [string, number, number, number, "pub2" | "mem"][] = [
  ["1/2", 1.25, 13 / 16, 5 / 8, "pub2"],
  ["5/8", 1.5, 15 / 16, 3 / 4, "mem"],
  ["3/4", 1.75, 1.125, 13 / 16, "mem"],
  ["7/8", 2.0625, 1.25, 15 / 16, "mem"],
  ["1", 2.25, 1.375, 1.0625, "mem"],
  ["1-1/8", 2.5, 1.5, 1.125, "mem"],
  ["1-1/4", 2.8125, 1.75, 1.25, "mem"],
  ["1-1/2", 3.25, 2.0, 1.5, "mem"],
  ["2", 4.25, 2.5, 2.0, "mem"],
];

export const WRENCH_CLEARANCES: readonly WrenchClearanceRow[] = RAW.map(([des, s, r, e, conf]) => ({
  id: `tema-d5-${des}`,
  designation: des,
  minSpacingMm: inToMm(s),
  boltToHubMm: inToMm(r),
  boltToEdgeMm: inToMm(e),
  source: "TEMA Table D-5 bolting data",
  edition:
    conf === "pub2"
      ? "TEMA (as reproduced; edition not verified)"
      : "from memory; verify against TEMA Table D-5",
  confidence: conf,
}));

export function getWrenchClearanceById(id: string): WrenchClearanceRow | undefined {
  return WRENCH_CLEARANCES.find((r) => r.id === id);
}

export function findWrenchClearance(designation: string): WrenchClearanceRow | undefined {
  return WRENCH_CLEARANCES.find((r) => r.designation === designation);
}
