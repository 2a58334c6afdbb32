/**
 * Confidence tags carried by every catalogue row and by every rule the checks apply:
 * - "pub": seen in a published standard, paper or handbook;
 * - "pub2": seen only in a reproduction of one (verify when you can);
 * - "mem": remembered, not confirmed — never a pass/fail oracle in tests;
 * - "calc": arithmetic from tagged inputs;
 * - "practice": rule of thumb with no source (common practice).
 */
export type Confidence = "pub" | "pub2" | "mem" | "calc" | "practice";

/** Provenance fields shared by all catalogue rows. */
export interface Provenance {
  source: string;
  edition: string;
  confidence: Confidence;
}
