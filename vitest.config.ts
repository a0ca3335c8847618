import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";
import os from "node:os";
import path from "node:path";

// Kept apart from vite.config.ts so the React Router plugin is not loaded in tests.
const alias = { "~": fileURLToPath(new URL("./app", import.meta.url)) };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Property tests run thousands of cases: vitest's 5 s default fails them on a loaded machine
        // without saying anything about the code, so the guard is a hang detector only.
        test: { name: "unit", include: ["tests/optimizer/**/*.test.ts", "tests/unit/**/*.test.ts"], environment: "node", testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          // One MariaDB database is shared by the integration files: run them one at a time.
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
          globalSetup: ["tests/integration/global-setup.ts"],
          // attachments go to a folder of the run's own, never the demo's data folder
          env: { DB_NAME: process.env.TEST_DB_NAME ?? "sparwise_test", SPARWISE_ATTACHMENTS_DIR: path.join(os.tmpdir(), `sparwise-attachments-${process.env.TEST_DB_NAME ?? "sparwise_test"}`) },
        },
      },
      {
        resolve: { alias },
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
          globalSetup: ["tests/e2e/global-setup.ts"],
        },
      },
    ],
  },
});
