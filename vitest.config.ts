import path from "node:path";
import { fileURLToPath } from "node:url";

import { defineConfig } from "vitest/config";

const root = path.dirname(fileURLToPath(import.meta.url));

export default defineConfig({
  resolve: {
    alias: [
      // Server modules start with `import "server-only"`; under vitest that guard is a no-op.
      { find: /^server-only$/, replacement: path.join(root, "tests/helpers/empty.ts") },
      { find: /^@\//, replacement: `${root}/` },
    ],
  },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/integration/**/*.test.ts"],
    environment: "node",
    testTimeout: 30_000,
    hookTimeout: 30_000,
    // Files run in parallel (each integration file sets up and cleans up its own data);
    // tests inside one file run in order.
    fileParallelism: true,
    maxWorkers: 2,
    sequence: { concurrent: false },
    env: { TZ: "UTC" },
  },
});
