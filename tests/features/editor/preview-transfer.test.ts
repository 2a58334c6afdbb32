import { describe, expect, it } from "vitest";
import { previewJoint } from "@/features/analysis/core/preview";
import { moveBolt } from "@/features/editor/model/move-bolt";
import { packFull, packPreview, unpackFull, unpackPreview } from "@/features/editor/workers/preview-transfer";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { makeCircle, makeCover } from "./fixtures";

// The drag preview crosses from the core worker to the page as typed arrays (transferred, not
// copied). What arrives must be the preview the core computed, every double the same bits.
const sameBits = (a: unknown, b: unknown, at = "preview"): string | null => {
  if (typeof a === "number" && typeof b === "number") return Object.is(a, b) ? null : `${at}: ${a} ≠ ${b}`;
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object")
    return a === b ? null : `${at}: ${String(a)} ≠ ${String(b)}`;
  // The same keys (their order is not part of the value).
  const ka = Object.keys(a).sort(),
    kb = Object.keys(b).sort();
  if (ka.join() !== kb.join()) return `${at}: keys ${ka.join()} ≠ ${kb.join()}`;
  for (const k of ka) {
    const d = sameBits((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${at}.${k}`);
    if (d) return d;
  }
  return null;
};

describe("packPreview / unpackPreview (core worker → page)", () => {
  it("round-trips a dragged circular flange's preview bit for bit, arrays as plain arrays", () => {
    const d = makeCircle(12);
    const p = previewJoint(moveBolt(d, "b3", { sMm: d.bolts[2].sMm + 17.5 }));
    const { packed, transfer } = packPreview(p);
    expect(packed.profile.stressMpa).toBeInstanceOf(Float64Array);
    // Every array travels as a buffer of its own: six profiles, the gasket flags, the bolt positions.
    expect(transfer).toHaveLength(8);
    const back = unpackPreview(structuredClone(packed, { transfer }));
    expect(sameBits(back, p)).toBeNull();
    expect(Array.isArray(back.profile.sMm)).toBe(true);
    expect(back.seating).toBe(back.gasket[0]);
  });

  it("keeps null (a non-finite value in the JSON form) and the off-gasket flags", () => {
    const p = previewJoint(makeCover());
    const withNull = {
      ...p,
      profile: { ...p.profile, beamMpa: [null as unknown as number, ...p.profile.beamMpa.slice(1)] },
    };
    const back = unpackPreview(packPreview(withNull).packed);
    expect(back.profile.beamMpa[0]).toBeNull();
    expect(sameBits(back, withNull)).toBeNull();
    expect(back.profile.onGasket).toEqual(p.profile.onGasket);
  });
});

describe("packFull / unpackFull (core worker → page, the release's result)", () => {
  it("gives back the same JSON text as analyzeJoint's result, the arrays transferred", () => {
    const d = makeCircle(12);
    const r = analyzeJoint(moveBolt(d, "b5", { sMm: d.bolts[4].sMm - 11.25 }));
    const { packed, transfer } = packFull(r);
    expect(packed.gasketStress.profile.sMm).toBeInstanceOf(Float64Array);
    expect(transfer).toHaveLength(8);
    const back = unpackFull(structuredClone(packed, { transfer }));
    expect(JSON.stringify(back)).toBe(JSON.stringify(r));
    expect(sameBits(back, r)).toBeNull();
  });
});
