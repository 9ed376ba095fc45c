// Fault tests: the built app against a throwaway PostgreSQL cluster (tests/faults/harness.ts).
// Run by scripts/test.mjs right after it builds the app (GAVELWRIGHT_SERVER_ENTRY names the build);
// alone, `npx vitest run -c vitest.faults.config.ts` builds into .build/faults first.
import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    environment: "node",
    include: ["tests/faults/**/*.test.ts"],
    fileParallelism: false,
    testTimeout: 120_000,
    hookTimeout: 300_000,
  },
});
