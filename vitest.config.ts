import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// One vitest run covers the pure core (fast, no services) and the integration suites that talk
// to the real PostgreSQL and the local fake SMTP server started by scripts/test.sh. Files share
// one database, so they run one after another. Each file still gets a fresh module graph, in a
// worker thread rather than a child process: starting a thread per file costs far less than a
// process (the pure core files: 82 s against 141 s wall at a load of 18; the whole suite under npm test
// 642 s with 159 s outside the tests, against 776 s with 225 s, at loads of 13-18, one run each).
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // `server-only` throws outside React Server Components; under vitest the modules run in
    // plain Node, which is exactly the server side, so the guard is replaced by an empty module.
    alias: { "server-only": fileURLToPath(new URL("./tests/setup/empty-module.ts", import.meta.url)) },
  },
  test: {
    include: ["tests/**/*.test.ts"],
    environment: "node",
    pool: "threads",
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 60_000,
    globalSetup: ["tests/setup/global-setup.ts"],
  },
});
