// The cautions of the trade, shown on every screen with results and on every exported sheet.
// One list, so the screens and the PDF can never drift apart.
export const CAUTIONS: readonly string[] = [
  "Results are engineering estimates, not a design code calculation.",
  "Design the joint to the governing code (ASME VIII, EN 1591-1, local regulations).",
  "Generic gasket factors are design values, not assembly targets; the gasket manufacturer's data supersede them.",
  "Torque controls preload only indirectly; the scatter of the tightening method is part of the result.",
  "Flange and cover design rules are code-specific (the flange checks here follow ASME VIII-1 Appendix 2 and UG-34); a competent engineer signs the flange design off.",
  "Pressure-boundary joints must be reviewed and approved by a competent, where required licensed, engineer.",
];
