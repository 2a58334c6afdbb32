import "server-only";

// The embedded Plex "latin" subsets have no maths or Greek letters; stored text is shown with
// plain stand-ins (the stored result itself is untouched).
const GLYPH_STAND_INS: [RegExp, string][] = [
  [/≥/g, ">="],
  [/≤/g, "<="],
  [/⌀/g, "Ø"],
  [/→/g, "->"],
  [/≈/g, "~"],
  [/√/g, "sqrt"],
  [/π/g, "pi"],
  [/Σ/g, "sum "],
  [/α/g, "alpha"],
  [/β/g, "beta"],
  [/λ/g, "lambda"],
  [/φ/g, "phi"],
  [/[^\u0000-\u00ff\u0131\u0152\u0153\u2000-\u206f\u20ac\u2122\u2212\u2215]/g, "?"],
];
export function plainText(s: string): string {
  return GLYPH_STAND_INS.reduce((acc, [re, to]) => acc.replace(re, to), s);
}
