import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/e2e/globalSetup.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // Two cores: run files in two workers, and keep heavy statistical tests deterministic by seed.
    maxWorkers: 2,
    // The JSON report lets .ci/run print a plain "N passed, N failed" closing line.
    reporters: ['default', 'json'],
    outputFile: { json: 'test-artifacts/vitest-results.json' },
  },
});
