import { defineConfig } from 'vitest/config';

// Unit tests and the fast validation subset run under `npm test`.
// Long statistical validation runs only with CANDELA_VALIDATE=1 (`npm run validate`).
// `npm test` runs test/bench (speed ratios, one of them across 2 threads) on its own after the
// rest, so that no other test file competes for the cores it measures.
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    maxWorkers: 2,
  },
});
