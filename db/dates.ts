// One ISO-8601 text for every timestamp a query hands out (DTOs, CSV, mail): pg returns
// timestamptz as a Date, raw SQL and JSON may give a string.

/** "2026-12-02T05:30:00.000Z" */
export function isoString(value: Date | string): string {
  return (value instanceof Date ? value : new Date(value)).toISOString();
}

/** isoString, with null and undefined kept as null (optional timestamps). */
export function isoOrNull(value: Date | string | null | undefined): string | null {
  return value === null || value === undefined ? null : isoString(value);
}
