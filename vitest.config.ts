import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

export default defineConfig({
  resolve: {
    alias: { "@": fileURLToPath(new URL("./", import.meta.url)) },
  },
  test: {
    environment: "node",
    include: ["tests/**/*.test.ts", "lib/**/*.test.ts"],
    // Integration tests each open their own SQLite file; two cores, so keep forks few.
    pool: "forks",
    maxWorkers: 2,
    testTimeout: 20000,
    hookTimeout: 60000,
  },
});
