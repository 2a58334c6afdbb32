import { describe, expect, it } from "vitest";
import { FIELD_SPECS, parseNumberField } from "@/features/editor/model/field-specs";
import { formatQuantity, fromDisplay, toDisplay } from "@/features/editor/model/quantities";

describe("number fields", () => {
  it("refuses empty, non-numeric, negative and absurdly large values with a message naming the field", () => {
    const spec = FIELD_SPECS.boltLength;
    expect(parseNumberField(spec, "", "SI")).toEqual({ ok: false, message: "Bolt length is required." });
    expect(parseNumberField(spec, "abc", "SI")).toEqual({
      ok: false,
      message: "Bolt length must be a number.",
    });
    expect(parseNumberField(spec, "12abc", "SI").ok).toBe(false);
    expect(parseNumberField(spec, "-5", "SI")).toEqual({
      ok: false,
      message:
        "Bolt length must be at least 1 mm (a bolt is longer than 1 mm; studs over 5 m do not occur in flanged joints [practice]).",
    });
    expect(parseNumberField(spec, "1e9", "SI")).toEqual({
      ok: false,
      message:
        "Bolt length must be at most 5000 mm (a bolt is longer than 1 mm; studs over 5 m do not occur in flanged joints [practice]).",
    });
    expect(parseNumberField(spec, "Infinity", "SI").ok).toBe(false);
  });

  it("converts from display units, decimal comma accepted", () => {
    expect(parseNumberField(FIELD_SPECS.boltLength, "4,5", "US")).toEqual({ ok: true, value: 4.5 * 25.4 });
    const p = parseNumberField(FIELD_SPECS.designPressure, "150", "US");
    expect(p.ok && p.value).toBeCloseTo(1.0342, 4);
    const t = parseNumberField(FIELD_SPECS.designTemperature, "212", "US");
    expect(t.ok && t.value).toBeCloseTo(100, 9);
    expect(parseNumberField(FIELD_SPECS.designTemperature, "-500", "US").ok).toBe(false);
  });

  it("takes whole bolt counts only", () => {
    expect(parseNumberField(FIELD_SPECS.boltCount, "16", "US")).toEqual({ ok: true, value: 16 });
    expect(parseNumberField(FIELD_SPECS.boltCount, "16.5", "SI").ok).toBe(false);
    expect(parseNumberField(FIELD_SPECS.boltCount, "0", "SI").ok).toBe(false);
  });

  it("round-trips every quantity through display units", () => {
    for (const q of ["length", "stress", "force", "moment", "temperature"] as const) {
      expect(fromDisplay(q, toDisplay(q, 123.456, "US"), "US")).toBeCloseTo(123.456, 9);
    }
    expect(formatQuantity("length", 25.4, "US")).toBe("1 in");
    expect(formatQuantity("torque", 284_700, "SI")).toBe("284.7 N·m");
  });
});
