// Browser tests: playwright-core driving Debian's Chromium against a running app
// (started by scripts/test.mjs, or any instance named by GAVELWRIGHT_TEST_URL).
import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    environment: "node",
    include: ["tests/browser/**/*.test.ts"],
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 90_000,
    // expect.poll waits on what the page shows; vitest's default (1 s) is shorter than a busy CI
    // machine may take to answer, so polls wait as long as `visible` does (tests/browser/browser.ts).
    expect: { poll: { timeout: 15_000, interval: 100 } },
  },
});
