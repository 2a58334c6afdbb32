/**
 * Bolt materials with room-temperature strengths by size range. Strengths of ISO 898-1 classes
 * and ASTM A193/A320 grades as reproduced in handbooks [pub2]; ASME Section II-D allowable S for
 * B7 and B7M [pub2]; other allowables [mem: verify against Section II-D]. Moduli [mem].
 */
import { inToMm, ksiToMpa } from "../units";
import type { Confidence, Provenance } from "./confidence";
import type { BoltStrengthRange, Fastener, StockedBoltMaterial } from "../design";

export interface StrengthRange {
  /** Upper limit of the nominal diameter range, mm (inclusive). */
  maxDiameterMm: number;
  /** Proof stress Sp, MPa (null where the specification defines none). */
  proofMpa: number | null;
  yieldMpa: number;
  tensileMpa: number;
  /** Allowable bolt stress at room temperature for ASME VIII-1 Appendix 2, MPa (null: not a II-D bolting material). */
  allowableMpa: number | null;
  strengthConfidence: Confidence;
  allowableConfidence: Confidence | null;
}

export interface BoltMaterialRow extends Provenance {
  id: string;
  name: string;
  modulusMpa: number;
  ranges: StrengthRange[];
  allowableSource: string | null;
}

const ksi = ksiToMpa;
const inch = inToMm;

export const BOLT_MATERIALS: readonly BoltMaterialRow[] = [
  {
    id: "iso-898-1-8.8",
    name: "ISO 898-1 property class 8.8",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: 16,
        proofMpa: 580,
        yieldMpa: 640,
        tensileMpa: 800,
        allowableMpa: null,
        strengthConfidence: "pub2",
        allowableConfidence: null,
      },
      {
        maxDiameterMm: 72,
        proofMpa: 600,
        yieldMpa: 660,
        tensileMpa: 830,
        allowableMpa: null,
        strengthConfidence: "pub2",
        allowableConfidence: null,
      },
    ],
    allowableSource: null,
    source: "ISO 898-1 Table 3 (proof Sp, Rp0.2, Rm)",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "iso-898-1-10.9",
    name: "ISO 898-1 property class 10.9",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: 72,
        proofMpa: 830,
        yieldMpa: 940,
        tensileMpa: 1040,
        allowableMpa: null,
        strengthConfidence: "pub2",
        allowableConfidence: null,
      },
    ],
    allowableSource: null,
    source: "ISO 898-1 Table 3",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "iso-898-1-12.9",
    name: "ISO 898-1 property class 12.9",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: 72,
        proofMpa: 970,
        yieldMpa: 1100,
        tensileMpa: 1220,
        allowableMpa: null,
        strengthConfidence: "pub2",
        allowableConfidence: null,
      },
    ],
    allowableSource: null,
    source: "ISO 898-1 Table 3",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b7",
    name: "ASTM A193 grade B7 (Cr-Mo)",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: inch(2.5),
        proofMpa: null,
        yieldMpa: ksi(105),
        tensileMpa: ksi(125),
        allowableMpa: ksi(25),
        strengthConfidence: "pub2",
        allowableConfidence: "pub2",
      },
      {
        maxDiameterMm: inch(4),
        proofMpa: null,
        yieldMpa: ksi(95),
        tensileMpa: ksi(115),
        allowableMpa: null,
        strengthConfidence: "mem",
        allowableConfidence: null,
      },
    ],
    allowableSource: "ASME BPVC Section II-D Table 3, room temperature",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 and ASME II-D (as reproduced; editions not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b7m",
    name: "ASTM A193 grade B7M (hardness-limited B7)",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: inch(4),
        proofMpa: null,
        yieldMpa: ksi(80),
        tensileMpa: ksi(100),
        allowableMpa: ksi(20),
        strengthConfidence: "pub2",
        allowableConfidence: "pub2",
      },
    ],
    allowableSource: "ASME BPVC Section II-D Table 3, room temperature",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 and ASME II-D (as reproduced; editions not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b16",
    name: "ASTM A193 grade B16 (Cr-Mo-V)",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: inch(2.5),
        proofMpa: null,
        yieldMpa: ksi(105),
        tensileMpa: ksi(125),
        allowableMpa: ksi(25),
        strengthConfidence: "pub2",
        allowableConfidence: "mem",
      },
    ],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b8-cl1",
    name: "ASTM A193 grade B8 class 1 (304, solution treated)",
    modulusMpa: 193_000,
    ranges: [
      {
        maxDiameterMm: inch(4),
        proofMpa: null,
        yieldMpa: ksi(30),
        tensileMpa: ksi(75),
        allowableMpa: ksi(18.8),
        strengthConfidence: "pub2",
        allowableConfidence: "mem",
      },
    ],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b8-cl2",
    name: "ASTM A193 grade B8 class 2 (304, strain hardened)",
    modulusMpa: 193_000,
    ranges: [
      {
        maxDiameterMm: inch(0.75),
        proofMpa: null,
        yieldMpa: ksi(100),
        tensileMpa: ksi(125),
        allowableMpa: ksi(25),
        strengthConfidence: "pub2",
        allowableConfidence: "mem",
      },
      {
        maxDiameterMm: inch(1),
        proofMpa: null,
        yieldMpa: ksi(80),
        tensileMpa: ksi(115),
        allowableMpa: ksi(20),
        strengthConfidence: "mem",
        allowableConfidence: "mem",
      },
      {
        maxDiameterMm: inch(1.25),
        proofMpa: null,
        yieldMpa: ksi(65),
        tensileMpa: ksi(105),
        allowableMpa: ksi(16.2),
        strengthConfidence: "mem",
        allowableConfidence: "mem",
      },
      {
        maxDiameterMm: inch(1.5),
        proofMpa: null,
        yieldMpa: ksi(50),
        tensileMpa: ksi(100),
        allowableMpa: ksi(12.5),
        strengthConfidence: "mem",
        allowableConfidence: "mem",
      },
    ],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 (as reproduced; size breaks from memory)",
    confidence: "pub2",
  },
  {
    id: "astm-a320-l7",
    name: "ASTM A320 grade L7 (low-temperature Cr-Mo)",
    modulusMpa: 205_000,
    ranges: [
      {
        maxDiameterMm: inch(2.5),
        proofMpa: null,
        yieldMpa: ksi(105),
        tensileMpa: ksi(125),
        allowableMpa: ksi(25),
        strengthConfidence: "pub2",
        allowableConfidence: "mem",
      },
    ],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A320/A320M",
    edition: "ASTM A320 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
];

export function getBoltMaterialById(id: string): BoltMaterialRow | undefined {
  return BOLT_MATERIALS.find((m) => m.id === id);
}

/** The five stored values of each strength range, in ascending order of size (a copy). */
export function sortedStrengthRanges(ranges: readonly BoltStrengthRange[]): BoltStrengthRange[] {
  return [...ranges]
    .sort((a, b) => a.maxDiameterMm - b.maxDiameterMm)
    .map((r) => ({
      maxDiameterMm: r.maxDiameterMm,
      proofMpa: r.proofMpa,
      yieldMpa: r.yieldMpa,
      tensileMpa: r.tensileMpa,
      allowableMpa: r.allowableMpa,
    }));
}

/**
 * A Stockroom bolting row as a material row. The organisation's row carries no confidence tag of
 * ours, so its values are tagged "mem" (never read as published); the row's own source travels
 * with it. Ranges are put in ascending order of size.
 */
export function stockedBoltMaterialRow(id: string, m: StockedBoltMaterial): BoltMaterialRow {
  return {
    id,
    name: m.name,
    modulusMpa: m.modulusMpa,
    ranges: sortedStrengthRanges(m.ranges).map((r) => ({
      ...r,
      strengthConfidence: "mem",
      allowableConfidence: r.allowableMpa === null ? null : "mem",
    })),
    allowableSource: m.ranges.some((r) => r.allowableMpa !== null) ? m.source : null,
    source: m.source,
    edition: m.edition,
    confidence: "mem",
  };
}

/**
 * The material a fastener is made of: its embedded Stockroom row when it has one, else the
 * catalogue row its `materialId` names (undefined when there is none).
 */
export function boltMaterialOf(
  f: Pick<Fastener, "materialId" | "stockedMaterial">,
): BoltMaterialRow | undefined {
  return f.stockedMaterial
    ? stockedBoltMaterialRow(f.materialId, f.stockedMaterial)
    : getBoltMaterialById(f.materialId);
}

/**
 * Strength range for a bolt diameter (the last range if the size is larger than all of them).
 * Example: `getStrengthForDiameter(getBoltMaterialById("iso-898-1-8.8")!, 20).proofMpa` → 600.
 */
export function getStrengthForDiameter(material: BoltMaterialRow, nominalDiameterMm: number): StrengthRange {
  return (
    material.ranges.find((r) => nominalDiameterMm <= r.maxDiameterMm + 1e-9) ??
    material.ranges[material.ranges.length - 1]
  );
}
