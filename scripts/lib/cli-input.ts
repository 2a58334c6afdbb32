/**
 * The command lines' shared input handling: print lines to stderr and exit with a code, and read
 * one JSON file checked against a zod schema (a clear line for an unreadable file, bad JSON or
 * each schema error; exit code 1).
 */
import { readFileSync } from "node:fs";
import type { z } from "zod";
import { formatDesignErrors } from "@/features/analysis/schema";

export function fail(lines: string[], code = 1): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

/** `what` names the document in the refusal: "design", "request". */
export function readJsonInput<S extends z.ZodType>(file: string, schema: S, what: string): z.output<S> {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, "utf8"));
  } catch (e) {
    fail([
      `${file}: ${(e as NodeJS.ErrnoException).code ? "cannot read file" : `not valid JSON (${(e as Error).message})`}`,
    ]);
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success)
    fail([`${file}: invalid ${what}`, ...formatDesignErrors(parsed.error).map((l) => `  ${l}`)]);
  return parsed.data;
}
