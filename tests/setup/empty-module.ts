// Stands in for the `server-only` guard under vitest (see vitest.config.ts).
export {};
