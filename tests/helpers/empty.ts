// Stands in for the `server-only` package under vitest (see vitest.config.ts).
export {};
