/**
 * Gasket types with ASME gasket factors m and y (VIII-1 Table 2-5.1: design values, not assembly
 * targets; the manufacturer's data supersede them). Metal rows [pub] as printed in ASME VIII-2 2010
 * Table 4.16.1; the soft rows [pub2]; the compressed-fibre rows [mem]. Modulus and thickness are
 * order-of-magnitude defaults for the stiffness and beam estimates [mem]: enter the gasket test
 * report's values (EN 13555 EG, QMIN, QSMIN, QSMAX) where you have them. Tightness parameters are
 * product data and are left empty here on purpose.
 */
import { psiToMpa } from "../units";
import type { Confidence, Provenance } from "./confidence";

export interface GasketTypeRow extends Provenance {
  id: string;
  name: string;
  family:
    | "elastomer"
    | "fibre"
    | "spiral-wound"
    | "metal-jacketed"
    | "grooved-metal"
    | "solid-metal"
    | "ring-joint";
  m: number;
  yMpa: number;
  /** The value in the table's own unit, psi. */
  yPsi: number;
  qMinMpa?: number;
  qsMinMpa?: number;
  qsMaxMpa?: number;
  typicalModulusMpa: number;
  typicalThicknessMm: number;
  modulusConfidence: Confidence;
}

const TABLE = "ASME BPVC VIII-1 Table 2-5.1";
const PUB_EDITION = "values as printed in ASME VIII-2 2010 Table 4.16.1";
const PUB2_EDITION = "Table 2-5.1 as reproduced (edition not verified)";

type Raw = [
  id: string,
  name: string,
  family: GasketTypeRow["family"],
  m: number,
  yPsi: number,
  conf: Confidence,
  eMpa: number,
  tMm: number,
];

const RAW: Raw[] = [
  ["elastomer-below-75a", "Elastomer without fabric, below 75A Shore", "elastomer", 0.5, 0, "pub2", 5, 3],
  [
    "elastomer-75a-and-above",
    "Elastomer without fabric, 75A Shore or higher",
    "elastomer",
    1.0,
    200,
    "pub2",
    10,
    3,
  ],
  [
    "elastomer-cotton-insertion",
    "Elastomer with cotton fabric insertion",
    "elastomer",
    1.25,
    400,
    "pub2",
    50,
    3,
  ],
  ["vegetable-fibre", "Vegetable fibre", "fibre", 1.75, 1100, "pub2", 300, 1.5],
  [
    "compressed-fibre-1-16",
    "Compressed fibre sheet with binder, 1/16 in (row of the 'with suitable binder' type)",
    "fibre",
    2.75,
    3700,
    "mem",
    1500,
    1.6,
  ],
  [
    "compressed-fibre-1-8",
    "Compressed fibre sheet with binder, 1/8 in",
    "fibre",
    2.0,
    1600,
    "mem",
    1000,
    3.2,
  ],
  [
    "spiral-wound-ss-fibre",
    "Spiral-wound metal, stainless, fibre filled",
    "spiral-wound",
    3.0,
    10000,
    "pub2",
    1000,
    3.3,
  ],
  [
    "jacketed-soft-al",
    "Flat metal jacketed, fibre filled: soft aluminium",
    "metal-jacketed",
    3.25,
    5500,
    "pub",
    2000,
    3.2,
  ],
  [
    "jacketed-soft-cu",
    "Flat metal jacketed, fibre filled: soft copper or brass",
    "metal-jacketed",
    3.5,
    6500,
    "pub",
    2000,
    3.2,
  ],
  [
    "jacketed-iron",
    "Flat metal jacketed, fibre filled: iron or soft steel",
    "metal-jacketed",
    3.75,
    7600,
    "pub",
    2000,
    3.2,
  ],
  [
    "jacketed-monel",
    "Flat metal jacketed, fibre filled: Monel",
    "metal-jacketed",
    3.5,
    8000,
    "pub",
    2000,
    3.2,
  ],
  [
    "jacketed-cr",
    "Flat metal jacketed, fibre filled: 4–6 % chrome",
    "metal-jacketed",
    3.75,
    9000,
    "pub",
    2000,
    3.2,
  ],
  [
    "jacketed-ss",
    "Flat metal jacketed, fibre filled: stainless steels",
    "metal-jacketed",
    3.75,
    9000,
    "pub",
    2000,
    3.2,
  ],
  ["grooved-soft-al", "Grooved metal: soft aluminium", "grooved-metal", 3.25, 5500, "pub", 20000, 3],
  ["grooved-soft-cu", "Grooved metal: soft copper or brass", "grooved-metal", 3.5, 6500, "pub", 20000, 3],
  ["grooved-iron", "Grooved metal: iron or soft steel", "grooved-metal", 3.75, 7600, "pub", 20000, 3],
  ["grooved-monel-cr", "Grooved metal: Monel or 4–6 % chrome", "grooved-metal", 3.75, 9000, "pub", 20000, 3],
  ["grooved-ss", "Grooved metal: stainless steels", "grooved-metal", 4.25, 10100, "pub", 20000, 3],
  ["solid-soft-al", "Solid flat metal: soft aluminium", "solid-metal", 4.0, 8800, "pub", 70000, 1.5],
  ["solid-soft-cu", "Solid flat metal: soft copper or brass", "solid-metal", 4.75, 13000, "pub", 110000, 1.5],
  ["solid-iron", "Solid flat metal: iron or soft steel", "solid-metal", 5.5, 18000, "pub", 200000, 1.5],
  [
    "solid-monel-cr",
    "Solid flat metal: Monel or 4–6 % chrome",
    "solid-metal",
    6.0,
    21800,
    "pub",
    200000,
    1.5,
  ],
  ["solid-ss", "Solid flat metal: stainless steels", "solid-metal", 6.5, 26000, "pub", 195000, 1.5],
  ["ring-joint-iron", "Ring joint: iron or soft steel", "ring-joint", 5.5, 18000, "pub", 200000, 11],
  ["ring-joint-monel-cr", "Ring joint: Monel or 4–6 % chrome", "ring-joint", 6.0, 21800, "pub", 200000, 11],
  ["ring-joint-ss", "Ring joint: stainless steels", "ring-joint", 6.5, 26000, "pub", 195000, 11],
];

export const GASKET_TYPES: readonly GasketTypeRow[] = RAW.map(([id, name, family, m, yPsi, conf, e, t]) => ({
  id,
  name,
  family,
  m,
  yPsi,
  yMpa: psiToMpa(yPsi),
  typicalModulusMpa: e,
  typicalThicknessMm: t,
  modulusConfidence: "mem",
  source: `${TABLE} (gasket factors m, y)`,
  edition:
    conf === "pub" ? PUB_EDITION : conf === "pub2" ? PUB2_EDITION : "from memory; verify against Table 2-5.1",
  confidence: conf,
}));

export function getGasketTypeById(id: string): GasketTypeRow | undefined {
  return GASKET_TYPES.find((g) => g.id === id);
}
