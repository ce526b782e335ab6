import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    setupFiles: ["test/setup/noConsole.ts"],
    // The robustness summary (test/fuzz) is printed after the usual report.
    reporters: ["default", "./test/setup/robustnessReporter.ts"],
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
