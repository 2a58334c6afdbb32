/**
 * Bolt materials with room-temperature strengths by size range. Strengths of ISO 898-1 classes
 * and ASTM A193/A320 grades as reproduced in handbooks [pub2]; ASME Section II-D allowable S for
 * B7 and B7M [pub2]; other allowables [mem: verify against Section II-D]. Moduli [mem].
 */
import { inToMm, ksiToMpa } from "../units";
import type { Confidence, Provenance } from "./confidence";
import { rangeForDiameter, sortedStrengthRanges } from "./lookups";
import type { Fastener, StockedBoltMaterial } from "../design";

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

/** An ISO 898-1 size range up to `maxDiameterMm`: proof Sp, Rp0.2 and Rm in MPa [pub2]; no II-D allowable. */
const isoRange = (
  maxDiameterMm: number,
  proofMpa: number,
  yieldMpa: number,
  tensileMpa: number,
): StrengthRange => ({
  maxDiameterMm,
  proofMpa,
  yieldMpa,
  tensileMpa,
  allowableMpa: null,
  strengthConfidence: "pub2",
  allowableConfidence: null,
});

/**
 * An ASTM size range up to `maxIn` inch: yield, tensile and the II-D allowable in ksi (null where
 * the range has none), each with its confidence. ASTM grades define no proof stress.
 */
const astmRange = (
  maxIn: number,
  yieldKsi: number,
  tensileKsi: number,
  allowableKsi: number | null,
  strengthConfidence: Confidence,
  allowableConfidence: Confidence | null,
): StrengthRange => ({
  maxDiameterMm: inch(maxIn),
  proofMpa: null,
  yieldMpa: ksi(yieldKsi),
  tensileMpa: ksi(tensileKsi),
  allowableMpa: allowableKsi === null ? null : ksi(allowableKsi),
  strengthConfidence,
  allowableConfidence,
});

export const BOLT_MATERIALS: readonly BoltMaterialRow[] = [
  {
    id: "iso-898-1-8.8",
    name: "ISO 898-1 property class 8.8",
    modulusMpa: 205_000,
    ranges: [isoRange(16, 580, 640, 800), isoRange(72, 600, 660, 830)],
    allowableSource: null,
    source: "ISO 898-1 Table 3 (proof Sp, Rp0.2, Rm)",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "iso-898-1-10.9",
    name: "ISO 898-1 property class 10.9",
    modulusMpa: 205_000,
    ranges: [isoRange(72, 830, 940, 1040)],
    allowableSource: null,
    source: "ISO 898-1 Table 3",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "iso-898-1-12.9",
    name: "ISO 898-1 property class 12.9",
    modulusMpa: 205_000,
    ranges: [isoRange(72, 970, 1100, 1220)],
    allowableSource: null,
    source: "ISO 898-1 Table 3",
    edition: "ISO 898-1:2013 (as reproduced)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b7",
    name: "ASTM A193 grade B7 (Cr-Mo)",
    modulusMpa: 205_000,
    ranges: [astmRange(2.5, 105, 125, 25, "pub2", "pub2"), astmRange(4, 95, 115, null, "mem", null)],
    allowableSource: "ASME BPVC Section II-D Table 3, room temperature",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 and ASME II-D (as reproduced; editions not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b7m",
    name: "ASTM A193 grade B7M (hardness-limited B7)",
    modulusMpa: 205_000,
    ranges: [astmRange(4, 80, 100, 20, "pub2", "pub2")],
    allowableSource: "ASME BPVC Section II-D Table 3, room temperature",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 and ASME II-D (as reproduced; editions not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b16",
    name: "ASTM A193 grade B16 (Cr-Mo-V)",
    modulusMpa: 205_000,
    ranges: [astmRange(2.5, 105, 125, 25, "pub2", "mem")],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A193/A193M",
    edition: "ASTM A193 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
  {
    id: "astm-a193-b8-cl1",
    name: "ASTM A193 grade B8 class 1 (304, solution treated)",
    modulusMpa: 193_000,
    ranges: [astmRange(4, 30, 75, 18.8, "pub2", "mem")],
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
      astmRange(0.75, 100, 125, 25, "pub2", "mem"),
      astmRange(1, 80, 115, 20, "mem", "mem"),
      astmRange(1.25, 65, 105, 16.2, "mem", "mem"),
      astmRange(1.5, 50, 100, 12.5, "mem", "mem"),
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
    ranges: [astmRange(2.5, 105, 125, 25, "pub2", "mem")],
    allowableSource: "ASME BPVC Section II-D (from memory; verify)",
    source: "ASTM A320/A320M",
    edition: "ASTM A320 (as reproduced; edition not verified)",
    confidence: "pub2",
  },
];

export function getBoltMaterialById(id: string): BoltMaterialRow | undefined {
  return BOLT_MATERIALS.find((m) => m.id === id);
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
  return rangeForDiameter(material.ranges, nominalDiameterMm);
}
