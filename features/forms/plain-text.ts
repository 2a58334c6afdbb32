// The one rule for every text field the app accepts (forms, server actions, JSON bodies, CSV cells,
// the design document): no control characters. PostgreSQL refuses NUL in text and jsonb (the
// request would end in a 500), and the other C0/C1 controls are invisible in every screen, sheet
// and export. Single-line fields also refuse line breaks; multi-line fields (comments,
// justifications, descriptions) keep line feed, carriage return and tab.
import { z } from "zod";

/** Text without C0 controls, DEL or C1 controls, and without the Unicode line/paragraph separators. */
export const SINGLE_LINE_TEXT = /^[^\u0000-\u001f\u007f-\u009f\u2028\u2029]*$/;
/** As SINGLE_LINE_TEXT, but tab, line feed and carriage return are allowed. */
export const MULTI_LINE_TEXT = /^[^\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]*$/;

function describeControl(input: unknown, pattern: RegExp): string {
  const text = typeof input === "string" ? input : "";
  const bad = [...text].find((ch) => !pattern.test(ch)) ?? "\u0000";
  const code = `U+${bad.codePointAt(0)!.toString(16).toUpperCase().padStart(4, "0")}`;
  const name = bad === "\u0000" ? " (NUL)" : "";
  return `Remove the control character ${code}${name}: text may not hold control characters.`;
}

/** The shared refinement: a z.string() that refuses control characters, with a field message. */
export function plainText(
  params?: Parameters<typeof z.string>[0],
  options: { multiline?: boolean } = {},
): z.ZodString {
  const pattern = options.multiline ? MULTI_LINE_TEXT : SINGLE_LINE_TEXT;
  return z.string(params).regex(pattern, { error: (issue) => describeControl(issue.input, pattern) });
}

/** plainText for fields that may hold several lines. */
export const multilineText = (params?: Parameters<typeof z.string>[0]) =>
  plainText(params, { multiline: true });
