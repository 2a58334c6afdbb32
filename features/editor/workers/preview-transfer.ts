/**
 * The drag preview's arrays between the core worker and the page: packed into typed arrays in
 * the worker and transferred (no copy), unpacked into the plain arrays of `JointPreview` on the
 * page. Lossless: the preview's number arrays hold finite doubles or null (the JSON form), so
 * null travels as NaN and comes back as null; the gasket flags travel as 0/1 bytes.
 *
 * Example: `unpackPreview(packPreview(p).packed)` deep-equals `p`.
 */
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointPreview } from "@/features/analysis/core/preview";

const NUMBER_KEYS = ["sMm", "xMm", "yMm", "stressMpa", "coneMpa", "beamMpa"] as const;
type NumberKey = (typeof NUMBER_KEYS)[number];

export type PackedPreview = Omit<JointPreview, "profile" | "boltSOnPathMm" | "seating"> & {
  profile: Record<NumberKey, Float64Array> & { onGasket: Uint8Array };
  boltSOnPathMm: Float64Array;
};

function packNumbers(a: number[]): Float64Array {
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i] === null ? NaN : a[i];
  return out;
}

function unpackNumbers(a: Float64Array): number[] {
  const out = new Array<number>(a.length);
  for (let i = 0; i < a.length; i++) {
    const v = a[i];
    // null where the JSON result holds it: the type stays number[] as in JointPreview.
    out[i] = Number.isNaN(v) ? (null as unknown as number) : v;
  }
  return out;
}

/** The packed preview and the buffers to transfer with it. */
export function packPreview(p: JointPreview): { packed: PackedPreview; transfer: ArrayBuffer[] } {
  const { seating: _seating, profile, boltSOnPathMm, ...rest } = p;
  const onGasket = new Uint8Array(profile.onGasket.length);
  for (let i = 0; i < onGasket.length; i++) onGasket[i] = profile.onGasket[i] ? 1 : 0;
  const numbers = Object.fromEntries(NUMBER_KEYS.map((k) => [k, packNumbers(profile[k])])) as Record<
    NumberKey,
    Float64Array
  >;
  const packed: PackedPreview = {
    ...rest,
    profile: { ...numbers, onGasket },
    boltSOnPathMm: packNumbers(boltSOnPathMm),
  };
  const transfer = [
    ...NUMBER_KEYS.map((k) => numbers[k].buffer),
    onGasket.buffer,
    packed.boltSOnPathMm.buffer,
  ];
  return { packed, transfer: transfer as ArrayBuffer[] };
}

export function unpackPreview(p: PackedPreview): JointPreview {
  const { profile, boltSOnPathMm, ...rest } = p;
  const onGasket = new Array<boolean>(profile.onGasket.length);
  for (let i = 0; i < onGasket.length; i++) onGasket[i] = profile.onGasket[i] === 1;
  const numbers = Object.fromEntries(NUMBER_KEYS.map((k) => [k, unpackNumbers(profile[k])])) as Record<
    NumberKey,
    number[]
  >;
  return {
    ...rest,
    profile: { ...numbers, onGasket },
    boltSOnPathMm: unpackNumbers(boltSOnPathMm),
    seating: rest.gasket[0],
  };
}

/** A full result whose profile arrays are packed like the preview's (`packFull`). */
export type PackedFull = Omit<JointAnalysis, "gasketStress"> & {
  gasketStress: Omit<JointAnalysis["gasketStress"], "profile" | "boltSOnPathMm"> & {
    profile: PackedPreview["profile"];
    boltSOnPathMm: Float64Array;
  };
};

/**
 * The full result with its profile arrays packed (the bulk of its size), and the buffers to
 * transfer: the page then decodes typed arrays instead of tens of thousands of cloned numbers,
 * which left the page's collector a large heap to sweep after every release. Every key keeps its
 * place, so `unpackFull(packFull(r).packed)` gives the same JSON text as `r`.
 */
export function packFull(r: JointAnalysis): { packed: PackedFull; transfer: ArrayBuffer[] } {
  const gs = r.gasketStress;
  const onGasket = new Uint8Array(gs.profile.onGasket.length);
  for (let i = 0; i < onGasket.length; i++) onGasket[i] = gs.profile.onGasket[i] ? 1 : 0;
  const numbers = Object.fromEntries(NUMBER_KEYS.map((k) => [k, packNumbers(gs.profile[k])])) as Record<
    NumberKey,
    Float64Array
  >;
  const bolts = packNumbers(gs.boltSOnPathMm);
  const packed: PackedFull = {
    ...r,
    gasketStress: { ...gs, boltSOnPathMm: bolts, profile: { ...gs.profile, ...numbers, onGasket } },
  };
  const transfer = [...NUMBER_KEYS.map((k) => numbers[k].buffer), onGasket.buffer, bolts.buffer];
  return { packed, transfer: transfer as ArrayBuffer[] };
}

export function unpackFull(p: PackedFull): JointAnalysis {
  const gs = p.gasketStress;
  const onGasket = new Array<boolean>(gs.profile.onGasket.length);
  for (let i = 0; i < onGasket.length; i++) onGasket[i] = gs.profile.onGasket[i] === 1;
  const numbers = Object.fromEntries(NUMBER_KEYS.map((k) => [k, unpackNumbers(gs.profile[k])])) as Record<
    NumberKey,
    number[]
  >;
  return {
    ...p,
    gasketStress: {
      ...gs,
      boltSOnPathMm: unpackNumbers(gs.boltSOnPathMm),
      profile: { ...gs.profile, ...numbers, onGasket },
    },
  };
}
