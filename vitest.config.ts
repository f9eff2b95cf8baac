import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const alias = {
  "@": fileURLToPath(new URL("./", import.meta.url)),
  // Tests run the server modules directly; the marker only guards the browser bundle.
  "server-only": fileURLToPath(new URL("./node_modules/server-only/empty.js", import.meta.url)),
};

export default defineConfig({
  resolve: { alias },
  test: {
    environment: "node",
    // Two cores: at most two forks, each integration file on its own SQLite file.
    pool: "forks",
    maxWorkers: 2,
    testTimeout: 20_000,
    hookTimeout: 240_000,
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: [
            "tests/stats/**/*.test.ts",
            "tests/unit/**/*.test.ts",
            "tests/integration/**/*.test.ts",
            "lib/**/*.test.ts",
          ],
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/e2e/global-setup.ts"],
          fileParallelism: false,
          testTimeout: 60_000,
        },
      },
    ],
  },
});
